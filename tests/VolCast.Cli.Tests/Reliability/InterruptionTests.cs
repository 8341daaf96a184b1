namespace VolCast.Cli.Tests.Reliability;

// The one Ctrl-C handler's rules, on an instance of their own (not the process's): the first Ctrl-C requests a stop and
// keeps the process; a later one lets the process end, but only once the moves into place under way have finished, so a
// set of files is never left half old and half new (the rule of an atomic replace; common practice, no source).
public sealed class InterruptionTests
{
    [Fact]
    public void FirstPress_RequestsTheStopAndKeepsTheProcess_TheSecondLetsItEnd()
    {
        var clock = TimeSpan.FromSeconds(100);
        using var interruption = new Interruption(() => clock);

        Assert.False(interruption.Token.IsCancellationRequested);
        Assert.True(interruption.Press());
        Assert.True(interruption.Token.IsCancellationRequested);
        clock += TimeSpan.FromMilliseconds(150); // a quick person's second press
        Assert.False(interruption.Press());
        Assert.False(interruption.Press());
    }

    [Fact]
    public void OneCtrlCDeliveredTwice_IsOneStop_NotTheSecondPress()
    {
        // timeout -s INT signals the command and then its process group, microseconds apart (GNU coreutils timeout).
        var clock = TimeSpan.FromSeconds(100);
        using var interruption = new Interruption(() => clock);

        Assert.True(interruption.Press());
        clock += TimeSpan.FromMilliseconds(1);
        Assert.True(interruption.Press());
        clock += Interruption.SamePress;
        Assert.False(interruption.Press());
    }

    [Fact]
    public void SecondPress_DuringMovesIntoPlace_WaitsForThemToFinish()
    {
        var clock = TimeSpan.FromSeconds(100);
        using var interruption = new Interruption(() => clock);
        Assert.True(interruption.Press());
        clock += TimeSpan.FromSeconds(1);
        using var moving = new ManualResetEventSlim();
        using var release = new ManualResetEventSlim();
        var moved = false;
        var mover = new Thread(() => interruption.Uninterrupted(() =>
        {
            moving.Set();
            release.Wait();
            moved = true;
        }));
        mover.Start();
        Assert.True(moving.Wait(TimeSpan.FromMinutes(1)));

        var ended = false;
        var presser = new Thread(() => ended = !interruption.Press());
        presser.Start();

        // However long the moves take, the second Ctrl-C does not end the process before they are done.
        Assert.False(presser.Join(TimeSpan.FromMilliseconds(300)), "the second Ctrl-C returned while files were being moved into place");
        Assert.False(moved);
        release.Set();
        Assert.True(presser.Join(TimeSpan.FromMinutes(1)));
        mover.Join();
        Assert.True(moved);
        Assert.True(ended);
    }

    [Fact]
    public void Moves_WithoutAnyPress_RunAtOnce()
    {
        using var interruption = new Interruption();
        var moved = false;

        interruption.Uninterrupted(() => moved = true);

        Assert.True(moved);
        Assert.False(interruption.Token.IsCancellationRequested);
    }
}
