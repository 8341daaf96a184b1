using System.Diagnostics;
using System.Runtime.InteropServices;
using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Reliability;

// Ctrl-C at any moment of any command that writes, as a user gives it: a real SIGINT to the built executable, also in its
// first moments, before the command has begun (the one handler is installed in Main before parsing; before that the
// runtime's default ends the process, before any file is opened). The process ends with 130 (128 + SIGINT, as shells
// report Ctrl-C; common practice, no source), and the output is the earlier one byte for byte, or, for a quick command
// that finished first, the complete new one: never a mix, never a half-written file, never a temporary left behind.
// The outcomes are asserted, not how long anything took, so a loaded machine changes which moment is hit, not the verdict.
public sealed class EarlyCtrlCTests : IDisposable
{
    private const int Sigint = 2;

    private readonly TempFolder _temp = new("early-ctrlc");

    public void Dispose() => _temp.Dispose();

    private static readonly string[] Writing = ["backtest", "demo", "batch", "reduce", "cone", "implied", "estimate", "fit", "regenerate"];

    /// <summary>Every command that writes files (by a short name) with each moment of the signal after the start.</summary>
    public static TheoryData<string, int> CommandsAndMoments()
    {
        var data = new TheoryData<string, int>();
        foreach (var command in Writing)
        {
            foreach (var after in new[] { 0, 50, 150 })
            {
                data.Add(command, after);
            }
        }

        return data;
    }

    /// <summary>Every command that writes files, by a short name.</summary>
    public static TheoryData<string> Commands() => [.. Writing];

    [Theory]
    [MemberData(nameof(CommandsAndMoments))]
    public void Command_SigintSoonAfterStart_Exits130AndLeavesTheEarlierOutputWhole(string command, int afterMilliseconds)
    {
        if (!OperatingSystem.IsLinux() && !OperatingSystem.IsMacOS())
        {
            return; // SIGINT is a Unix signal; the in-process cancellation tests cover the other systems.
        }

        var output = _temp.Combine("out");
        var run = Arguments(command, output);
        var reference = EarlierOutput(command, run, output);
        var earlier = Snapshot(output);

        using var process = CliRunner.StartProcess(_temp.Path, run);
        Thread.Sleep(afterMilliseconds);
        Assert.True(kill(process.Id, Sigint) == 0 || process.HasExited, "the signal could not be sent"); // a quick command may have ended already
        var result = CliRunner.Finish(process, run);

        var after = Snapshot(output);
        if (reference is null)
        {
            Assert.True(result.ExitCode == 130, $"{command}: exit {result.ExitCode}: {result.Stderr}");
            Assert.Equal(earlier, after);
        }
        else
        {
            // A quick command may finish first (exit 0), or as the process ends the signal may meet the runtime's default
            // again (exit 130): either way the output is the earlier one or the complete new one, never anything between.
            Assert.True(result.ExitCode is 130 or 0, $"{command}: exit {result.ExitCode}: {result.Stderr}");
            Assert.True(DictionaryEqual(after, earlier) || DictionaryEqual(after, reference), $"{command}: the output is neither the earlier one nor the complete new one");
            Assert.True(result.ExitCode == 130 || DictionaryEqual(after, reference), $"{command}: exit 0 without the complete new output");
        }

        Assert.DoesNotContain("unexpected failure", result.Stderr, StringComparison.Ordinal);
        Assert.Empty(Temporaries());
    }

    [Theory]
    [MemberData(nameof(Commands))]
    public void Command_StoppedBeforeItWrites_Exits130SaysSoAndChangesNothing(string command)
    {
        var output = _temp.Combine("out");
        var run = Arguments(command, output);
        EarlierOutput(command, run, output);
        var earlier = Snapshot(output);
        var left = LeftByAKilledRun(command, output);
        using var interrupt = new CancellationTokenSource();
        interrupt.Cancel();
        using var stdout = new StringWriter();
        using var stderr = new StringWriter();

        var code = Program.Run(run, stdout, stderr, interrupt.Token);

        Assert.True(code == 130, $"{command}: exit {code}: {stderr}");
        Assert.Contains(command == "batch" ? "batch stopped before any name finished" : "interrupted: ", command == "batch" ? stdout.ToString() : stderr.ToString(), StringComparison.Ordinal);
        Assert.Equal(earlier, Snapshot(output));
        Assert.All(left, path => Assert.False(Path.Exists(path), $"{path}: what a killed run left is removed when the next run starts, even one stopped at once"));
        Assert.Empty(Temporaries());
    }

