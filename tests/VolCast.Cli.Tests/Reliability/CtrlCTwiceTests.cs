using System.Diagnostics;
using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Reliability;

// Ctrl-C as a user gives it, to the built executable: a real SIGINT, then a second one while the first is still being
// handled (the run stopping, its staging folder being left). The process ends with 130 (128 + SIGINT, as shells report
// Ctrl-C; common practice, no source), the output folder never appears, and the next run into it cleans up and succeeds.
public sealed class CtrlCTwiceTests : IDisposable
{
    private readonly TempFolder _temp = new("ctrlc");

    public void Dispose() => _temp.Dispose();

    [Theory]
    [InlineData(0)]
    [InlineData(30)]
    [InlineData(300)]
    public void Backtest_TwoSigints_Exits130WithNothingHalfWritten_AndTheNextRunSucceeds(int betweenMilliseconds)
    {
        if (!OperatingSystem.IsLinux() && !OperatingSystem.IsMacOS())
        {
            return; // SIGINT is a Unix signal; the in-process cancellation tests cover the other systems.
        }

        // Long enough (default configuration, every forecaster and the sweep) that the run is still going when the signals come.
        var prices = ReliabilityFiles.Prices(_temp.Path, "prices.csv", 6000, seed: 9);
        var output = _temp.Combine("out");

        var (code, stderr) = RunAndInterruptTwice(betweenMilliseconds, "backtest", "--prices", prices, "--out", output);

        Assert.True(code == 130, $"exit {code}: {stderr}");
        Assert.False(Directory.Exists(output));
        Assert.DoesNotContain("unexpected failure", stderr, StringComparison.Ordinal);

        // What the killed run left (a hidden staging folder at most) is never taken for results and goes with the next run.
        var config = ReliabilityFiles.FastConfig(_temp.Path);
        var small = ReliabilityFiles.Prices(_temp.Path, "small.csv", 400, seed: 10);
        var next = CliRunner.Run("backtest", "--prices", small, "--config", config, "--out", output);
        Assert.True(next.ExitCode == 0, next.Stderr);
        Assert.Empty(Directory.GetFileSystemEntries(_temp.Path, ".out.*"));
        Assert.True(File.Exists(Path.Combine(output, "run.json")));
    }

    private (int Code, string Stderr) RunAndInterruptTwice(int betweenMilliseconds, params string[] args)
    {
        var start = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = _temp.Path,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        start.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "volcast.dll"));
        foreach (var arg in args)
        {
            start.ArgumentList.Add(arg);
        }

        using var process = Process.Start(start)!;
        using var started = new ManualResetEventSlim();
        process.OutputDataReceived += (_, e) =>
        {
            if (e.Data is not null)
            {
                started.Set(); // the first progress line: the run is under way, its Ctrl-C handler in place
            }
        };
        process.BeginOutputReadLine();
        var stderr = process.StandardError.ReadToEndAsync();
        Assert.True(started.Wait(TimeSpan.FromMinutes(1)), "the backtest showed no progress within a minute");
        Thread.Sleep(200);
        Signal(process.Id);
        Thread.Sleep(betweenMilliseconds);
        if (!process.HasExited)
        {
            Signal(process.Id);
        }

        if (!process.WaitForExit(TimeSpan.FromMinutes(2)))
        {
            process.Kill(entireProcessTree: true);
            throw new TimeoutException("volcast did not stop within 2 minutes of two Ctrl-Cs.");
        }

        return (process.ExitCode, stderr.Result);
    }

    private static void Signal(int pid)
    {
        using var kill = Process.Start(new ProcessStartInfo("kill") { ArgumentList = { "-s", "INT", pid.ToString(System.Globalization.CultureInfo.InvariantCulture) }, RedirectStandardError = true, UseShellExecute = false })!;
        kill.WaitForExit();
    }
}
