namespace VolCast.IO.Tests;

public sealed class RunningProcessTests
{
    [Fact]
    public void IsRunning_ThisProcess_IsTrue() => Assert.True(RunningProcess.IsRunning(Environment.ProcessId));

    [Fact]
    public void IsRunning_AProcessThatHasEnded_IsFalse() =>
        // A temporary named for a process that has ended is what a killed run leaves; it must count as not running.
        Assert.False(RunningProcess.IsRunning(AtomicFileSetTests.EndedProcessId()));

    [Fact]
    public void IsRunning_AZombieProcess_IsFalse()
    {
        // A process that has ended but whose parent has not collected it (a zombie, proc(5) state Z) writes nothing more;
        // what it left must count as a dead run's. The shell starts a short `sleep` in the background and then becomes a
        // long `sleep`, which never collects its child: the short one, ending after the shell has become the long one,
        // stays a zombie while the long one runs.
        if (!OperatingSystem.IsLinux())
        {
            return;
        }

        using var parent = System.Diagnostics.Process.Start(new System.Diagnostics.ProcessStartInfo("sh", ["-c", "sleep 0.3 & echo $!; exec sleep 30"])
        {
            RedirectStandardOutput = true,
        })!;
        try
        {
            var pid = int.Parse(parent.StandardOutput.ReadLine()!, System.Globalization.CultureInfo.InvariantCulture);
            var stat = $"/proc/{pid}/stat";
            var deadline = DateTime.UtcNow.AddSeconds(10);
            while (File.Exists(stat) && !File.ReadAllText(stat).Contains(") Z ", StringComparison.Ordinal) && DateTime.UtcNow < deadline)
            {
                Thread.Sleep(10);
            }

            Assert.Contains(") Z ", File.ReadAllText(stat), StringComparison.Ordinal); // the premise: it is a zombie
            Assert.False(RunningProcess.IsRunning(pid));
            Assert.True(RunningProcess.IsRunning(parent.Id)); // the live parent still counts as running
        }
        finally
        {
            parent.Kill();
            parent.WaitForExit();
        }
    }
}