    [Theory]
    [InlineData("backtest", false)] // two at once, in the first moments
    [InlineData("backtest", true)] // two at once, while the forecasters run
    [InlineData("batch", true)] // two at once, while names are being computed and committed
    public void Command_TwoSigints_EndTheProcessWith130_AndTheNextRunCleansUpAndSucceeds(string command, bool waitForProgress)
    {
        if (!OperatingSystem.IsLinux() && !OperatingSystem.IsMacOS())
        {
            return;
        }

        var output = _temp.Combine("out");
        var run = Arguments(command, output).Where(a => a != "--force").ToArray();
        using var process = CliRunner.StartProcess(_temp.Path, run);
        if (waitForProgress)
        {
            // The first line on standard output is progress: the command is under way, past the start (it ends, so this returns).
            Assert.NotNull(process.StandardOutput.ReadLine());
        }

        Assert.Equal(0, kill(process.Id, Sigint));

        // A person's second press: later than one Ctrl-C delivered twice (to the process and its group) would come.
        Thread.Sleep(Interruption.SamePress * 2);
        if (!process.HasExited)
        {
            _ = kill(process.Id, Sigint); // the first may have ended it already; the outcome is the same
        }

        var result = CliRunner.Finish(process, run);

        Assert.True(result.ExitCode == 130, $"{command}: exit {result.ExitCode}: {result.Stderr}");
        Assert.DoesNotContain("wrote ", result.Stdout, StringComparison.Ordinal);
        if (command == "backtest")
        {
            Assert.False(Directory.Exists(output), "a stopped backtest moves no results into place");
        }
        else
        {
            // Only whole names: each name folder there is a committed one, with its record and its run.json.
            Assert.False(File.Exists(Path.Combine(output, "summary.csv")), "a stopped batch writes no summary");
            foreach (var name in Directory.Exists(Path.Combine(output, "assets")) ? Directory.GetDirectories(Path.Combine(output, "assets")) : [])
            {
                if (!Path.GetFileName(name).StartsWith('.'))
                {
                    Assert.True(File.Exists(Path.Combine(name, "batch.json")) && File.Exists(Path.Combine(name, "run.json")), $"{name} is not whole");
                }
            }
        }

        // The next run of the same command removes what the killed one left and finishes.
        var next = CliRunner.Run(Arguments(command, output));
        Assert.True(next.ExitCode == 0, next.Stderr);
        Assert.Empty(Temporaries());
    }

    // The command line of each case: --force over an earlier output, so that a stop has something to lose.
    private string[] Arguments(string command, string output)
    {
        var data = RepositoryRoot.Combine("data-demo");
        var prices = Path.Combine(data, "alder-ridge.csv");
        return command switch
        {
            "backtest" => ["backtest", "--prices", prices, "--implied", Path.Combine(data, "alder-ridge-implied-30d.csv"), "--iv-unit", "decimal",
                "--config", Path.Combine(data, "demo-config.json"), "--out", output, "--force"],
            "demo" => ["demo", "--data", data, "--out", output, "--force"],
            "batch" => ["batch", "--prices-dir", Universe(), "--config", ReliabilityFiles.FastConfig(_temp.Path), "--jobs", "1", "--reports", "summary", "--out", output, "--force"],
            "reduce" => ["batch", "--reduce", "--out", output],
            "cone" => ["cone", "--prices", prices, "--implied", Path.Combine(data, "alder-ridge-implied-30d.csv"), "--out", output, "--force"],
            "implied" => ["implied", "--quotes", Path.Combine(data, "alder-ridge-option-quotes.csv"), "--tenor", "30d", "--out", Path.Combine(output, "iv.csv"), "--force"],
            "estimate" => ["estimate", "--prices", prices, "--estimator", "yang-zhang", "--window", "21", "--out", Path.Combine(output, "vol.csv"), "--force"],
            "fit" => ["fit", "--prices", prices, "--model", "garch", "--out", Path.Combine(output, "fit.json"), "--force"],
            "regenerate" => ["demo", "--regenerate", "--data", output],
            _ => throw new ArgumentOutOfRangeException(nameof(command), command, "not a command of these tests"),
        };
    }

