using System.Globalization;
using VolCast.Cli.Tests.Support;
using VolCast.Core.Demo;

namespace VolCast.Cli.Tests.Commands;

/// <summary>The user's own forecasts (--forecasts): scored like a built-in forecaster, and bad files refused with file, line and column.</summary>
public sealed class UserForecastsCommandTests : IDisposable
{
    private readonly TempFolder _temp = new("uf");
    private readonly string _prices;
    private readonly string _implied;

    public UserForecastsCommandTests()
    {
        // Invented demo data (3 years), not reference data.
        var scenario = new DemoScenarioGenerator(7, years: 3).Generate();
        _prices = CsvFiles.WriteBars(_temp.Combine("index.csv"), scenario.Index);
        _implied = CsvFiles.WriteImplied(_temp.Combine("implied.csv"), scenario.Implied);
    }

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void Forecasts_BuiltInColumnFedBack_ReproducesItsMetricsExactly()
    {
        // A run with ewma and har; then the same run with har replaced by its own forecasts.csv column, given as a
        // user forecast. Same values on the same dates must give the same row of metrics.csv, cell for cell.
        var first = _temp.Combine("first");
        var run = CliRunner.Run("backtest", "--prices", _prices, "--implied", _implied, "--iv-unit", "decimal", "--out", first,
            "--config", Config("a.json", "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\", \"har\"], \"candidate\": \"har\" }"));
        Assert.True(run.ExitCode == 0, run.Stderr);
        var forecasts = File.ReadAllLines(Path.Combine(first, "forecasts.csv"));
        var header = forecasts[0].Split(',');
        var har = Array.IndexOf(header, "har");
        var mine = _temp.Combine("mine.csv");
        File.WriteAllLines(mine, ["date,har_again", .. forecasts.Skip(1).Select(l => l.Split(',')).Select(c => c[0] + "," + c[har])]);

        var second = _temp.Combine("second");
        run = CliRunner.Run("backtest", "--prices", _prices, "--implied", _implied, "--iv-unit", "decimal", "--out", second,
            "--forecasts", mine, "--forecasts-unit", "decimal",
            "--config", Config("b.json", "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\", \"user:har_again\"], \"candidate\": \"user:har_again\" }"));
        Assert.True(run.ExitCode == 0, run.Stderr);

        // Every column but the name and the model-fit counts (a user's column is not fitted, so it has no refits).
        var columns = File.ReadLines(Path.Combine(first, "metrics.csv")).First().Split(',');
        var fitCounts = new[] { "refits", "failed_fits", "nonstationary_fits", "variance_fallbacks" };
        var before = Row(first, "har");
        var after = Row(second, "user:har_again");
        for (var c = 1; c < columns.Length; c++)
        {
            if (!fitCounts.Contains(columns[c]))
            {
                Assert.True(before[c] == after[c], $"{columns[c]}: {before[c]} before, {after[c]} after");
            }
        }

        Assert.Equal(Row(first, "implied"), Row(second, "implied"));
        Assert.Equal(Row(first, "ewma:0.94"), Row(second, "ewma:0.94"));
    }

    [Fact]
    public void Forecasts_PercentInferredWithGaps_ScoredOnItsDatesWithTheGapsCounted()
    {
        var dates = PriceDates();
        var mine = _temp.Combine("pct.csv");
        // Every third date left empty (the first and last kept): a gap, scored without the forecaster.
        bool Gap(int i) => i % 3 == 1 && i < dates.Length - 1;
        File.WriteAllLines(mine, ["date,flat", .. dates.Select((d, i) => d + "," + (Gap(i) ? string.Empty : "20"))]);
        var output = _temp.Combine("pct");
        var run = CliRunner.Run("backtest", "--prices", _prices, "--implied", _implied, "--iv-unit", "decimal", "--out", output, "--forecasts", mine,
            "--config", Config("c.json", "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\"] }"));
        Assert.True(run.ExitCode == 0, run.Stderr);
        Assert.Contains("read as percent", run.Stderr, StringComparison.Ordinal);
        var gaps = Enumerable.Range(0, dates.Length).Count(Gap);
        Assert.Contains(string.Create(CultureInfo.InvariantCulture, $"user:flat has no forecast on {gaps} of the {dates.Length} price dates"), run.Stderr, StringComparison.Ordinal);
        var row = Row(output, "user:flat");
        var n = int.Parse(row[2], CultureInfo.InvariantCulture);
        Assert.InRange(n, 1, dates.Length - gaps);
        Assert.Contains("\"forecasts\"", File.ReadAllText(Path.Combine(output, "run.json")), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("date,mine\n1990-01-02,0.2\n1990-01-03,0.2\n", null, "no forecast date")]
    [InlineData("date,mine,Mine\n{0},0.2,0.2\n", "line 1, column 'Mine'", "heads columns 2 and 3")]
    [InlineData("date,garch\n{0},0.2\n", "line 1, column 'garch'", "built-in forecaster")]
    [InlineData("date,yang-zhang:21\n{0},0.2\n", "line 1, column 'yang-zhang:21'", "built-in forecaster")]
    [InlineData("date,implied\n{0},0.2\n", "line 1, column 'implied'", "built-in forecaster")]
    [InlineData("date,mine\n{0},0.2\n{1},-0.2\n", "line 3, column 'mine'", "above 0%")]
    [InlineData("date,mine\n{0},0\n{1},0.2\n", "line 2, column 'mine'", "above 0%")]
    [InlineData("date,mine\n{0},0.2\n{0},0.3\n", "line 3, column 'date'", "appears twice")]
    [InlineData("date,mine\n{0},abc\n", "line 2, column 'mine'", "not a number")]
    public void Forecasts_BadFile_Exit3WithFileLineAndColumn(string content, string? where, string problem)
    {
        var dates = PriceDates();
        var file = _temp.Combine("bad.csv");
        File.WriteAllText(file, string.Format(CultureInfo.InvariantCulture, content, dates[10], dates[11]));
        var run = CliRunner.Run("backtest", "--prices", _prices, "--out", _temp.Combine("x"), "--forecasts", file, "--forecasts-unit", "decimal",
            "--config", Config("d.json", "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\"] }"));
        Assert.Equal(3, run.ExitCode);
        Assert.Contains(file, run.Stderr, StringComparison.Ordinal);
        if (where is not null)
        {
            Assert.Contains(where, run.Stderr, StringComparison.Ordinal);
        }

        Assert.Contains(problem, run.Stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(_temp.Combine("x")));
    }

    [Fact]
    public void Forecasts_UserSpecWithoutTheFile_Exit2NamingTheOption()
    {
        var run = CliRunner.Run("backtest", "--prices", _prices, "--out", _temp.Combine("y"),
            "--config", Config("e.json", "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\", \"user:mine\"] }"));
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("--forecasts", run.Stderr, StringComparison.Ordinal);
    }

    private string[] PriceDates() => [.. File.ReadAllLines(_prices).Skip(1).Select(l => l.Split(',')[0])];

    private string Config(string name, string json)
    {
        var path = _temp.Combine(name);
        File.WriteAllText(path, json);
        return path;
    }

    private static string[] Row(string folder, string forecaster) =>
        File.ReadAllLines(Path.Combine(folder, "metrics.csv")).Select(l => l.Split(',')).Single(c => c[0] == forecaster);
}
