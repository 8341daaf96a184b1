using System.Diagnostics;
using System.Globalization;
using System.Text.Json;
using VolCast.Cli.Tests.Support;
using Xunit.Abstractions;

namespace VolCast.Cli.Tests.Reliability;

// Histories that are valid but awkward: gaps and stale stretches are counted warnings in the results;
// a history too short for the settings gets a clear message with the minimum; a 100-year history works.
public sealed class HistoryEdgeTests(ITestOutputHelper output) : IDisposable
{
    private readonly TempFolder _temp = new("history");

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void Backtest_GapsAndStaleStretch_AreCountedWarningsInSummaryAndRunJson()
    {
        // Two gaps of 30 calendar days (rows 100 and 250) and a run of 8 identical closes (rows 400-407).
        double? held = null;
        var prices = ReliabilityFiles.Prices(_temp.Path, "gappy.csv", 700, seed: 5, (i, date, close) =>
        {
            var d = i is 100 or 250 ? date.AddDays(30) : date;
            if (i == 400)
            {
                held = close;
            }

            return (d, i is > 400 and < 408 ? held!.Value : close);
        });
        var folder = _temp.Combine("out");

        var result = CliRunner.Run("backtest", "--prices", prices, "--config", ReliabilityFiles.FastConfig(_temp.Path), "--out", folder);

        Assert.True(result.ExitCode == 0, result.Stderr);
        Assert.Equal(2, Count(result.Stderr, "a gap of "));
        Assert.Equal(1, Count(result.Stderr, "stays at"));
        using var run = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "run.json")));
        var warnings = run.RootElement.GetProperty("input_warnings").EnumerateArray().Select(w => w.GetString()!).ToList();
        Assert.Equal(2, warnings.Count(w => w.Contains("a gap of ", StringComparison.Ordinal)));
        Assert.Single(warnings, w => w.Contains("for 8 rows in a row", StringComparison.Ordinal));
        Assert.All(warnings, w => Assert.Contains("gappy.csv, line ", w, StringComparison.Ordinal));
        var summary = File.ReadAllText(Path.Combine(folder, "summary.txt"));
        Assert.Equal(3, Count(summary, "Input warning:"));
    }

    [Fact]
    public void Backtest_ImpliedUnitNotDeclared_WarningIsRepeatedInRunJson()
    {
        var prices = ReliabilityFiles.Prices(_temp.Path, "prices.csv", 400, seed: 6);
        var implied = ReliabilityFiles.Implied(_temp.Path, "implied.csv", new DateOnly(1990, 1, 1), 400, percent: true);
        var folder = _temp.Combine("out");

        var result = CliRunner.Run("backtest", "--prices", prices, "--implied", implied, "--config", ReliabilityFiles.FastConfig(_temp.Path), "--out", folder);

        Assert.True(result.ExitCode == 0, result.Stderr);
        Assert.Contains("unit was not declared; read as percent", result.Stderr, StringComparison.Ordinal);
        using var run = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "run.json")));
        Assert.Contains(run.RootElement.GetProperty("input_warnings").EnumerateArray(), w => w.GetString()!.Contains("read as percent", StringComparison.Ordinal));
    }

    [Fact]
    public void Backtest_ImpliedInPercentDeclaredDecimal_Exits3NamingTheUnit()
    {
        var prices = ReliabilityFiles.Prices(_temp.Path, "prices.csv", 400, seed: 6);
        var implied = ReliabilityFiles.Implied(_temp.Path, "implied.csv", new DateOnly(1990, 1, 1), 400, percent: true);

        var result = CliRunner.Run("backtest", "--prices", prices, "--implied", implied, "--iv-unit", "decimal", "--out", _temp.Combine("out"));

        Assert.Equal(3, result.ExitCode);
        // The declared unit contradicts the values (median 20, above the 1.5 that separates decimal from percent).
        Assert.Contains("implied.csv: the file was declared decimal", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("median value is 20", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("--iv-unit percent", result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_ImpliedDatesBeforeThePrices_Exits3NamingTheImpliedFile()
    {
        var prices = ReliabilityFiles.Prices(_temp.Path, "prices.csv", 400, seed: 7);
        var implied = ReliabilityFiles.Implied(_temp.Path, "old-implied.csv", new DateOnly(1970, 1, 1), 300);

        var result = CliRunner.Run("backtest", "--prices", prices, "--implied", implied, "--iv-unit", "decimal", "--out", _temp.Combine("out"));

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("old-implied.csv", result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", result.Stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(_temp.Combine("out")));
    }

    [Theory]
    [InlineData(12, "needs at least 21 more price rows")] // 11 returns: shorter than the 21-day horizon
    [InlineData(40, "selection window of 504 trading days is longer than the sample")] // longer than the horizon, shorter than the default selection window
    public void Backtest_VeryShortHistory_Exits3StatingTheMinimum(int rows, string fragment)
    {
        var prices = ReliabilityFiles.Prices(_temp.Path, "short.csv", rows, seed: 9);

        var result = CliRunner.Run("backtest", "--prices", prices, "--out", _temp.Combine("out"));

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("short.csv", result.Stderr, StringComparison.Ordinal);
        Assert.Contains(fragment, result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_OneHundredYearHistory_RunsAndWritesFiniteResults()
    {
        const int Rows = 100 * 252;
        var prices = ReliabilityFiles.Prices(_temp.Path, "century.csv", Rows, seed: 10);
        var folder = _temp.Combine("out");
        GC.Collect();
        var allocatedBefore = GC.GetTotalAllocatedBytes(precise: true);
        var clock = Stopwatch.StartNew();

        var result = CliRunner.Run("backtest", "--prices", prices, "--out", folder);

        clock.Stop();
        using var process = Process.GetCurrentProcess();
        process.Refresh();
        // Measured for the record only (within the memory target of bench/README.md); performance is never asserted.
        output.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"{Rows} rows: {clock.Elapsed.TotalSeconds:F1} s, allocated {(GC.GetTotalAllocatedBytes(precise: true) - allocatedBefore) / 1048576.0:F0} MiB, test-host peak working set {process.PeakWorkingSet64 / 1048576.0:F0} MiB"));
        Assert.True(result.ExitCode == 0, result.Stderr);
        var forecasts = File.ReadAllLines(Path.Combine(folder, "forecasts.csv"));
        Assert.True(forecasts.Length > Rows - 600, $"{forecasts.Length} forecast rows for {Rows} prices");
        Assert.DoesNotContain("NaN", File.ReadAllText(Path.Combine(folder, "metrics.json")), StringComparison.Ordinal);
        Assert.DoesNotContain(forecasts, line => line.Contains("NaN", StringComparison.Ordinal) || line.Contains("Infinity", StringComparison.Ordinal));
    }

    private static int Count(string text, string fragment)
    {
        var count = 0;
        for (var at = text.IndexOf(fragment, StringComparison.Ordinal); at >= 0; at = text.IndexOf(fragment, at + 1, StringComparison.Ordinal))
        {
            count++;
        }

        return count;
    }
}
