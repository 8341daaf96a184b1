using System.Globalization;
using System.Text.Json;
using VolCast.Core.Backtest;
using VolCast.Core.Data;
using VolCast.IO.Results;

namespace VolCast.IO.Tests.Results;

public sealed class BacktestResultsWriterTests
{
    private static BacktestResult SmallResult()
    {
        // Invented random-walk closes (not reference data), enough for every statistic.
        var random = new Random(3);
        var n = 400;
        var dates = new DateOnly[n];
        var close = new double[n];
        var d = new DateOnly(2020, 1, 1);
        close[0] = 100;
        for (var i = 0; i < n; i++)
        {
            dates[i] = d;
            d = d.AddDays(1);
            if (i > 0)
            {
                close[i] = close[i - 1] * Math.Exp(0.01 * ((2 * random.NextDouble()) - 1));
            }
        }

        var prices = PriceHistory.FromCloses(dates, close);
        var implied = new ImpliedSeries(dates.AsSpan(0, 300), Enumerable.Repeat(0.1, 300).ToArray());
        var settings = new BacktestSettings
        {
            Horizon = BacktestHorizon.Days(5),
            Forecasters = ["close-to-close:10", "ewma:0.94"],
            SweepLookbacks = [5, 10],
            EwmaLambdas = [0.94, 0.97],
            SelectionWindowDays = 100,
            McsReplications = 100,
        };
        return Backtester.Run(prices, implied, settings);
    }

    private static BacktestRunInfo Run() => new("0.1.0-test", [new InputFileInfo("prices", "p.csv", "ab12")], DateTimeOffset.UnixEpoch, DateTimeOffset.UnixEpoch, "decimal", []);

    [Fact]
    public void Write_NewFolder_ForecastsRoundTripAndUndefinedIsEmptyOrNull()
    {
        using var temp = new TempFolder();
        var result = SmallResult();
        var folder = Path.Combine(temp.Path, "report");
        BacktestResultsWriter.Write(folder, result, Run());

        var lines = File.ReadAllLines(Path.Combine(folder, "forecasts.csv"));
        Assert.Equal(result.Dates.Length + 1, lines.Length);
        var header = lines[0].Split(',');
        for (var t = 0; t < result.Dates.Length; t++)
        {
            var cells = lines[t + 1].Split(',');
            Assert.Equal(result.Dates[t].ToString("yyyy-MM-dd", CultureInfo.InvariantCulture), cells[0]);
            // Round-trip doubles: parsing the text gives the same bits.
            Assert.Equal(result.Realized[t], cells[1].Length == 0 ? null : double.Parse(cells[1], CultureInfo.InvariantCulture));
            Assert.Equal(result.Implied[t], cells[2].Length == 0 ? null : double.Parse(cells[2], CultureInfo.InvariantCulture));
            for (var k = 0; k < result.Forecasts.Length; k++)
            {
                Assert.Equal(result.Forecasts[k].Spec, header[k + 3]);
                Assert.Equal(result.Forecasts[k].Values[t], cells[k + 3].Length == 0 ? null : double.Parse(cells[k + 3], CultureInfo.InvariantCulture));
            }
        }

        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "metrics.json")));
        var rows = json.RootElement.GetProperty("forecasters");
        Assert.Equal(result.Metrics.Length, rows.GetArrayLength());
        Assert.Equal(JsonValueKind.Null, rows[0].GetProperty("dm_qlike_stat").ValueKind); // implied vs itself: null, not NaN
        Assert.Equal(result.Metrics[1].Losses!.Qlike, rows[1].GetProperty("qlike").GetDouble());
        var metricsCsv = File.ReadAllLines(Path.Combine(folder, "metrics.csv"));
        Assert.Equal(result.Metrics.Length + 1, metricsCsv.Length);
    }

    [Fact]
    public void Write_ExistingFolder_RefusedUnlessForced()
    {
        using var temp = new TempFolder();
        var result = SmallResult();
        var folder = Path.Combine(temp.Path, "report");
        Directory.CreateDirectory(folder);
        File.WriteAllText(Path.Combine(folder, "keep.txt"), "x");
        Assert.Throws<IOException>(() => BacktestResultsWriter.Write(folder, result, Run()));
        Assert.False(File.Exists(Path.Combine(folder, "metrics.json")));
        BacktestResultsWriter.Write(folder, result, Run(), force: true);
        Assert.True(File.Exists(Path.Combine(folder, "metrics.json")));
        Assert.Equal("x", File.ReadAllText(Path.Combine(folder, "keep.txt")));
        Assert.Single(Directory.GetDirectories(temp.Path));
    }
}
