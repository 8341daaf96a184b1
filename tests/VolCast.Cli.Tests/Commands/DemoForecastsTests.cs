using System.Globalization;
using VolCast.Cli.Commands;
using VolCast.Cli.Tests.Support;
using VolCast.Core.Demo;

namespace VolCast.Cli.Tests.Commands;

/// <summary>
/// <c>demo --forecasts</c>: the user's own forecasts scored beside the demo's forecasters, on a small demo data folder
/// (an invented 3-year scenario with a short configuration, so the run is quick), not reference data.
/// </summary>
public sealed class DemoForecastsTests : IDisposable
{
    private readonly TempFolder _temp = new("demofc");
    private readonly string _data;
    private readonly DemoScenario _scenario = new DemoScenarioGenerator(7, years: 3).Generate();

    public DemoForecastsTests()
    {
        _data = Directory.CreateDirectory(_temp.Combine("data")).FullName;
        CsvFiles.WriteBars(Path.Combine(_data, DemoFiles.Index), _scenario.Index);
        CsvFiles.WriteImplied(Path.Combine(_data, DemoFiles.Implied), _scenario.Implied);
        File.WriteAllText(Path.Combine(_data, DemoFiles.Config), "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\", \"close-to-close:21\"], \"tenor\": \"30d\", \"mcs\": { \"replications\": 100 } }");
    }

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void Demo_Forecasts_ScoresTheScenariosExpectedVolatilityAsAUserForecaster()
    {
        // The scenario's own expected 30-day volatility (what implied is built on, before the premium and noise), given
        // as a forecast in the form of data-demo/alder-ridge-expected-vol-30d.csv.
        var mine = _temp.Combine("expected.csv");
        File.WriteAllLines(mine, ["date,expected_vol", .. _scenario.ExpectedVolatility.Select((v, i) =>
            _scenario.Index.Dates[i].ToString("yyyy-MM-dd", CultureInfo.InvariantCulture) + "," + v.ToString("R", CultureInfo.InvariantCulture))]);
        var output = _temp.Combine("out");

        var run = CliRunner.Run("demo", "--data", _data, "--out", output, "--forecasts", mine, "--forecasts-unit", "decimal");

        Assert.True(run.ExitCode == 0, run.Stderr);
        Assert.Contains(File.ReadAllLines(Path.Combine(output, "metrics.csv")), l => l.StartsWith("user:expected_vol,", StringComparison.Ordinal));
        Assert.Contains("user:expected_vol", File.ReadAllLines(Path.Combine(output, "forecasts.csv"))[0], StringComparison.Ordinal);
        Assert.Contains("\"forecasts\"", File.ReadAllText(Path.Combine(output, "run.json")), StringComparison.Ordinal);
    }

    [Fact]
    public void Demo_ForecastsFileMissing_Exit3NamingIt()
    {
        var run = CliRunner.Run("demo", "--data", _data, "--out", _temp.Combine("out2"), "--forecasts", _temp.Combine("absent.csv"));

        Assert.Equal(3, run.ExitCode);
        Assert.Contains("absent.csv", run.Stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(_temp.Combine("out2")));
    }
}
