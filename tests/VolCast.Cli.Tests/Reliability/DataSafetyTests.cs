using System.CommandLine;
using VolCast.Cli.Commands;
using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Reliability;

// Data safety: an interrupted backtest leaves no half-written results and says so; no command changes an
// input (bytes or timestamp); an existing output is refused without --force.
public sealed class DataSafetyTests : IDisposable
{
    private readonly TempFolder _temp = new("safety");

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void Backtest_InterruptedBeforeItStarts_Exits130SaysSoAndWritesNothing()
    {
        var prices = ReliabilityFiles.Prices(_temp.Path, "prices.csv", 600, seed: 1);
        var output = _temp.Combine("out");
        using var interrupt = new CancellationTokenSource();
        interrupt.Cancel();

        var (code, _, stderr) = RunBacktest(interrupt.Token, "--prices", prices, "--out", output);

        Assert.Equal(ExitCodes.Interrupted, code);
        Assert.Equal(130, code); // 128 + SIGINT, as shells report Ctrl-C (common practice, no source)
        Assert.Contains("interrupted", stderr, StringComparison.Ordinal);
        Assert.Contains("no results were written", stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(output));
        Assert.Empty(Directory.GetFileSystemEntries(_temp.Path, ".out.*"));
    }

    [Theory]
    [InlineData(0)] // at once
    [InlineData(50)] // while the forecasters run
    [InlineData(300)]
    [InlineData(1500)] // perhaps after the results are written
    public void Backtest_InterruptedAtAnyMoment_LeavesEitherNoFolderOrACompleteOne(int afterMilliseconds)
    {
        var prices = ReliabilityFiles.Prices(_temp.Path, "prices.csv", 2500, seed: 2);
        var output = _temp.Combine("out");
        using var interrupt = new CancellationTokenSource();
        interrupt.CancelAfter(afterMilliseconds);

        var (code, _, stderr) = RunBacktest(interrupt.Token, "--prices", prices, "--out", output);

        if (code == 0)
        {
            // Finished first: every results file is whole (the folder was moved into place in one step).
            var written = Directory.GetFiles(output).Select(Path.GetFileName).ToHashSet();
            Assert.Superset(new HashSet<string?> { "forecasts.csv", "metrics.csv", "metrics.json", "run.json", "summary.txt", "report.html" }, written);
            Assert.EndsWith("}", File.ReadAllText(Path.Combine(output, "run.json")).TrimEnd(), StringComparison.Ordinal);
        }
        else
        {
            Assert.True(code == 130, stderr);
            Assert.Contains("interrupted", stderr, StringComparison.Ordinal);
            Assert.False(Directory.Exists(output));
        }

        Assert.Empty(Directory.GetFileSystemEntries(_temp.Path, ".out.*"));
    }

    [Fact]
    public void EveryCommand_ValidInputs_LeavesTheInputBytesAndTimestampsUnchanged()
    {
        var prices = ReliabilityFiles.Prices(_temp.Path, "prices.csv", 400, seed: 3);
        var implied = ReliabilityFiles.Implied(_temp.Path, "implied.csv", new DateOnly(1990, 1, 1), 400);
        var config = ReliabilityFiles.FastConfig(_temp.Path);
        var demo = _temp.Combine("demo");
        Assert.Equal(0, CliRunner.Run("demo", "--regenerate", "--data", demo).ExitCode);
        var quotes = Directory.GetFiles(demo, "*option-quotes.csv").Single();
        string[] inputs = [prices, implied, config, quotes];
        var before = inputs.ToDictionary(p => p, p => (Bytes: File.ReadAllBytes(p), Written: File.GetLastWriteTimeUtc(p)));
        // Outputs are written beside the inputs, the place most likely to catch an accidental overwrite.
        string[][] runs =
        [
            ["estimate", "--prices", prices, "--estimator", "yang-zhang", "--window", "21", "--out", _temp.Combine("vol.csv")],
            ["fit", "--prices", prices, "--model", "gjr-garch", "--out", _temp.Combine("fit.json")],
            ["cone", "--prices", prices, "--implied", implied, "--out", _temp.Combine("cone")],
            ["implied", "--quotes", quotes, "--tenor", "30d", "--out", _temp.Combine("iv.csv")],
            ["backtest", "--prices", prices, "--implied", implied, "--iv-unit", "decimal", "--config", config, "--out", _temp.Combine("bt")],
            ["backtest", "--prices", prices, "--config", config, "--out", _temp.Path, "--force"], // results beside the inputs
        ];

        foreach (var run in runs)
        {
            var result = CliRunner.Run(run);
            Assert.True(result.ExitCode == 0, $"{string.Join(' ', run)}: {result.Stderr}");
        }

        foreach (var input in inputs)
        {
            Assert.Equal(before[input].Bytes, File.ReadAllBytes(input));
            Assert.Equal(before[input].Written, File.GetLastWriteTimeUtc(input));
        }
    }

    [Theory]
    [InlineData("backtest", "metrics.csv")] // backtest refuses an existing results folder
    [InlineData("cone", "cone.csv")] // cone writes into a folder and refuses its own existing files
    public void Command_ExistingOutput_RefusedWithoutForceAndLeftAlone(string command, string ownFile)
    {
        var prices = ReliabilityFiles.Prices(_temp.Path, "prices.csv", 400, seed: 4);
        var output = _temp.Combine("existing");
        Directory.CreateDirectory(output);
        File.WriteAllText(Path.Combine(output, "notes.txt"), "keep me");
        File.WriteAllText(Path.Combine(output, ownFile), "an earlier result");
        string[] args = command == "backtest"
            ? ["backtest", "--prices", prices, "--config", ReliabilityFiles.FastConfig(_temp.Path), "--out", output]
            : ["cone", "--prices", prices, "--out", output];

        var result = CliRunner.Run(args);

        Assert.NotEqual(0, result.ExitCode);
        Assert.Contains("--force", result.Stderr, StringComparison.Ordinal);
        Assert.Equal(new[] { "notes.txt", ownFile }.Order(StringComparer.Ordinal), Directory.GetFileSystemEntries(output).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        Assert.Equal("keep me", File.ReadAllText(Path.Combine(output, "notes.txt")));
        Assert.Equal("an earlier result", File.ReadAllText(Path.Combine(output, ownFile)));
    }

    private static (int Code, string Stdout, string Stderr) RunBacktest(CancellationToken interrupt, params string[] args)
    {
        using var stdout = new StringWriter();
        using var stderr = new StringWriter();
        var console = new CliConsole(stdout, stderr, interrupt);
        var command = BacktestCommand.Create(console);
        var code = command.Parse(args).Invoke(new InvocationConfiguration { Output = stdout, Error = stderr, EnableDefaultExceptionHandler = false });
        return (code, stdout.ToString(), stderr.ToString());
    }
}
