using System.Diagnostics;
using System.Text.Json;
using VolCast.Cli.Tests.Support;
using VolCast.Core.Backtest;
using VolCast.IO;

namespace VolCast.Cli.Tests.Reliability;

// Output safety: an output is never an input, whatever links lie between them; two runs never mix in one folder;
// --force replaces the tool's own files as one set and nothing else; temporary folders of killed runs are cleaned
// and never read as results; a cancelled run, at any stage, leaves the folder as it was.
public sealed class OutputSafetyTests : IDisposable
{
    private readonly string _work = Directory.CreateTempSubdirectory("volcast-output-").FullName;

    public void Dispose() => Directory.Delete(_work, recursive: true);

    [Fact]
    public void Backtest_PricesReachedThroughALinkToTheOutputFolder_RefusedBeforeComputingAndTheInputKept()
    {
        // mkdir out; cp prices.csv out/forecasts.csv; ln -s out alias; volcast backtest --prices alias/forecasts.csv --out out --force
        var output = Directory.CreateDirectory(Path.Combine(_work, "out")).FullName;
        var prices = ReliabilityFiles.Prices(output, "forecasts.csv", 400, seed: 1);
        var before = File.ReadAllBytes(prices);
        var alias = Path.Combine(_work, "alias");
        Directory.CreateSymbolicLink(alias, output);

        var result = CliRunner.Run("backtest", "--prices", Path.Combine(alias, "forecasts.csv"), "--config", ReliabilityFiles.FastConfig(_work), "--out", output, "--force");

        Assert.Equal(ExitCodes.BadUsage, result.ExitCode);
        Assert.Contains("would overwrite the input file", result.Stderr, StringComparison.Ordinal);
        Assert.Equal(before, File.ReadAllBytes(prices));
        Assert.Equal(["forecasts.csv"], Directory.GetFileSystemEntries(output).Select(Path.GetFileName));
    }

    [Fact]
    public void Backtest_PricesGivenAsALinkToAFileInTheOutputFolder_Refused()
    {
        var output = Directory.CreateDirectory(Path.Combine(_work, "out")).FullName;
        var real = ReliabilityFiles.Prices(output, "metrics.csv", 400, seed: 2);
        var before = File.ReadAllBytes(real);
        var link = Path.Combine(_work, "prices.csv");
        File.CreateSymbolicLink(link, real);

        var result = CliRunner.Run("backtest", "--prices", link, "--config", ReliabilityFiles.FastConfig(_work), "--out", output, "--force");

        Assert.Equal(ExitCodes.BadUsage, result.ExitCode);
        Assert.Equal(before, File.ReadAllBytes(real));
    }

    [Theory]
    [InlineData("estimate")]
    [InlineData("fit")]
    [InlineData("cone")]
    public void Command_OutputThroughALinkedFolderOntoTheInput_RefusedAndTheInputKept(string command)
    {
        // ln -s data alias; volcast estimate --prices data/X --out alias/X --force
        var data = Directory.CreateDirectory(Path.Combine(_work, "data")).FullName;
        var alias = Path.Combine(_work, "alias");
        Directory.CreateSymbolicLink(alias, data);
        var name = command == "cone" ? "cone.csv" : "prices.csv";
        var prices = ReliabilityFiles.Prices(data, name, 400, seed: 3);
        var before = File.ReadAllBytes(prices);
        string[] args = command switch
        {
            "estimate" => ["estimate", "--prices", prices, "--estimator", "close-to-close", "--window", "21", "--out", Path.Combine(alias, name), "--force"],
            "fit" => ["fit", "--prices", prices, "--model", "garch", "--out", Path.Combine(alias, name), "--force"],
            _ => ["cone", "--prices", prices, "--out", alias, "--force"],
        };

        var result = CliRunner.Run(args);

        Assert.Equal(ExitCodes.BadUsage, result.ExitCode);
        Assert.Contains("overwrite the input file", result.Stderr, StringComparison.Ordinal);
        Assert.Equal(before, File.ReadAllBytes(prices));
    }

