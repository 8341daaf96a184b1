using VolCast.Cli.Tests.Support;
using VolCast.Core.Demo;

namespace VolCast.Cli.Tests.Commands;

/// <summary>
/// Paths written in a configuration file (forecastsFile, eventsFile) are relative to the configuration's own folder;
/// paths on the command line are relative to the working folder. Invented demo data (3 years), not reference data.
/// </summary>
public sealed class ConfigFilePathsTests : IDisposable
{
    private readonly TempFolder _temp = new("cfgpaths");
    private readonly string _prices;
    private readonly string _implied;
    private readonly string[] _dates;

    public ConfigFilePathsTests()
    {
        var scenario = new DemoScenarioGenerator(7, years: 3).Generate();
        _prices = CsvFiles.WriteBars(_temp.Combine("index.csv"), scenario.Index);
        _implied = CsvFiles.WriteImplied(_temp.Combine("implied.csv"), scenario.Implied);
        _dates = [.. File.ReadAllLines(_prices).Skip(1).Select(l => l.Split(',')[0])];
    }

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void ConfigPaths_AreReadBesideTheConfigurationWhereverTheRunStarts()
    {
        var folder = Directory.CreateDirectory(_temp.Combine("setup")).FullName;
        File.WriteAllLines(Path.Combine(folder, "mine.csv"), ["date,flat", .. _dates.Select(d => d + ",0.2")]);
        File.WriteAllText(Path.Combine(folder, "events.csv"), "date,kind,scheduled\n" + _dates[300] + ",central-bank,yes\n");
        File.WriteAllText(Path.Combine(folder, "run.json"),
            "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\", \"user:flat\"], \"forecastsFile\": \"mine.csv\", \"forecastsUnit\": \"decimal\", \"eventsFile\": \"events.csv\" }");
        var output = _temp.Combine("out");

        var run = CliRunner.Run("backtest", "--prices", _prices, "--implied", _implied, "--iv-unit", "decimal", "--out", output, "--config", Path.Combine(folder, "run.json"));

        Assert.True(run.ExitCode == 0, run.Stderr);
        Assert.Contains(File.ReadAllLines(Path.Combine(output, "metrics.csv")), l => l.StartsWith("user:flat,", StringComparison.Ordinal));
        Assert.Contains(File.ReadAllLines(Path.Combine(output, "groups.csv")), l => l.StartsWith("events,with a scheduled event,", StringComparison.Ordinal));
    }

    [Fact]
    public void CommandLinePaths_StayRelativeToTheWorkingFolderAndOverrideTheConfiguration()
    {
        // The configuration, in a subfolder, names an events file that is not there; --events, relative to the working
        // folder, names one that is. The run must use the command line's file and never look for the configuration's.
        Directory.CreateDirectory(_temp.Combine("cfg"));
        File.WriteAllText(_temp.Combine("cfg", "run.json"), "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\"], \"eventsFile\": \"missing.csv\" }");
        File.WriteAllText(_temp.Combine("events.csv"), "date,kind\n" + _dates[300] + ",earnings\n");

        var run = CliRunner.RunProcess(_temp.Path, "backtest", "--prices", "index.csv", "--implied", "implied.csv", "--iv-unit", "decimal",
            "--out", "out2", "--config", Path.Combine("cfg", "run.json"), "--events", "events.csv");

        Assert.True(run.ExitCode == 0, run.Stderr);
        Assert.Contains(File.ReadAllLines(_temp.Combine("out2", "groups.csv")), l => l.StartsWith("events,with an event added after the fact,", StringComparison.Ordinal));
    }

    [Fact]
    public void ConfigPath_ToAMissingFile_Exit3NamingThePathBesideTheConfiguration()
    {
        Directory.CreateDirectory(_temp.Combine("cfg3"));
        var config = _temp.Combine("cfg3", "run.json");
        File.WriteAllText(config, "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\"], \"eventsFile\": \"events.csv\" }");

        var run = CliRunner.Run("backtest", "--prices", _prices, "--out", _temp.Combine("out3"), "--config", config);

        Assert.Equal(3, run.ExitCode);
        Assert.Contains(Path.Combine("cfg3", "events.csv"), run.Stderr, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("forecastsFile")]
    [InlineData("eventsFile")]
    public void Batch_ConfigurationNamingAFileOfOneInstrument_Exit2InsteadOfIgnoringIt(string key)
    {
        var prices = Directory.CreateDirectory(_temp.Combine("prices-" + key)).FullName;
        File.Copy(_prices, Path.Combine(prices, "alpha.csv"));
        var config = _temp.Combine(key + ".json");
        File.WriteAllText(config, "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\"], \"" + key + "\": \"file.csv\" }");

        var run = CliRunner.Run("batch", "--prices-dir", prices, "--config", config, "--out", _temp.Combine("batch-" + key));

        Assert.Equal(2, run.ExitCode);
        Assert.Contains("batch does not read forecastsFile or eventsFile", run.Stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(_temp.Combine("batch-" + key)));
    }
}
