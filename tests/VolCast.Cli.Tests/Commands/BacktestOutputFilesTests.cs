using System.Globalization;
using System.Security.Cryptography;
using System.Text.Json;
using VolCast.Cli.Tests.Support;
using VolCast.Core.Demo;

namespace VolCast.Cli.Tests.Commands;

/// <summary>
/// One <c>volcast backtest</c> with implied values on invented demo data, and one test per file it writes, so a
/// failure names the file whose contract broke. The run is shared (<see cref="BacktestRun"/>).
/// </summary>
public sealed class BacktestOutputFilesTests(BacktestOutputFilesTests.BacktestRun run) : IClassFixture<BacktestOutputFilesTests.BacktestRun>
{
    private static readonly string[] RequiredMetricsColumns =
        ["forecaster", "n", "bias", "mae_vol", "rmse_vol", "mse_var", "qlike", "mz_a", "mz_b", "mz_r2", "mz_wald_p",
         "dm_qlike_stat", "dm_qlike_p", "dm_mse_stat", "dm_mse_p", "mcs_p", "in_mcs"];

    [Fact]
    public void Backtest_DemoFiles_ExitsZeroSayingWhatItWroteAndLeavesNoStagingFolder()
    {
        Assert.True(run.ExitCode == 0, run.Stderr);
        Assert.Contains("wrote", run.Stdout, StringComparison.Ordinal);
        Assert.Contains("candidate", run.Stdout, StringComparison.Ordinal);
        Assert.Empty(Directory.GetDirectories(run.Parent, ".out.*"));
    }

    [Fact]
    public void ForecastsCsv_HasDateRealizedImpliedThenEveryForecasterAndNoRealizedOnTheLastDates()
    {
        var forecasts = run.Lines("forecasts.csv");
        var header = forecasts[0].Split(',');
        Assert.Equal(["date", "realized", "implied"], header[..3]);
        Assert.Contains("garch", header);
        Assert.Contains("yang-zhang:21", header);
        Assert.Contains("adaptive:ewma", header);
        Assert.All(forecasts, line => Assert.Equal(header.Length, line.Split(',').Length));
        // The last 21 dates have forecasts but no target: realized is empty there.
        Assert.Equal(string.Empty, forecasts[^1].Split(',')[1]);
        Assert.NotEqual(string.Empty, forecasts[^1].Split(',')[header.ToList().IndexOf("ewma:0.94")]);
    }

    [Fact]
    public void MetricsCsv_HasEveryDocumentedColumn()
    {
        var metricsHeader = run.Lines("metrics.csv")[0].Split(',');
        Assert.Subset(metricsHeader.ToHashSet(), RequiredMetricsColumns.ToHashSet());
    }

    [Fact]
    public void MetricsJson_HasBaselineSweepRuleTestAndMcsSectionsAndNoNaN()
    {
        using var metrics = JsonDocument.Parse(run.Text("metrics.json"));
        var root = metrics.RootElement;
        Assert.Equal("implied", root.GetProperty("baseline_vs_candidate").GetProperty("baseline").GetString());
        Assert.True(root.GetProperty("sweep").GetProperty("in_sample").GetBoolean());
        Assert.Contains("Not a trading P&L", root.GetProperty("rule_test").GetProperty("caution").GetString(), StringComparison.Ordinal);
        Assert.Equal(JsonValueKind.Array, root.GetProperty("mcs").GetProperty("members").ValueKind);
        Assert.DoesNotContain("NaN", run.Text("metrics.json"), StringComparison.Ordinal);
    }

    [Fact]
    public void MetricsJson_HasOneCoverageAndOneCalibrationEntryPerForecaster()
    {
        using var metrics = JsonDocument.Parse(run.Text("metrics.json"));
        var root = metrics.RootElement;
        Assert.Equal(root.GetProperty("forecasters").GetArrayLength(), root.GetProperty("coverage").GetProperty("forecasters").GetArrayLength());
        Assert.Equal(root.GetProperty("forecasters").GetArrayLength(), root.GetProperty("calibration").GetProperty("forecasters").GetArrayLength());
    }

    [Fact]
    public void RunJson_RecordsEachInputsSha256AndTheHorizon()
    {
        using var document = JsonDocument.Parse(run.Text("run.json"));
        var inputs = document.RootElement.GetProperty("inputs");
        Assert.Equal(Sha256(run.Prices), inputs[0].GetProperty("sha256").GetString(), StringComparer.OrdinalIgnoreCase);
        Assert.Equal(Sha256(run.Implied), inputs[1].GetProperty("sha256").GetString(), StringComparer.OrdinalIgnoreCase);
        Assert.Equal(21, document.RootElement.GetProperty("settings").GetProperty("horizon").GetInt32());
    }