    [Fact]
    public void Estimate_OutputIsALinkToTheInput_Refused()
    {
        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 400, seed: 4);
        var before = File.ReadAllBytes(prices);
        var link = Path.Combine(_work, "vol.csv");
        File.CreateSymbolicLink(link, prices);

        var result = CliRunner.Run("estimate", "--prices", prices, "--estimator", "close-to-close", "--window", "21", "--out", link, "--force");

        Assert.Equal(ExitCodes.BadUsage, result.ExitCode);
        Assert.Equal(before, File.ReadAllBytes(prices));
        Assert.NotNull(new FileInfo(link).LinkTarget);
    }

    [Fact]
    public void Backtest_FolderCreatedByAnotherRunWhileComputing_Exits3AndLeavesThatRunAlone()
    {
        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 400, seed: 5);
        var output = Path.Combine(_work, "out");
        var job = Job(prices, output, force: false);
        var console = new CliConsole(TextWriter.Null, new StringWriter());

        var code = console.Execute(() =>
        {
            BacktestPipeline.Run(job, _ => { }, null, stage: s =>
            {
                if (s == BacktestStage.Forecast)
                {
                    // Another run commits its folder first.
                    Directory.CreateDirectory(output);
                    File.WriteAllText(Path.Combine(output, "metrics.csv"), "the other run");
                }
            });
            return 0;
        });

        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains("another run created the output folder", console.Error.ToString(), StringComparison.Ordinal);
        Assert.Equal("the other run", File.ReadAllText(Path.Combine(output, "metrics.csv")));
        Assert.Single(Directory.GetFiles(output));
        Assert.Empty(Directory.GetDirectories(_work, ".out.*"));
    }

    [Fact]
    public void Backtest_ForcedWhileAnotherRunHoldsTheFolder_Exits3AndChangesNothing()
    {
        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 400, seed: 6);
        var output = Path.Combine(_work, "out");
        string[] args = ["backtest", "--prices", prices, "--config", ReliabilityFiles.FastConfig(_work), "--out", output];
        Assert.Equal(0, CliRunner.Run(args).ExitCode);
        var before = File.ReadAllBytes(Path.Combine(output, "run.json"));

        using (new FileStream(Path.Combine(output, ResultsFolder.LockFileName), FileMode.OpenOrCreate, FileAccess.ReadWrite, FileShare.None))
        {
            var second = CliRunner.Run([.. args, "--force"]);

            Assert.Equal(ExitCodes.BadInput, second.ExitCode);
            Assert.Contains("another volcast run is writing into this folder", second.Stderr, StringComparison.Ordinal);
        }

        Assert.Equal(before, File.ReadAllBytes(Path.Combine(output, "run.json")));
        Assert.Equal(0, CliRunner.Run([.. args, "--force"]).ExitCode); // once released, the folder is free again
    }

    [Fact]
    public void Backtest_Forced_RemovesTheEarlierRunsFilesItDoesNotWriteAndKeepsTheUsersOwn()
    {
        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 600, seed: 7);
        var implied = ReliabilityFiles.Implied(_work, "implied.csv", new DateOnly(1990, 1, 1), 600);
        var output = Path.Combine(_work, "out");
        var config = ReliabilityFiles.FastConfig(_work);
        Assert.Equal(0, CliRunner.Run("backtest", "--prices", prices, "--implied", implied, "--iv-unit", "decimal", "--config", config, "--out", output).ExitCode);
        Assert.True(File.Exists(Path.Combine(output, "premium.png")));
        File.WriteAllText(Path.Combine(output, "notes.txt"), "mine");

        // Without implied the premium chart is not drawn: it must not survive beside the new run's files.
        var forced = CliRunner.Run("backtest", "--prices", prices, "--config", config, "--out", output, "--force");

        Assert.True(forced.ExitCode == 0, forced.Stderr);
        Assert.False(File.Exists(Path.Combine(output, "premium.png")));
        Assert.Equal("mine", File.ReadAllText(Path.Combine(output, "notes.txt")));
        var manifest = Manifest(output);
        Assert.Equal(
            Directory.GetFiles(output).Select(Path.GetFileName).Where(n => n is not "notes.txt" and not ResultsFolder.LockFileName).Order(StringComparer.Ordinal),
            manifest);
        Assert.Empty(Directory.GetDirectories(_work, ".out.*"));
    }

    [Fact]
    public void Backtest_ForcedOverAFileOfAnOutputNameThatNoRunListed_Exits3AndLeavesTheFolderAlone()
    {
        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 400, seed: 8);
        var output = Directory.CreateDirectory(Path.Combine(_work, "out")).FullName;
        File.WriteAllText(Path.Combine(output, "metrics.csv"), "my own table");

        var result = CliRunner.Run("backtest", "--prices", prices, "--config", ReliabilityFiles.FastConfig(_work), "--out", output, "--force");

        Assert.Equal(ExitCodes.BadInput, result.ExitCode);
        Assert.Contains("was not written by volcast", result.Stderr, StringComparison.Ordinal);
        Assert.Equal("my own table", File.ReadAllText(Path.Combine(output, "metrics.csv")));
        Assert.DoesNotContain(Directory.GetFiles(output), f => Path.GetFileName(f) == "run.json");
    }

    [Fact]
    public void Backtest_ForcedSwapFailsHalfWay_PutsTheEarlierRunBackWhole()
    {
        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 400, seed: 9);
        var output = Path.Combine(_work, "out");
        Assert.Equal(0, CliRunner.Run("backtest", "--prices", prices, "--config", ReliabilityFiles.FastConfig(_work), "--out", output).ExitCode);
        var before = Directory.GetFiles(output).ToDictionary(f => Path.GetFileName(f), File.ReadAllBytes);

        // A file the manifest promises but the staging folder lacks makes a move fail after some files have moved in.
        var ex = Assert.Throws<IOException>(() => BacktestPipeline.Run(Job(prices, output, force: true), _ => { }, null, writeMore: (_, _) => ["missing.txt"]));

        Assert.Contains("holds the earlier results as they were", ex.Message, StringComparison.Ordinal);
        var after = Directory.GetFiles(output).Where(f => Path.GetFileName(f) != ResultsFolder.LockFileName).ToDictionary(f => Path.GetFileName(f), File.ReadAllBytes);
        Assert.Equal(before.Keys.Order(StringComparer.Ordinal), after.Keys.Order(StringComparer.Ordinal));
        Assert.All(before, kv => Assert.Equal(kv.Value, after[kv.Key]));
        Assert.Empty(Directory.GetDirectories(_work, ".out.*"));
    }

    [Fact]
    public void Backtest_TemporaryFoldersOfDeadRuns_RemovedByTheNextRunAndThoseOfLiveOnesKept()
    {
        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 400, seed: 10);
        var dead = DeadProcessId();
        var stale = Directory.CreateDirectory(Path.Combine(_work, $".out.{dead}.{Guid.NewGuid():N}.tmp")).FullName;
        File.WriteAllText(Path.Combine(stale, "metrics.csv"), "forecaster,n\nlooks,complete\n");
        var live = Directory.CreateDirectory(Path.Combine(_work, $".out.{Environment.ProcessId}.{Guid.NewGuid():N}.tmp")).FullName;
        var other = Directory.CreateDirectory(Path.Combine(_work, $".elsewhere.{dead}.{Guid.NewGuid():N}.tmp")).FullName;

        var result = CliRunner.Run("backtest", "--prices", prices, "--config", ReliabilityFiles.FastConfig(_work), "--out", Path.Combine(_work, "out"));

        Assert.True(result.ExitCode == 0, result.Stderr);
        Assert.False(Directory.Exists(stale));
        Assert.True(Directory.Exists(live)); // a running process may still be writing it
        Assert.True(Directory.Exists(other)); // another target's: not this run's to remove
    }

    [Fact]
    public void Batch_StaleTemporaryFolderInAssets_IsRemovedAndNeverReadAsAName()
    {
        var pricesDir = Directory.CreateDirectory(Path.Combine(_work, "prices")).FullName;
        ReliabilityFiles.Prices(pricesDir, "alpha.csv", 400, seed: 11);
        var output = Path.Combine(_work, "batch");
        var stale = Directory.CreateDirectory(Path.Combine(output, "assets", $".alpha.{DeadProcessId()}.{Guid.NewGuid():N}.tmp")).FullName;
        File.WriteAllText(Path.Combine(stale, "batch.json"), "{}");

        var result = CliRunner.Run("batch", "--prices-dir", pricesDir, "--config", ReliabilityFiles.FastConfig(_work), "--out", output, "--jobs", "1");

        Assert.True(result.ExitCode == 0, result.Stderr);
        Assert.False(Directory.Exists(stale));
        Assert.Equal(["alpha"], Directory.GetDirectories(Path.Combine(output, "assets")).Select(Path.GetFileName));
        Assert.Equal(2, File.ReadAllLines(Path.Combine(output, "summary.csv")).Length);
    }

    [Theory]
    [InlineData("CheckOutput")]
    [InlineData("Load")]
    [InlineData("Forecast")]
    [InlineData("Calibrate")]
    [InlineData("RulePnl")]
    [InlineData("WriteData")]
    [InlineData("WriteReport")]
    [InlineData("Commit")]
    public void Backtest_CancelledAtAStage_StopsThereAndLeavesNoFolder(string stage)
    {
        var at = Enum.Parse<BacktestStage>(stage);
        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 600, seed: 12);
        var output = Path.Combine(_work, "out");
        using var cancel = new CancellationTokenSource();
        var reached = new List<BacktestStage>();

        Assert.ThrowsAny<OperationCanceledException>(() => BacktestPipeline.Run(Job(prices, output, force: false), _ => { }, null, stage: s =>
        {
            reached.Add(s);
            if (s == at)
            {
                cancel.Cancel();
            }
        }, cancellationToken: cancel.Token));

        Assert.Equal(at, reached[^1]); // stopped in the stage that was cancelled, before the next one started
        Assert.False(Directory.Exists(output));
        Assert.Empty(Directory.GetDirectories(_work, ".out.*"));
    }

    [Theory]
    [InlineData("Calibrate")]
    [InlineData("WriteReport")]
    [InlineData("Commit")]
    public void Backtest_ForcedAndCancelledAtAStage_LeavesTheEarlierRunByteForByte(string stage)
    {
        var at = Enum.Parse<BacktestStage>(stage);
        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 600, seed: 13);
        var output = Path.Combine(_work, "out");
        Assert.Equal(0, CliRunner.Run("backtest", "--prices", prices, "--config", ReliabilityFiles.FastConfig(_work), "--out", output).ExitCode);
        var before = Directory.GetFiles(output).ToDictionary(f => Path.GetFileName(f), File.ReadAllBytes);
        using var cancel = new CancellationTokenSource();

        Assert.ThrowsAny<OperationCanceledException>(() => BacktestPipeline.Run(Job(prices, output, force: true), _ => { }, null, stage: s =>
        {
            if (s == at)
            {
                cancel.Cancel();
            }
        }, cancellationToken: cancel.Token));

        var after = Directory.GetFiles(output).Where(f => Path.GetFileName(f) != ResultsFolder.LockFileName).ToDictionary(f => Path.GetFileName(f), File.ReadAllBytes);
        Assert.Equal(before.Keys.Order(StringComparer.Ordinal), after.Keys.Order(StringComparer.Ordinal));
        Assert.All(before, kv => Assert.Equal(kv.Value, after[kv.Key]));
    }

    private static string[] Manifest(string folder)
    {
        using var run = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "run.json")));
        return [.. run.RootElement.GetProperty("files").EnumerateArray().Select(e => e.GetString()!)];
    }

    private static int DeadProcessId()
    {
        using var process = Process.Start(new ProcessStartInfo("true") { UseShellExecute = false })!;
        process.WaitForExit();
        return process.Id;
    }

    private BacktestJob Job(string prices, string output, bool force)
    {
        var config = ReliabilityFiles.FastConfig(_work);
        return new BacktestJob(prices, null, ImpliedUnit.Infer, BacktestOptions.Resolve(config, null, null), config, output, force);
    }
}
