using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using VolCast.Cli.Tests.Support;
using VolCast.Core.Data;
using VolCast.Core.Demo;

namespace VolCast.Cli.Tests.Commands;

public sealed class BacktestCommandTests : IDisposable
{
    private static readonly string[] RequiredMetricsColumns =
        ["forecaster", "n", "bias", "mae_vol", "rmse_vol", "mse_var", "qlike", "mz_a", "mz_b", "mz_r2", "mz_wald_p",
         "dm_qlike_stat", "dm_qlike_p", "dm_mse_stat", "dm_mse_p", "mcs_p", "in_mcs"];

    private readonly string _folder = Path.Combine(Path.GetTempPath(), $"volcast-bt-{Guid.NewGuid():N}");
    private readonly string _prices;
    private readonly string _implied;

    public BacktestCommandTests()
    {
        Directory.CreateDirectory(_folder);
        // Invented demo data (3 years), not reference data.
        var scenario = new DemoScenarioGenerator(5, years: 3).Generate();
        _prices = WritePrices("index.csv", scenario.Index);
        _implied = WriteImplied("implied.csv", scenario.Implied);
    }

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Fact]
    public void Backtest_DemoFiles_WritesEveryFileWithItsColumns()
    {
        var output = Path.Combine(_folder, "out");
        var result = CliRunner.Run("backtest", "--prices", _prices, "--implied", _implied, "--iv-unit", "decimal", "--out", output);

        Assert.True(result.ExitCode == 0, result.Stderr);
        Assert.Contains("wrote", result.Stdout, StringComparison.Ordinal);
        Assert.Contains("candidate", result.Stdout, StringComparison.Ordinal);

        var forecasts = File.ReadAllLines(Path.Combine(output, "forecasts.csv"));
        var header = forecasts[0].Split(',');
        Assert.Equal(["date", "realized", "implied"], header[..3]);
        Assert.Contains("garch", header);
        Assert.Contains("yang-zhang:21", header);
        Assert.Contains("adaptive:ewma", header);
        Assert.All(forecasts, line => Assert.Equal(header.Length, line.Split(',').Length));
        // The last 21 dates have forecasts but no target: realized is empty there.
        Assert.Equal(string.Empty, forecasts[^1].Split(',')[1]);
        Assert.NotEqual(string.Empty, forecasts[^1].Split(',')[header.ToList().IndexOf("ewma:0.94")]);

        var metricsHeader = File.ReadAllLines(Path.Combine(output, "metrics.csv"))[0].Split(',');
        Assert.Subset(metricsHeader.ToHashSet(), RequiredMetricsColumns.ToHashSet());

        using var metrics = JsonDocument.Parse(File.ReadAllText(Path.Combine(output, "metrics.json")));
        var root = metrics.RootElement;
        Assert.Equal("implied", root.GetProperty("baseline_vs_candidate").GetProperty("baseline").GetString());
        Assert.True(root.GetProperty("sweep").GetProperty("in_sample").GetBoolean());
        Assert.Contains("Not a trading P&L", root.GetProperty("rule_test").GetProperty("caution").GetString(), StringComparison.Ordinal);
        Assert.Equal(JsonValueKind.Array, root.GetProperty("mcs").GetProperty("members").ValueKind);
        Assert.DoesNotContain("NaN", File.ReadAllText(Path.Combine(output, "metrics.json")), StringComparison.Ordinal);

        using var run = JsonDocument.Parse(File.ReadAllText(Path.Combine(output, "run.json")));
        var inputs = run.RootElement.GetProperty("inputs");
        Assert.Equal(Sha256(_prices), inputs[0].GetProperty("sha256").GetString(), StringComparer.OrdinalIgnoreCase);
        Assert.Equal(Sha256(_implied), inputs[1].GetProperty("sha256").GetString(), StringComparer.OrdinalIgnoreCase);
        Assert.Equal(21, run.RootElement.GetProperty("settings").GetProperty("horizon").GetInt32());
        Assert.True(File.Exists(Path.Combine(output, "summary.txt")));
        // The report and its charts are written beside the results, inside the same folder move.
        var html = File.ReadAllText(Path.Combine(output, "report.html"));
        Assert.Contains("ranks first on QLIKE", html, StringComparison.Ordinal);
        foreach (var png in new[] { "forecast-vs-realized.png", "premium.png", "cumulative-qlike.png", "loss-vs-lookback.png", "mincer-zarnowitz.png", "cone.png", "rule-test.png" })
        {
            Assert.Equal([0x89, 0x50, 0x4E, 0x47], File.ReadAllBytes(Path.Combine(output, png))[..4]);
        }

        Assert.Empty(Directory.GetDirectories(_folder, ".out.*"));

        // Do the odds hold? calibration.csv and coverage.csv with their documented columns, the same numbers in metrics.json,
        // the reliability diagram and the section in the report, a block in the summary.
        var calibration = File.ReadAllLines(Path.Combine(output, "calibration.csv"));
        Assert.Equal(
            "forecaster,horizon_days,moneyness,dates_scored,dates_missing,brier,reliability,resolution,uncertainty,within_bin_variance,within_bin_covariance,log_score,log_score_clipped,mean_predicted,observed_frequency,bin,bin_lower,bin_upper,bin_count,bin_effective_count,bin_mean_predicted,bin_observed_frequency,bin_interval_lower,bin_interval_upper",
            calibration[0]);
        Assert.StartsWith("implied,21,0.9,", calibration[1], StringComparison.Ordinal);
        var coverage = File.ReadAllLines(Path.Combine(output, "coverage.csv"));
        var coverageHeader = coverage[0].Split(',');
        Assert.Equal(["forecaster", "horizon_days", "dates_scored", "dates_missing", "z_scale", "max_abs_z", "share_abs_z_above_3", "within1_share", "within1_expected", "within1_status"], coverageHeader[..10]);
        Assert.Equal("verdict", coverageHeader[^1]);
        Assert.Contains("within2_kupiec_p", coverageHeader);
        Assert.Contains("within1_conditional_p", coverageHeader);
        Assert.Equal(header.Length - 2, coverage.Length - 1); // implied and every forecaster (forecasts.csv columns after date and realized), one row each
        Assert.Equal(root.GetProperty("forecasters").GetArrayLength(), root.GetProperty("coverage").GetProperty("forecasters").GetArrayLength());
        Assert.Equal(root.GetProperty("forecasters").GetArrayLength(), root.GetProperty("calibration").GetProperty("forecasters").GetArrayLength());
        var impliedCoverage = root.GetProperty("coverage").GetProperty("forecasters")[0];
        Assert.Equal("implied", impliedCoverage.GetProperty("forecaster").GetString());
        Assert.Equal(coverage[1].Split(',')[7], impliedCoverage.GetProperty("within1").GetProperty("share").GetDouble().ToString("R", CultureInfo.InvariantCulture));
        Assert.Equal([0x89, 0x50, 0x4E, 0x47], File.ReadAllBytes(Path.Combine(output, "reliability.png"))[..4]);
        Assert.Contains("<h2>Do the odds hold?</h2>", html, StringComparison.Ordinal);
        Assert.Contains("Do the odds hold?", File.ReadAllText(Path.Combine(output, "summary.txt")), StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_ExistingFolder_RefusedWithoutForceAndOnlyOwnFilesReplacedWithIt()
    {
        var output = Path.Combine(_folder, "existing");
        string[] args = ["backtest", "--prices", _prices, "--out", output, "--config", WriteConfig("fast.json", "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\", \"close-to-close:21\"] }")];
        Assert.Equal(0, CliRunner.Run(args).ExitCode);
        File.WriteAllText(Path.Combine(output, "notes.txt"), "mine");
        File.WriteAllText(Path.Combine(output, "metrics.csv"), "old");
        File.WriteAllText(Path.Combine(output, "report.html"), "old");
        File.WriteAllText(Path.Combine(output, "calibration.csv"), "old");
        File.WriteAllText(Path.Combine(output, "coverage.csv"), "old");

        var refused = CliRunner.Run(args);
        Assert.Equal(2, refused.ExitCode);
        Assert.Contains("already exists", refused.Stderr, StringComparison.Ordinal);
        Assert.Equal("old", File.ReadAllText(Path.Combine(output, "metrics.csv")));

        var forced = CliRunner.Run([.. args, "--force"]);
        Assert.True(forced.ExitCode == 0, forced.Stderr);
        Assert.Equal("mine", File.ReadAllText(Path.Combine(output, "notes.txt")));
        Assert.StartsWith("forecaster,", File.ReadAllText(Path.Combine(output, "metrics.csv")), StringComparison.Ordinal);
        Assert.StartsWith("<!DOCTYPE html>", File.ReadAllText(Path.Combine(output, "report.html")), StringComparison.Ordinal);
        Assert.StartsWith("forecaster,", File.ReadAllText(Path.Combine(output, "calibration.csv")), StringComparison.Ordinal);
        Assert.StartsWith("forecaster,", File.ReadAllText(Path.Combine(output, "coverage.csv")), StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_WithoutImplied_RanksForecastersAndLeavesImpliedEmpty()
    {
        var output = Path.Combine(_folder, "noimplied");
        var result = CliRunner.Run("backtest", "--prices", _prices, "--tenor", "30d", "--out", output,
            "--config", WriteConfig("c.json", "{ \"sweepLookbacks\": [10, 21], \"ewmaLambdas\": [0.94, 0.97], \"selectionWindowDays\": 252 }"));
        Assert.True(result.ExitCode == 0, result.Stderr);
        var lines = File.ReadAllLines(Path.Combine(output, "forecasts.csv"));
        Assert.All(lines.Skip(1), line => Assert.Equal(string.Empty, line.Split(',')[2]));
        // Redirected output: plain progress lines, no carriage returns.
        Assert.Contains("forecasting:", result.Stdout, StringComparison.Ordinal);
        Assert.DoesNotContain("\r", result.Stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_HorizonLongerThanData_Exit3NamingTheNumbers()
    {
        // Three years of data is about 756 trading days; 2000 is inside the horizon's range but longer than the data.
        var result = CliRunner.Run("backtest", "--prices", _prices, "--horizon", "2000", "--out", Path.Combine(_folder, "x"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("2000 trading days", result.Stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(Path.Combine(_folder, "x")));
    }

    [Fact]
    public void Backtest_NoSharedImpliedDates_Exit3()
    {
        var implied = WriteImplied("old.csv", new ImpliedSeries([new DateOnly(1990, 1, 2), new DateOnly(1990, 1, 3)], [0.2, 0.2]));
        var result = CliRunner.Run("backtest", "--prices", _prices, "--implied", implied, "--iv-unit", "decimal", "--out", Path.Combine(_folder, "x"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("No date is shared", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_SelectionWindowLongerThanSample_Exit3()
    {
        var config = WriteConfig("long.json", "{ \"selectionWindowDays\": 5000 }");
        var result = CliRunner.Run("backtest", "--prices", _prices, "--config", config, "--out", Path.Combine(_folder, "x"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("selection window of 5000", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_MalformedConfig_Exit3WithLineAndProperty()
    {
        var config = WriteConfig("bad.json", "{\n  \"horizon\": 21,\n  \"mcs\": { \"alpha\": \"high\" }\n}");
        var result = CliRunner.Run("backtest", "--prices", _prices, "--config", config, "--out", Path.Combine(_folder, "x"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("line 3", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("mcs.alpha", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_UnknownForecasterInConfig_Exit3ListingValidSpecs()
    {
        var config = WriteConfig("unknown.json", "{ \"forecasters\": [\"garch\", \"crystal-ball:3\"] }");
        var result = CliRunner.Run("backtest", "--prices", _prices, "--config", config, "--out", Path.Combine(_folder, "x"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("crystal-ball", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("Valid forecasters", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_HorizonAndTenorTogether_Exit2()
    {
        var result = CliRunner.Run("backtest", "--prices", _prices, "--horizon", "21", "--tenor", "30d");
        Assert.Equal(2, result.ExitCode);
    }

    private static string Sha256(string path) => Convert.ToHexStringLower(SHA256.HashData(File.ReadAllBytes(path)));

    private string WriteConfig(string name, string json)
    {
        var path = Path.Combine(_folder, name);
        File.WriteAllText(path, json);
        return path;
    }

    private string WritePrices(string name, PriceHistory prices)
    {
        var sb = new StringBuilder("date,open,high,low,close\n");
        for (var i = 0; i < prices.Count; i++)
        {
            sb.Append(CultureInfo.InvariantCulture,
                $"{prices.Dates[i]:yyyy-MM-dd},{prices.Open[i]:R},{prices.High[i]:R},{prices.Low[i]:R},{prices.Close[i]:R}\n");
        }

        var path = Path.Combine(_folder, name);
        File.WriteAllText(path, sb.ToString());
        return path;
    }

    private string WriteImplied(string name, ImpliedSeries implied)
    {
        var sb = new StringBuilder("date,iv\n");
        for (var i = 0; i < implied.Count; i++)
        {
            sb.Append(CultureInfo.InvariantCulture, $"{implied.Dates[i]:yyyy-MM-dd},{implied.Volatility[i]:R}\n");
        }

        var path = Path.Combine(_folder, name);
        File.WriteAllText(path, sb.ToString());
        return path;
    }
}
