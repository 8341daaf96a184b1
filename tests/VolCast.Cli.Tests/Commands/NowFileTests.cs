using System.Globalization;
using System.Text.Json;
using VolCast.Cli.Tests.Support;
using VolCast.Core.Demo;

namespace VolCast.Cli.Tests.Commands;

/// <summary>now.json, today's reading, recomputed from the run's own forecasts.csv and the price file's closes.</summary>
public sealed class NowFileTests : IDisposable
{
    private const int Horizon = 10;
    private readonly TempFolder _temp = new("now");

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void NowJson_RecomputedFromForecastsCsvAndTheCloses_Agrees()
    {
        // Invented demo data (3 years), not reference data.
        var scenario = new DemoScenarioGenerator(11, years: 3).Generate();
        var prices = CsvFiles.WriteBars(_temp.Combine("index.csv"), scenario.Index);
        var implied = CsvFiles.WriteImplied(_temp.Combine("implied.csv"), scenario.Implied);
        var config = _temp.Combine("c.json");
        File.WriteAllText(config, "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\", \"close-to-close:21\", \"implied-debiased\"], \"candidate\": \"ewma:0.94\", \"ruleHistorical\": \"close-to-close:21\", \"ruleThreshold\": 0.01, \"selectionWindowDays\": 126 }");
        var output = _temp.Combine("out");
        var run = CliRunner.Run("backtest", "--prices", prices, "--implied", implied, "--iv-unit", "decimal", "--horizon", Horizon.ToString(CultureInfo.InvariantCulture), "--config", config, "--out", output);
        Assert.True(run.ExitCode == 0, run.Stderr);

        using var now = JsonDocument.Parse(File.ReadAllText(Path.Combine(output, "now.json")));
        var root = now.RootElement;
        Assert.Contains("not a recommendation", root.GetProperty("note").GetString(), StringComparison.Ordinal);

        var rows = File.ReadAllLines(Path.Combine(output, "forecasts.csv")).Select(l => l.Split(',')).ToArray();
        var header = rows[0];
        var data = rows[1..];
        double? At(string[] row, string column) => row[Array.IndexOf(header, column)] is { Length: > 0 } cell ? double.Parse(cell, CultureInfo.InvariantCulture) : null;
        var last = data[^1];
        Assert.Equal(last[0], root.GetProperty("date").GetString());
        var iv = At(last, "implied")!.Value;
        Assert.Equal(iv, root.GetProperty("implied").GetDouble());

        // Each forecaster: implied minus forecast today, and its mid-rank percentile among earlier dates with both.
        foreach (var f in root.GetProperty("forecasters").EnumerateArray())
        {
            var spec = f.GetProperty("forecaster").GetString()!;
            var today = iv - At(last, spec)!.Value;
            var earlier = data[..^1].Select(r => At(r, "implied") is double i && At(r, spec) is double v ? i - v : (double?)null).OfType<double>().ToArray();
            var percentile = 100.0 * (earlier.Count(g => g < today) + (0.5 * earlier.Count(g => g == today))) / earlier.Length;
            Assert.Equal(At(last, spec)!.Value, f.GetProperty("forecast").GetDouble());
            Assert.Equal(today, f.GetProperty("implied_minus_forecast").GetDouble());
            Assert.Equal(earlier.Length, f.GetProperty("earlier_dates").GetInt32());
            Assert.Equal(percentile, f.GetProperty("percentile").GetDouble(), 1e-9);
        }

        // The last window's realized volatility from the closes, and its place among every window of h returns.
        var closes = File.ReadAllLines(prices).Skip(1).Select(l => double.Parse(l.Split(',')[4], CultureInfo.InvariantCulture)).ToArray();
        var vols = new List<double>();
        for (var end = Horizon; end < closes.Length; end++)
        {
            double sum = 0;
            for (var j = end - Horizon + 1; j <= end; j++)
            {
                var r = Math.Log(closes[j] / closes[j - 1]);
                sum += r * r;
            }

            vols.Add(Math.Sqrt(252.0 / Horizon * sum));
        }

        var current = vols[^1];
        Assert.Equal(current, root.GetProperty("realized_last_window").GetDouble(), current * 1e-10);
        var cone = 100.0 * (vols.Count(v => v < current - (current * 1e-12)) + (0.5 * vols.Count(v => Math.Abs(v - current) <= current * 1e-12))) / vols.Count;
        Assert.Equal(cone, root.GetProperty("cone_percentile").GetDouble(), 1e-9);

        // The rules: proposed is the candidate ewma, historical close-to-close:21, threshold one vol point, sell-only.
        var rules = root.GetProperty("rules").EnumerateArray().ToDictionary(r => r.GetProperty("rule").GetString()!);
        Assert.Equal("sell", rules["always-sell"].GetProperty("signal").GetString());
        foreach (var (rule, spec) in new[] { ("proposed", "ewma:0.94"), ("historical", "close-to-close:21") })
        {
            var gap = iv - At(last, spec)!.Value;
            var expected = gap > 0.01 ? "sell" : "none";
            Assert.Equal(spec, rules[rule].GetProperty("forecaster").GetString());
            Assert.Equal(expected, rules[rule].GetProperty("signal").GetString());
            Assert.Equal((Math.Abs(gap) - 0.01) * 100, rules[rule].GetProperty("margin_vol_points").GetDouble(), 1e-12);
        }

        Assert.Equal("none", rules["current"].GetProperty("signal").GetString());

        // The walk-forward threshold: the proposed forecaster against a threshold of the default sweep (0, 0.5, 1, 2, 3, 4
        // and 5 vol points), chosen from the trades closed by the last date; its signal and margin follow from that threshold.
        var walk = rules["walk-forward threshold"];
        Assert.Equal("ewma:0.94", walk.GetProperty("forecaster").GetString());
        var threshold = walk.GetProperty("threshold_vol_points").GetDouble();
        Assert.Contains(threshold, new[] { 0, 0.5, 1, 2, 3, 4, 5 });
        var walkGap = (iv - At(last, "ewma:0.94")!.Value) * 100;
        Assert.Equal(walkGap > threshold ? "sell" : "none", walk.GetProperty("signal").GetString());
        Assert.Equal(Math.Abs(walkGap) - threshold, walk.GetProperty("margin_vol_points").GetDouble(), 1e-9);
        Assert.Contains("closed by the last date", walk.GetProperty("note").GetString(), StringComparison.Ordinal);
        Assert.Equal(1.0, rules["proposed"].GetProperty("threshold_vol_points").GetDouble(), 12);
        Assert.Contains("Now: today", File.ReadAllText(Path.Combine(output, "report.html")), StringComparison.Ordinal);
    }
}
