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
internal sealed class Interruption : IDisposable
{
    private readonly CancellationTokenSource _stopRequested = new();
    private readonly object _gate = new();
    private int _presses;
    private int _moving;
    private bool _ending;
    private bool _installed;

    /// <summary>Gets the process's one instance, the one <see cref="Program.Main"/> installs.</summary>
    public static Interruption Process { get; } = new();

    /// <summary>Gets the token that the first Ctrl-C cancels.</summary>
    public CancellationToken Token => _stopRequested.Token;

    /// <summary>Installs the handler (once) and returns the token that the first Ctrl-C cancels.</summary>
    public CancellationToken Install()
    {
        lock (_gate)
        {
            if (!_installed)
            {
                Console.CancelKeyPress += (_, e) => e.Cancel = Press();
                _installed = true;
            }
        }

        return Token;
    }

    /// <summary>
    /// Runs the moves that put a finished set of files into place: a second Ctrl-C that arrives meanwhile waits until they
    /// are done, and once the process is ending no new set starts to move (the call then never returns; the process ends).
    /// </summary>
    /// <param name="moves">Renames only: the files are written in full before.</param>
    public void Uninterrupted(Action moves)
    {
        ArgumentNullException.ThrowIfNull(moves);
        lock (_gate)
        {
            while (_ending)
            {
                Monitor.Wait(_gate);
            }

            _moving++;
        }

        try
        {
            moves();
        }
        finally
        {
            lock (_gate)
            {
                _moving--;
                Monitor.PulseAll(_gate);
            }
        }
    }

    /// <summary>Releases the token's source; the process's instance lives as long as the process.</summary>
    public void Dispose() => _stopRequested.Dispose();

    /// <summary>
    /// Handles one Ctrl-C: the first requests the stop and keeps the process; a later one waits for the moves under way,
    /// lets no new one start, and lets the process end.
    /// </summary>
    /// <returns>Whether the process stays (the handler's <see cref="ConsoleCancelEventArgs.Cancel"/>).</returns>
    internal bool Press()
    {
        if (Interlocked.Increment(ref _presses) == 1)
        {
            // The first: the process stays; every command sees the stop at its next check.
            _stopRequested.Cancel();
            return true;
        }

        // The second (or a later one): wait for moves under way, start no more, then let the runtime end the process.
        lock (_gate)
        {
            _ending = true;
            while (_moving > 0)
            {
                Monitor.Wait(_gate);
            }
        }

        return false;
    }
}
