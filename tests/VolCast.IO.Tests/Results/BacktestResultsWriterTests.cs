using System.Collections.Immutable;
using System.Globalization;
using System.Text.Json;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Data;
using VolCast.IO.Csv;
using VolCast.IO.Results;

namespace VolCast.IO.Tests.Results;

public sealed class BacktestResultsWriterTests
{
    /// <summary>Invented closes, one a calendar day from 2020-01-01, each a uniform ±1% log step from the last (not reference data).</summary>
    internal static (DateOnly[] Dates, PriceHistory Prices) RandomWalk(int seed, int days)
    {
        var random = new Random(seed);
        var dates = new DateOnly[days];
        var close = new double[days];
        var d = new DateOnly(2020, 1, 1);
        close[0] = 100;
        for (var i = 0; i < days; i++)
        {
            dates[i] = d;
            d = d.AddDays(1);
            if (i > 0)
            {
                close[i] = close[i - 1] * Math.Exp(0.01 * ((2 * random.NextDouble()) - 1));
            }
        }

        return (dates, PriceHistory.FromCloses(dates, close));
    }

    internal static (BacktestResult Result, PriceHistory Prices) SmallRun()
    {
        // Invented random-walk closes (not reference data), enough for every statistic.
        var (dates, prices) = RandomWalk(seed: 3, days: 400);
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
        return (Backtester.Run(prices, implied, settings), prices);
    }

    private static BacktestRunInfo Run() => new("0.1.0-test", [new InputFileInfo("prices", "p.csv", "ab12")], DateTimeOffset.UnixEpoch, DateTimeOffset.UnixEpoch, "decimal", []);

    // Writes a whole results folder as the command line does: the data files, then run.json with the manifest.
    internal static ImmutableArray<string> Write(string folder, BacktestResult result, PriceHistory prices)
    {
        Directory.CreateDirectory(folder);
        var run = new BacktestRun(result, BacktestCalibrator.Evaluate(result, prices), Run(), prices, prices.Count);
        var names = BacktestResultsWriter.WriteData(folder, run);
        return BacktestResultsWriter.WriteRunRecord(folder, run, names);
    }

