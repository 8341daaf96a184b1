using System.Reflection;
using System.Text.RegularExpressions;
using VolCast.Cli.Tests.Support;
using VolCast.IO.Config;

namespace VolCast.Cli.Tests.Commands;

/// <summary>What a person reads from the command line: command names, help, configuration errors.</summary>
public sealed partial class WordsAndHelpTests : IDisposable
{
    private static readonly string[] Commands = ["backtest", "batch", "cone", "estimate", "fit", "implied", "demo"];

    private readonly TempFolder _temp = new("words");

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void Scan_IsAnUnknownCommand_AndBatchHelpWorks()
    {
        // The many-names command was renamed from scan to batch with no alias kept.
        var scan = CliRunner.Run("scan", "--prices", "p");
        Assert.Equal(2, scan.ExitCode);
        Assert.Contains("Unrecognized command or argument 'scan'", scan.Stderr, StringComparison.Ordinal);

        var batch = CliRunner.Run("batch", "--help");
        Assert.Equal(0, batch.ExitCode);
        Assert.Contains("every NAME.csv in a folder", batch.Stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void TopLevelHelp_ListsTheMainJobFirst()
    {
        var help = CliRunner.Run("--help").Stdout;
        var positions = Commands.Select(c => CommandLine(c).Match(help)).ToList();

        Assert.All(positions, m => Assert.True(m.Success));
        Assert.Equal(positions.Select(m => m.Index).Order(), positions.Select(m => m.Index));
    }

    [Fact]
    public void Help_UsesOurOwnWords()
    {
        foreach (var text in new[] { CliRunner.Run("--help").Stdout }.Concat(Commands.Select(c => CliRunner.Run(c, "--help").Stdout)))
        {
            Assert.DoesNotContain("RiskMetrics", text, StringComparison.OrdinalIgnoreCase);
            Assert.DoesNotContain("expected-move", text, StringComparison.OrdinalIgnoreCase);
            Assert.DoesNotMatch(ScanWord(), text);
        }
    }

    [Fact]
    public void Help_StatesEachDefaultOnce()
    {
        foreach (var command in Commands)
        {
            var help = CliRunner.Run(command, "--help").Stdout;

            // An option block is its name line and the lines indented under it; "[default: …]" from the parser and
            // "(default …)" written in the description must not both appear in one block.
            foreach (var block in OptionBlock().Matches(help).Select(m => m.Value))
            {
                var shown = block.Contains("[default:", StringComparison.Ordinal);
                var written = block.Contains("(default", StringComparison.Ordinal);
                Assert.False(shown && written, $"{command}: {block}");
            }
        }
    }

    [Fact]
    public void ConfigHelp_ListsEveryKeyOfTheConfigurationFile()
    {
        var help = Regex.Replace(CliRunner.Run("backtest", "--help").Stdout, @"\s+", " ");
        var documents = new[] { "BacktestConfigDocument", "McsConfigDocument", "CostsConfigDocument", "SnoopingConfigDocument" }
            .Select(n => typeof(BacktestConfigFile).Assembly.GetType("VolCast.IO.Config." + n, throwOnError: true)!);
        foreach (var property in documents.SelectMany(t => t.GetProperties(BindingFlags.Public | BindingFlags.Instance)))
        {
            var key = char.ToLowerInvariant(property.Name[0]) + property.Name[1..];
            Assert.Matches(new Regex(@"\b" + key + @"\b"), help);
        }
    }

    [Fact]
    public void ConfigError_NamesTheSetting_WithoutDotNetText()
    {
        var config = Write("unknown.json", "{ \"forecasters\": [\"garch\", \"crystal-ball:3\"] }");
        var result = CliRunner.Run("backtest", "--prices", Prices(), "--config", config, "--out", _temp.Combine("x"));

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("setting 'forecasters'", result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("column", result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("(Parameter", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("EWMA of squared returns, zero mean, λ = 0.94 by default", result.Stderr, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("", "the configuration file is empty")]
    [InlineData("  \n", "the configuration file is empty")]
    [InlineData("horizon = 21\n", "the configuration file is not JSON")]
    [InlineData("tenor: 30d\n", "the configuration file is not JSON")]
    public void ConfigFile_EmptyOrNotJson_SaysSoPlainly(string text, string expected)
    {
        var config = Write("odd.json", text);
        var result = CliRunner.Run("backtest", "--prices", Prices(), "--config", config, "--out", _temp.Combine("x"));

        Assert.Equal(3, result.ExitCode);
        Assert.Contains(expected, result.Stderr, StringComparison.Ordinal);
    }

    private string Write(string name, string text)
    {
        var path = _temp.Combine(name);
        File.WriteAllText(path, text);
        return path;
    }

    private string Prices()
    {
        var path = _temp.Combine("index.csv");
        if (!File.Exists(path))
        {
            // Invented demo data (3 years), not reference data; the configuration is refused before it is used.
            CsvFiles.WriteBars(path, new Core.Demo.DemoScenarioGenerator(5, years: 3).Generate().Index);
        }

        return path;
    }

    private static Regex CommandLine(string command) => new(@"^\s+" + command + @"\s", RegexOptions.Multiline);

    [GeneratedRegex(@"\bscan\b", RegexOptions.IgnoreCase)]
    private static partial Regex ScanWord();

    [GeneratedRegex(@"^  -[^\n]*\n(?:\s{4,}[^\n]*\n)*", RegexOptions.Multiline)]
    private static partial Regex OptionBlock();
}
