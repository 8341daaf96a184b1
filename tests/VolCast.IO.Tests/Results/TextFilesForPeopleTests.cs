using System.Collections.Immutable;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Data;
using VolCast.IO.Csv;
using VolCast.IO.Results;

namespace VolCast.IO.Tests.Results;

/// <summary>The text files are written for people as well as programs: words, not code identifiers; JSON without needless escapes.</summary>
public sealed class TextFilesForPeopleTests : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "volcast-words-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        if (Directory.Exists(_folder))
        {
            Directory.Delete(_folder, recursive: true);
        }
    }

    private void WriteRun()
    {
        // Invented random-walk closes and a flat 12% implied (not reference data), enough for the rule test to fire both ways.
        var n = 400;
        var (dates, prices) = BacktestResultsWriterTests.RandomWalk(seed: 5, days: n);
        var implied = new ImpliedSeries(dates, Enumerable.Repeat(0.12, n).ToArray());
        var settings = new BacktestSettings
        {
            Horizon = BacktestHorizon.Days(5),
            Forecasters = ["close-to-close:10", "ewma:0.94"],
            SweepLookbacks = [5, 10],
            EwmaLambdas = [0.94, 0.97],
            SelectionWindowDays = 100,
            McsReplications = 100,
            RuleForecaster = "ewma:0.94",
            RuleHistorical = "close-to-close:10",
            RuleThreshold = 0.01,
        };
        var result = Backtester.Run(prices, implied, settings);
        var info = new BacktestRunInfo("0.1.0+abc123", [new InputFileInfo("prices", "it's p.csv", "ab12")],
            new DateTimeOffset(2026, 12, 2, 3, 4, 5, TimeSpan.FromHours(1)), new DateTimeOffset(2026, 12, 2, 3, 4, 9, TimeSpan.FromHours(1)), "decimal", []);
        Directory.CreateDirectory(_folder);
        var run = new BacktestRun(result, BacktestCalibrator.Evaluate(result, prices), info, prices, prices.Count);
        var names = BacktestResultsWriter.WriteData(_folder, run);
        BacktestResultsWriter.WriteRunRecord(_folder, run, names);
    }

    [Fact]
    public void Summary_SpeaksInWordsAndVolPoints_AndMarksTheConfidenceSetAsTheReportDoes()
    {
        WriteRun();
        var summary = File.ReadAllText(Path.Combine(_folder, "summary.txt"));

        Assert.DoesNotContain("AllDates", summary, StringComparison.Ordinal);
        Assert.DoesNotContain("SellVolatility", summary, StringComparison.Ordinal);
        Assert.DoesNotContain("BuyVolatility", summary, StringComparison.Ordinal);
        Assert.DoesNotContain("xpected-move", summary, StringComparison.Ordinal);
        Assert.DoesNotContain("RiskMetrics", summary, StringComparison.Ordinal);
        Assert.Contains("more than 1.0 vol points", summary, StringComparison.Ordinal);
        Assert.Contains("all dates", summary, StringComparison.Ordinal);
        Assert.Contains("signalled minus all dates", summary, StringComparison.Ordinal);
        Assert.Contains("Forecast move bands (±1σ, ±2σ)", summary, StringComparison.Ordinal);
        Assert.Contains("✓ = in the", summary, StringComparison.Ordinal);
        Assert.DoesNotContain("p = 0.000", summary, StringComparison.Ordinal);
    }

    [Fact]
    public void JsonFiles_WriteOrdinaryCharactersAsThemselves_AndUtcTimesEndInZ()
    {
        WriteRun();
        foreach (var name in new[] { "run.json", "metrics.json" })
        {
            var text = File.ReadAllText(Path.Combine(_folder, name));
            Assert.DoesNotContain("\\u002B", text, StringComparison.Ordinal);
            Assert.DoesNotContain("\\u0027", text, StringComparison.Ordinal);
            Assert.DoesNotContain("\\u0026", text, StringComparison.Ordinal);
            Assert.DoesNotContain("\\u2264", text, StringComparison.Ordinal);
        }

        var run = File.ReadAllText(Path.Combine(_folder, "run.json"));
        Assert.Contains("\"version\": \"0.1.0+abc123\"", run, StringComparison.Ordinal);
        Assert.Contains("\"path\": \"it's p.csv\"", run, StringComparison.Ordinal);

        // 03:04:05 at UTC+1 is 02:04:05 UTC (ISO 8601: Z marks UTC).
        Assert.Contains("\"started_utc\": \"2026-12-02T02:04:05.0000000Z\"", run, StringComparison.Ordinal);
        Assert.Contains("\"finished_utc\": \"2026-12-02T02:04:09.0000000Z\"", run, StringComparison.Ordinal);
    }

    [Fact]
    public void BatchSummary_HoldsData_AndTheLookbacksGoToTheirOwnLongFile()
    {
        BatchAssetRow[] rows =
        [
            new() { Name = "alpha", Succeeded = true, HasImplied = true, Lookbacks = [new BatchLookback("yang-zhang", "yang-zhang:21", 0.8, 12), new BatchLookback("ewma", "ewma:0.97", 0.5, 3)] },
            new() { Name = "beta", Succeeded = true, HasImplied = false },
        ];
        using var summary = new StringWriter();
        BatchSummaryCsv.Write(summary, rows);
        using var lookbacks = new StringWriter();
        BatchLookbacksCsv.Write(lookbacks, rows);

        var lines = summary.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries);
        var implied = Array.IndexOf(lines[0].Split(','), "implied");
        Assert.Equal(["yes", "no"], lines.Skip(1).Select(l => l.Split(',')[implied]));
        Assert.DoesNotContain("lookbacks", lines[0], StringComparison.Ordinal);
        Assert.Equal(
            "asset,family,most_chosen,share_of_dates,changes\nalpha,yang-zhang,yang-zhang:21,0.8,12\nalpha,ewma,ewma:0.97,0.5,3\n",
            lookbacks.ToString());
    }
}