    [Fact]
    public void SummaryTxt_IsWrittenWithTheOddsBlock()
    {
        Assert.True(File.Exists(run.File("summary.txt")));
        Assert.Contains("Do the odds hold?", run.Text("summary.txt"), StringComparison.Ordinal);
    }

    [Fact]
    public void CalibrationCsv_HasItsDocumentedColumnsAndImpliedFirst()
    {
        var calibration = run.Lines("calibration.csv");
        Assert.Equal(
            "forecaster,horizon_days,moneyness,dates_scored,dates_missing,brier,reliability,resolution,uncertainty,within_bin_variance,within_bin_covariance,log_score,log_score_clipped,mean_predicted,observed_frequency,bin,bin_lower,bin_upper,bin_count,bin_effective_count,bin_mean_predicted,bin_observed_frequency,bin_interval_lower,bin_interval_upper",
            calibration[0]);
        Assert.StartsWith("implied,21,0.9,", calibration[1], StringComparison.Ordinal);
    }

    [Fact]
    public void CoverageCsv_HasItsDocumentedColumnsAndOneRowPerForecasterWithTheNumbersOfMetricsJson()
    {
        var coverage = run.Lines("coverage.csv");
        var coverageHeader = coverage[0].Split(',');
        Assert.Equal(["forecaster", "horizon_days", "dates_scored", "dates_missing", "z_scale", "max_abs_z", "share_abs_z_above_3", "within1_share", "within1_expected", "within1_status"], coverageHeader[..10]);
        Assert.Equal("verdict", coverageHeader[^1]);
        Assert.Contains("within2_kupiec_p", coverageHeader);
        Assert.Contains("within1_conditional_p", coverageHeader);
        var forecastsHeader = run.Lines("forecasts.csv")[0].Split(',');
        Assert.Equal(forecastsHeader.Length - 2, coverage.Length - 1); // implied and every forecaster (forecasts.csv columns after date and realized), one row each

        using var metrics = JsonDocument.Parse(run.Text("metrics.json"));
        var impliedCoverage = metrics.RootElement.GetProperty("coverage").GetProperty("forecasters")[0];
        Assert.Equal("implied", impliedCoverage.GetProperty("forecaster").GetString());
        Assert.Equal(coverage[1].Split(',')[7], impliedCoverage.GetProperty("within1").GetProperty("share").GetDouble().ToString("R", CultureInfo.InvariantCulture));
    }

    [Fact]
    public void ReportHtml_IsWrittenBesideTheResultsWithTheRankingAndTheOddsSection()
    {
        // The report and its charts are written beside the results, inside the same folder move.
        var html = run.Text("report.html");
        Assert.Contains("ranks first on QLIKE", VolCast.Reports.Html.Glossary.WithoutLinks(html), StringComparison.Ordinal);
        Assert.Contains("<h2>Do the odds hold?</h2>", html, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("forecast-vs-realized.png")]
    [InlineData("premium.png")]
    [InlineData("cumulative-qlike.png")]
    [InlineData("loss-vs-lookback.png")]
    [InlineData("mincer-zarnowitz.png")]
    [InlineData("cone.png")]
    [InlineData("rule-test.png")]
    [InlineData("reliability.png")]
    public void ChartPng_IsWrittenAsAPng(string png)
    {
        // The PNG signature (ISO/IEC 15948, section 5.2) starts 89 50 4E 47.
        Assert.Equal([0x89, 0x50, 0x4E, 0x47], File.ReadAllBytes(run.File(png))[..4]);
    }

    private static string Sha256(string path) => Convert.ToHexStringLower(SHA256.HashData(File.ReadAllBytes(path)));

    /// <summary>Demo inputs (3 years, seed 5: invented data, not reference data) and one backtest of them.</summary>
    public sealed class BacktestRun : IDisposable
    {
        private readonly TempFolder _temp = new("bt-files");

        public BacktestRun()
        {
            var scenario = new DemoScenarioGenerator(5, years: 3).Generate();
            Prices = CsvFiles.WriteBars(_temp.Combine("index.csv"), scenario.Index);
            Implied = CsvFiles.WriteImplied(_temp.Combine("implied.csv"), scenario.Implied);
            Output = _temp.Combine("out");
            var result = CliRunner.Run("backtest", "--prices", Prices, "--implied", Implied, "--iv-unit", "decimal", "--out", Output);
            (ExitCode, Stdout, Stderr) = (result.ExitCode, result.Stdout, result.Stderr);
        }

        public string Parent => _temp.Path;

        public string Prices { get; }

        public string Implied { get; }

        public string Output { get; }

        public int ExitCode { get; }

        public string Stdout { get; }

        public string Stderr { get; }

        public string File(string name) => Path.Combine(Output, name);

        public string Text(string name) => System.IO.File.ReadAllText(File(name));

        public string[] Lines(string name) => System.IO.File.ReadAllLines(File(name));

        public void Dispose() => _temp.Dispose();
    }
}
