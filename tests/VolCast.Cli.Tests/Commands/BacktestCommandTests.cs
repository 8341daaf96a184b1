using VolCast.Cli.Tests.Support;
using VolCast.Core.Data;
using VolCast.Core.Demo;

namespace VolCast.Cli.Tests.Commands;

public sealed class BacktestCommandTests : IDisposable
{
    private readonly TempFolder _temp = new("bt");
    private readonly string _prices;
    private readonly string _implied;

    public BacktestCommandTests()
    {
        // Invented demo data (3 years), not reference data.
        var scenario = new DemoScenarioGenerator(5, years: 3).Generate();
        _prices = CsvFiles.WriteBars(_temp.Combine("index.csv"), scenario.Index);
        _implied = CsvFiles.WriteImplied(_temp.Combine("implied.csv"), scenario.Implied);
    }

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void Backtest_ExistingFolder_RefusedWithoutForceAndOnlyOwnFilesReplacedWithIt()
    {
        var output = _temp.Combine("existing");
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
        var output = _temp.Combine("noimplied");
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
        var result = CliRunner.Run("backtest", "--prices", _prices, "--horizon", "2000", "--out", _temp.Combine("x"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("2000 trading days", result.Stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(_temp.Combine("x")));
    }

    [Fact]
    public void Backtest_EventsFileWithUnparseableDate_Exit3NamingFileLineAndColumnAndWritesNothing()
    {
        var events = _temp.Combine("events.csv");
        File.WriteAllText(events, "date,kind\n2021-03-17,central-bank\nMarch 18,earnings\n");
        var result = CliRunner.Run("backtest", "--prices", _prices, "--events", events, "--out", _temp.Combine("x"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("events.csv", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("line 3", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("date", result.Stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(_temp.Combine("x")));
    }

    [Fact]
    public void Backtest_EventsFile_WritesGroupsCsvWithEventRowsAndListsTheEventsInTheReport()
    {
        var events = _temp.Combine("events.csv");
        File.WriteAllText(events, "date,kind,scheduled\n2006-03-15,central-bank,yes\n2006-06-14,central-bank,yes\n2007-02-27,selloff,no\n");
        var output = _temp.Combine("ev");
        var result = CliRunner.Run("backtest", "--prices", _prices, "--implied", _implied, "--iv-unit", "decimal", "--events", events, "--out", output,
            "--config", WriteConfig("ev.json", "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\", \"close-to-close:21\"] }"));
        Assert.True(result.ExitCode == 0, result.Stderr);
        var groups = File.ReadAllLines(Path.Combine(output, "groups.csv"));
        Assert.Equal("grouping,group,forecaster,n,qlike,implied_qlike,dm_qlike_stat,dm_qlike_p", groups[0]);
        Assert.Contains(groups, l => l.StartsWith("year,", StringComparison.Ordinal));
        Assert.Contains(groups, l => l.StartsWith("events,without events,", StringComparison.Ordinal));
        var report = File.ReadAllText(Path.Combine(output, "report.html"));
        Assert.Contains("2007-02-27 selloff, added after the fact", report, StringComparison.Ordinal);
        Assert.Contains("hindsight", report, StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_NoSharedImpliedDates_Exit3()
    {
        var implied = CsvFiles.WriteImplied(_temp.Combine("old.csv"), new ImpliedSeries([new DateOnly(1990, 1, 2), new DateOnly(1990, 1, 3)], [0.2, 0.2]));
        var result = CliRunner.Run("backtest", "--prices", _prices, "--implied", implied, "--iv-unit", "decimal", "--out", _temp.Combine("x"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("No date is shared", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_SelectionWindowLongerThanSample_Exit3()
    {
        var config = WriteConfig("long.json", "{ \"selectionWindowDays\": 5000 }");
        var result = CliRunner.Run("backtest", "--prices", _prices, "--config", config, "--out", _temp.Combine("x"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("selection window of 5000", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_MalformedConfig_Exit3WithLineAndProperty()
    {
        var config = WriteConfig("bad.json", "{\n  \"horizon\": 21,\n  \"mcs\": { \"alpha\": \"high\" }\n}");
        var result = CliRunner.Run("backtest", "--prices", _prices, "--config", config, "--out", _temp.Combine("x"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("line 3", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("mcs.alpha", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_UnknownForecasterInConfig_Exit3ListingValidSpecs()
    {
        var config = WriteConfig("unknown.json", "{ \"forecasters\": [\"garch\", \"crystal-ball:3\"] }");
        var result = CliRunner.Run("backtest", "--prices", _prices, "--config", config, "--out", _temp.Combine("x"));
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

    private string WriteConfig(string name, string json)
    {
        var path = _temp.Combine(name);
        File.WriteAllText(path, json);
        return path;
    }
}
