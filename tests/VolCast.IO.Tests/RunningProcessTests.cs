namespace VolCast.IO.Tests;

public sealed class RunningProcessTests
{
    [Fact]
    public void IsRunning_ThisProcess_IsTrue() => Assert.True(RunningProcess.IsRunning(Environment.ProcessId));

    [Fact]
    public void IsRunning_AProcessThatHasEnded_IsFalse() =>
        // A temporary named for a process that has ended is what a killed run leaves; it must count as not running.
        Assert.False(RunningProcess.IsRunning(AtomicFileSetTests.EndedProcessId()));
}