    /// <summary>
    /// Writes the earlier output the stopped run must leave alone. A command whose output has the same bytes every run gets
    /// a marked copy of it as the earlier output, so that keeping it and replacing it can be told apart; the unmarked bytes
    /// are returned as the complete new output. Backtest, demo and batch record their start time, so theirs differ anyway
    /// (and, taking seconds, they are always stopped).
    /// </summary>
    private Dictionary<string, string>? EarlierOutput(string command, string[] run, string output)
    {
        var first = CliRunner.Run(command == "reduce" ? Arguments("batch", output) : run);
        Assert.True(first.ExitCode == 0, $"{command}: the earlier run failed: {first.Stderr}");
        if (command is "backtest" or "demo" or "batch")
        {
            return null;
        }

        // The reduce writes the summary files again from the same names, so only those are marked (the names and the plan are its input).
        var complete = Snapshot(output);
        var marked = command == "reduce"
            ? Directory.GetFiles(output).Where(f => Path.GetFileName(f) != VolCast.Cli.Batch.BatchPlan.FileName)
            : Directory.GetFiles(output, "*", SearchOption.AllDirectories);
        foreach (var file in marked)
        {
            File.AppendAllText(file, "an earlier run's output\n");
        }

        return complete;
    }

    /// <summary>
    /// Leaves what a run killed while writing would have left: a hidden temporary file beside each file the command writes
    /// itself, or a staging folder beside a results folder, each named for a process that has ended.
    /// </summary>
    private List<string> LeftByAKilledRun(string command, string output)
    {
        using var ended = Process.Start(new ProcessStartInfo("dotnet", "--version") { RedirectStandardOutput = true, UseShellExecute = false })!;
        ended.StandardOutput.ReadToEnd();
        ended.WaitForExit();
        var id = ended.Id.ToString(System.Globalization.CultureInfo.InvariantCulture);
        if (command is "backtest" or "demo")
        {
            var staging = _temp.Combine($".out.{id}.{Guid.NewGuid():N}.tmp");
            Directory.CreateDirectory(staging);
            File.WriteAllText(Path.Combine(staging, "metrics.csv"), "half a file");
            return [staging];
        }

        // The files at the top of the output are those the command writes itself (a batch: its summary and plan; the names' folders are staged).
        // A temporary plan is judged by its age, not its process (shards on other machines write it too): this one is an hour old.
        var left = Directory.GetFiles(output).Select(f => _temp.Write(Path.Combine("out", $".{Path.GetFileName(f)}.{id}.{Guid.NewGuid():N}.tmp"), "half a file")).ToList();
        foreach (var plan in left.Where(f => Path.GetFileName(f).StartsWith(".batch-plan.json.", StringComparison.Ordinal)))
        {
            File.SetLastWriteTimeUtc(plan, DateTime.UtcNow.AddHours(-1));
        }

        return left;
    }

    private string Universe()
    {
        var folder = _temp.Combine("universe");
        if (!Directory.Exists(folder))
        {
            Directory.CreateDirectory(folder);
            for (var i = 0; i < 4; i++)
            {
                ReliabilityFiles.Prices(folder, $"name{i}.csv", 700, seed: 40 + i);
            }
        }

        return folder;
    }

    private static bool DictionaryEqual(Dictionary<string, string> a, Dictionary<string, string> b) =>
        a.Count == b.Count && a.All(pair => b.TryGetValue(pair.Key, out var value) && value == pair.Value);

    /// <summary>Every file under the output folder with its content (SHA-256), but the lock file a --force run leaves.</summary>
    private static Dictionary<string, string> Snapshot(string folder) =>
        !Directory.Exists(folder)
            ? []
            : Directory.GetFiles(folder, "*", SearchOption.AllDirectories)
                .Where(f => Path.GetFileName(f) != ResultsFolder.LockFileName)
                .ToDictionary(f => Path.GetRelativePath(folder, f), f => Convert.ToHexString(System.Security.Cryptography.SHA256.HashData(File.ReadAllBytes(f))), StringComparer.Ordinal);

    /// <summary>Hidden temporary files and folders (<c>.NAME.PID.ID.tmp</c> or <c>.old</c>) anywhere in the test's folder.</summary>
    private List<string> Temporaries() =>
        [.. Directory.GetFileSystemEntries(_temp.Path, ".*", SearchOption.AllDirectories)
            .Where(p => p.EndsWith(".tmp", StringComparison.Ordinal) || p.EndsWith(".old", StringComparison.Ordinal))];

    [DllImport("libc", SetLastError = true)]
#pragma warning disable SA1300, IDE1006 // The system call's own name.
    private static extern int kill(int pid, int signal);
#pragma warning restore SA1300, IDE1006
}
