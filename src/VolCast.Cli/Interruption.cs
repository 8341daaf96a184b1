namespace VolCast.Cli;

/// <summary>
/// The one Ctrl-C (SIGINT) handler of the process, installed by <see cref="Program.Main"/> before the command line is
/// parsed, and the one cancellation every command reads (through <see cref="CliConsole.Interrupt"/>).
/// </summary>
/// <remarks>
/// <para>The first Ctrl-C keeps the process alive and requests a stop: a command stops at its next check, before its next
/// file, or lets a set of files it has begun moving into place finish, and ends with exit code 130. A second Ctrl-C ends
/// the process at once (the runtime's default for SIGINT, which a shell reports as 130), except that it waits for the moves
/// into place already under way (<see cref="Uninterrupted"/>, a few renames, milliseconds), so a results folder or a set of
/// files is never left half old and half new; no new move starts after it. What a killed process was writing stays in hidden
/// temporary files and folders that the next run of the same output removes.</para>
/// <para>Before <see cref="Program.Main"/> installs the handler (the runtime's start), a Ctrl-C ends the process with the system's
/// default, before any file is opened. In-process tests do not install it: their token stops the command instead, and
/// <see cref="Uninterrupted"/> then just runs its moves.</para>
/// </remarks>
internal static class Interruption
{
    private static readonly CancellationTokenSource StopRequested = new();
    private static readonly object Gate = new();
    private static int _presses;
    private static int _moving;
    private static bool _ending;
    private static bool _installed;

    /// <summary>Installs the handler (once) and returns the process-wide token that the first Ctrl-C cancels.</summary>
    public static CancellationToken Install()
    {
        lock (Gate)
        {
            if (!_installed)
            {
                Console.CancelKeyPress += OnCancelKeyPress;
                _installed = true;
            }
        }

        return StopRequested.Token;
    }

    /// <summary>
    /// Runs the moves that put a finished set of files into place: a second Ctrl-C that arrives meanwhile waits until they
    /// are done, and once the process is ending no new set starts to move (the call then never returns; the process ends).
    /// </summary>
    /// <param name="moves">Renames only: the files are written in full before.</param>
    public static void Uninterrupted(Action moves)
    {
        ArgumentNullException.ThrowIfNull(moves);
        lock (Gate)
        {
            while (_ending)
            {
                Monitor.Wait(Gate);
            }

            _moving++;
        }

        try
        {
            moves();
        }
        finally
        {
            lock (Gate)
            {
                _moving--;
                Monitor.PulseAll(Gate);
            }
        }
    }

    private static void OnCancelKeyPress(object? sender, ConsoleCancelEventArgs e)
    {
        if (Interlocked.Increment(ref _presses) == 1)
        {
            // The first: the process stays; every command sees the stop at its next check.
            e.Cancel = true;
            StopRequested.Cancel();
            return;
        }

        // The second (or a later one): wait for moves under way, start no more, then let the runtime end the process.
        lock (Gate)
        {
            _ending = true;
            while (_moving > 0)
            {
                Monitor.Wait(Gate);
            }
        }

        e.Cancel = false;
    }
}