    [Fact]
    public void WriteData_SeveralFilesAtATime_WritesTheSameFilesAndBytesAsOneAtATime()
    {
        using var temp = new TempFolder();
        var (result, prices) = SmallRun();
        var run = new BacktestRun(result, BacktestCalibrator.Evaluate(result, prices), Run(), prices, prices.Count);
        var one = Directory.CreateDirectory(Path.Combine(temp.Path, "one")).FullName;
        var two = Directory.CreateDirectory(Path.Combine(temp.Path, "two")).FullName;

        var namesOne = BacktestResultsWriter.WriteData(one, run, threads: 1);
        var namesTwo = BacktestResultsWriter.WriteData(two, run, threads: 2);

        Assert.Equal(namesOne, namesTwo);
        Assert.Equal(namesOne.Order(StringComparer.Ordinal), Directory.GetFiles(two).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        foreach (var name in namesOne)
        {
            Assert.Equal(File.ReadAllBytes(Path.Combine(one, name)), File.ReadAllBytes(Path.Combine(two, name)));
        }
    }

    [Fact]
    public void WriteData_AfterForecastsLongWrittenEarly_GivesTheSameFilesNamesAndBytes()
    {
        using var temp = new TempFolder();
        var (result, prices) = SmallRun();
        var run = new BacktestRun(result, BacktestCalibrator.Evaluate(result, prices), Run(), prices, prices.Count);
        var whole = Directory.CreateDirectory(Path.Combine(temp.Path, "whole")).FullName;
        var split = Directory.CreateDirectory(Path.Combine(temp.Path, "split")).FullName;

        var namesWhole = BacktestResultsWriter.WriteData(whole, run, threads: 2);
        var early = BacktestResultsWriter.WriteForecastsLong(split, result);

        // Writing the file again would meet it in the way and throw (the writer never replaces a file).
        var namesSplit = BacktestResultsWriter.WriteData(split, run, 2, [early]);

        Assert.Equal(namesWhole, namesSplit);
        Assert.Contains(early, namesSplit);
        Assert.Equal(namesWhole.Order(StringComparer.Ordinal), Directory.GetFiles(split).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        foreach (var name in namesWhole)
        {
            Assert.Equal(File.ReadAllBytes(Path.Combine(whole, name)), File.ReadAllBytes(Path.Combine(split, name)));
        }
    }

    [Fact]
    public void WriteData_SeveralFilesAtATime_ReportsAFileInTheWayAsAnIOException()
    {
        using var temp = new TempFolder();
        var (result, prices) = SmallRun();
        var run = new BacktestRun(result, BacktestCalibrator.Evaluate(result, prices), Run(), prices, prices.Count);
        File.WriteAllText(Path.Combine(temp.Path, "metrics.csv"), "someone else's file");

        Assert.Throws<IOException>(() => BacktestResultsWriter.WriteData(temp.Path, run, threads: 2));
        Assert.Equal("someone else's file", File.ReadAllText(Path.Combine(temp.Path, "metrics.csv")));
    }

    [Fact]
    public void Write_ForecastsLong_PivotsBackToTheWideFileCellForCell()
    {
        // The tidy form (Wickham 2014, "Tidy data", J. Stat. Softw. 59(10)): one row per observation. Pivoting it back
        // by forecaster, as pandas' pivot or R's reshape would, must give the wide file's every non-empty cell.
        using var temp = new TempFolder();
        var (result, prices) = SmallRun();
        var folder = Path.Combine(temp.Path, "report");
        Write(folder, result, prices);

        var wide = File.ReadAllLines(Path.Combine(folder, "forecasts.csv"));
        var header = wide[0].Split(',');
        var wideCells = new Dictionary<(string Date, string Forecaster), (string Forecast, string Realized, string Implied)>();
        foreach (var line in wide.Skip(1))
        {
            var cells = line.Split(',');
            for (var k = 3; k < header.Length; k++)
            {
                if (cells[k].Length > 0)
                {
                    wideCells[(cells[0], header[k])] = (cells[k], cells[1], cells[2]);
                }
            }
        }

        var tidy = File.ReadAllLines(Path.Combine(folder, "forecasts-long.csv"));
        Assert.Equal("date,forecaster,forecast,realized,implied", tidy[0]);
        Assert.Equal(wideCells.Count, tidy.Length - 1);
        foreach (var line in tidy.Skip(1))
        {
            var cells = line.Split(',');
            Assert.True(wideCells.TryGetValue((cells[0], cells[1]), out var expected), line);
            Assert.Equal(expected, (cells[2], cells[3], cells[4]));
        }
    }

    [Fact]
    public void Write_NewFolder_ForecastsRoundTripAndUndefinedIsEmptyOrNull()
    {
        using var temp = new TempFolder();
        var (result, prices) = SmallRun();
        var folder = Path.Combine(temp.Path, "report");
        Write(folder, result, prices);

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
        // The Diebold-Mariano variance estimator is named for the run and for each test (rectangular unless it fell back).
        Assert.StartsWith("rectangular: autocovariances to lag h-1", json.RootElement.GetProperty("dm_variance_estimator").GetString(), StringComparison.Ordinal);
        var headToHead = json.RootElement.GetProperty("baseline_vs_candidate").GetProperty("comparison").GetProperty("dm_qlike");
        Assert.Equal(result.CandidateVersusBaseline.Qlike!.VarianceEstimator, headToHead.GetProperty("variance_estimator").GetString());
        var metricsCsv = File.ReadAllLines(Path.Combine(folder, "metrics.csv"));
        Assert.Equal(result.Metrics.Length + 1, metricsCsv.Length);
    }

    [Fact]
    public void Write_MetricsCsvAndJson_ForecasterRowsHoldTheSameColumnsInOrderWithTheSameValues()
    {
        using var temp = new TempFolder();
        var (result, prices) = SmallRun();
        var folder = Path.Combine(temp.Path, "report");
        Write(folder, result, prices);

        var csv = File.ReadAllLines(Path.Combine(folder, "metrics.csv"));
        var header = csv[0].Split(',');
        // Every column the file has always had, in its place; the fit counts were once in the CSV only.
        Assert.Equal(
            ["forecaster", "kind", "n", "missing", "bias", "mae_vol", "rmse_vol", "mse_var", "qlike",
             "mz_a", "mz_b", "mz_a_se", "mz_b_se", "mz_r2", "mz_wald", "mz_wald_p",
             "dm_n", "dm_qlike_stat", "dm_qlike_p", "dm_mse_stat", "dm_mse_p", "dm_bartlett_fallback",
             "enc_implied_b", "enc_forecast_c", "enc_forecast_c_se", "enc_forecast_c_p",
             "mcs_p", "in_mcs", "refits", "failed_fits", "nonstationary_fits", "variance_fallbacks"],
            header);
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "metrics.json")));
        var rows = json.RootElement.GetProperty("forecasters");
        Assert.Equal(csv.Length - 1, rows.GetArrayLength());
        for (var i = 0; i < rows.GetArrayLength(); i++)
        {
            var cells = csv[i + 1].Split(',');
            var keys = rows[i].EnumerateObject().ToArray();
            Assert.Equal(header, keys.Select(k => k.Name).ToArray());
            for (var c = 0; c < header.Length; c++)
            {
                var value = keys[c].Value;
                var expected = value.ValueKind switch
                {
                    JsonValueKind.Null => string.Empty,
                    JsonValueKind.String => value.GetString(),
                    JsonValueKind.True => "true",
                    JsonValueKind.False => "false",
                    _ => value.GetDouble().ToString("R", CultureInfo.InvariantCulture),
                };
                Assert.Equal(expected, cells[c]);
            }
        }
    }

    [Fact]
    public void WriteRunRecord_ManifestListsEveryFileOfTheRun_AndReadsBack()
    {
        using var temp = new TempFolder();
        var (result, prices) = SmallRun();
        var folder = Path.Combine(temp.Path, "report");

        var manifest = Write(folder, result, prices);

        // The manifest is exactly what the folder holds, run.json included, in ordinal order.
        Assert.Equal(Directory.GetFiles(folder).Select(Path.GetFileName).Order(StringComparer.Ordinal), manifest);
        // The run has no implied, so the files written only with the rule's P&L and the groups against implied are left out.
        string[] onlyWithRulePnl = [BacktestResultsWriter.TradesFileName, BacktestResultsWriter.RulePnlFileName, BacktestResultsWriter.RulePnlNextDayFileName, GroupsCsv.FileName];
        Assert.Equal(BacktestResultsWriter.FileNames.Except(onlyWithRulePnl).Order(StringComparer.Ordinal), manifest);
        Assert.Equal(manifest, BacktestResultsWriter.ReadManifest(folder));
    }

    [Fact]
    public void WriteData_FileAlreadyInFolder_RefusedAndLeftAlone()
    {
        using var temp = new TempFolder();
        var (result, prices) = SmallRun();
        var folder = Path.Combine(temp.Path, "report");
        Directory.CreateDirectory(folder);
        File.WriteAllText(Path.Combine(folder, "forecasts.csv"), "mine");
        var run = new BacktestRun(result, BacktestCalibrator.Evaluate(result, prices), Run(), prices, prices.Count);

        Assert.Throws<IOException>(() => BacktestResultsWriter.WriteData(folder, run));

        Assert.Equal("mine", File.ReadAllText(Path.Combine(folder, "forecasts.csv")));
    }

    [Fact]
    public void ReadManifest_MissingRunJsonIsEmpty_EarlierVersionWithoutListIsNull()
    {
        using var temp = new TempFolder();
        Assert.Empty(BacktestResultsWriter.ReadManifest(temp.Path)!.Value);
        File.WriteAllText(Path.Combine(temp.Path, "run.json"), "{ \"tool\": \"volcast\", \"version\": \"0.1.0\" }");
        Assert.Null(BacktestResultsWriter.ReadManifest(temp.Path));
        File.WriteAllText(Path.Combine(temp.Path, "run.json"), "{ \"tool\": \"volcast\", \"files\": [\"a.csv\", \"../escape.csv\", \"run.json\"] }");
        Assert.Equal(["a.csv", "run.json"], BacktestResultsWriter.ReadManifest(temp.Path)!.Value.ToArray());
    }

    [Fact]
    public void Write_WithCalibration_WritesBothTablesTheJsonSectionsAndASummaryLine()
    {
        using var temp = new TempFolder();
        var (result, prices) = SmallRun();
        var calibration = BacktestCalibrator.Evaluate(result, prices);
        var folder = Path.Combine(temp.Path, "report");

        var written = Write(folder, result, prices);

        Assert.Contains("calibration.csv", written);
        Assert.Contains("coverage.csv", written);
        var calibrationCsv = File.ReadAllLines(Path.Combine(folder, "calibration.csv"));
        var coverageCsv = File.ReadAllLines(Path.Combine(folder, "coverage.csv"));
        Assert.Equal(CalibrationCsv.Header, calibrationCsv[0]);
        Assert.Equal(CoverageCsv.Header, coverageCsv[0]);

        // One coverage row per forecaster, implied first; 5 strikes x 10 bins calibration rows per forecaster.
        Assert.Equal(result.Forecasts.Length + 2, coverageCsv.Length);
        Assert.StartsWith("implied,", coverageCsv[1], StringComparison.Ordinal);
        Assert.Equal(((result.Forecasts.Length + 1) * 5 * 10) + 1, calibrationCsv.Length);

        // Independent recomputation of implied's |z| <= 1 share from the closes: z = ln(S(t+h)/S(t)) / (iv sqrt(h/252)).
        // Implied is quoted on the first 300 of 400 dates only, so some scorable dates miss it: they are counted, not dropped.
        int within = 0, scored = 0, missing = 0;
        for (var t = 0; t < result.Dates.Length; t++)
        {
            if (result.WindowDays[t] is not int h)
            {
                continue;
            }

            if (result.Implied[t] is not double iv)
            {
                missing++;
                continue;
            }

            var i = prices.Dates.IndexOf(result.Dates[t]);
            var z = Math.Log(prices.Close[i + h] / prices.Close[i]) / (iv * Math.Sqrt(h / 252.0));
            scored++;
            within += Math.Abs(z) <= 1 ? 1 : 0;
        }

        Assert.True(missing > 0, "the test needs dates without implied");
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "metrics.json")));
        var implied = json.RootElement.GetProperty("coverage").GetProperty("forecasters")[0];
        Assert.Equal("implied", implied.GetProperty("forecaster").GetString());
        Assert.Equal(scored, implied.GetProperty("dates_scored").GetInt32());
        Assert.Equal(missing, implied.GetProperty("dates_missing").GetInt32());
        Assert.Equal(missing, implied.GetProperty("missing_dates").GetArrayLength());
        var one = implied.GetProperty("within1");
        Assert.Equal((double)within / scored, one.GetProperty("share").GetDouble(), 12);
        Assert.Equal(0.6826894921370859, one.GetProperty("expected").GetDouble(), 12); // 2N(1) - 1, common practice, no source
        Assert.Equal(calibration.Forecasters[0].Coverage.Levels[0].Kupiec!.PValue, one.GetProperty("kupiec").GetProperty("p_value").GetDouble());
        Assert.True(one.TryGetProperty("christoffersen_conditional_coverage", out _));
        Assert.True(implied.TryGetProperty("max_abs_z", out _));
        Assert.True(implied.TryGetProperty("share_abs_z_above_3", out _));
        var coverageCells = coverageCsv[1].Split(',');
        Assert.Equal(missing.ToString(CultureInfo.InvariantCulture), coverageCells[3]);

        var strikes = json.RootElement.GetProperty("calibration").GetProperty("forecasters")[0].GetProperty("strikes");
        Assert.Equal([0.90, 0.95, 1.00, 1.05, 1.10], strikes.EnumerateArray().Select(s => s.GetProperty("moneyness").GetDouble()));
        foreach (var strike in strikes.EnumerateArray())
        {
            // Murphy (1973) identity with the two within-bin terms, as documented on BrierDecomposition.
            var sum = strike.GetProperty("reliability").GetDouble() - strike.GetProperty("resolution").GetDouble() + strike.GetProperty("uncertainty").GetDouble()
                + strike.GetProperty("within_bin_variance").GetDouble() - strike.GetProperty("within_bin_covariance").GetDouble();
            Assert.Equal(strike.GetProperty("brier").GetDouble(), sum, 12);
            Assert.True(strike.GetProperty("log_score").GetDouble() > 0);
            Assert.Equal(10, strike.GetProperty("bins").GetArrayLength());
        }

        var summary = File.ReadAllText(Path.Combine(folder, "summary.txt"));
        Assert.Contains("Do the odds hold?", summary, StringComparison.Ordinal);
        Assert.Contains("move bands from implied", summary, StringComparison.Ordinal);
    }
}
