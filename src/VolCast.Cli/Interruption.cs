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
/// <para>One Ctrl-C can arrive as two signals a moment apart: <c>timeout -s INT</c> sends its signal to the command and
/// again to the command's process group, and so do supervisors that signal a process and its group. Signals within
/// <see cref="SamePress"/> of the first are taken as that first Ctrl-C, so such a stop stays a clean one; a person's second
/// press comes later than that.</para>
/// <para>Before <see cref="Program.Main"/> installs the handler (the runtime's start), a Ctrl-C ends the process with the system's
/// default, before any file is opened. In-process tests do not install it: their token stops the command instead, and
/// <see cref="Uninterrupted"/> then just runs its moves.</para>
/// </remarks>
internal sealed class Interruption : IDisposable
{
    /// <summary>How soon after the first Ctrl-C a signal is the same Ctrl-C delivered twice (common practice, no source: far
    /// below the quickest double press of a key, far above the microseconds between a signal to a process and to its group).</summary>
    public static readonly TimeSpan SamePress = TimeSpan.FromMilliseconds(50);

    private readonly CancellationTokenSource _stopRequested = new();
    private readonly object _gate = new();
    private readonly Func<TimeSpan> _now;
    private TimeSpan? _firstPress;
    private int _moving;
    private bool _ending;
    private bool _installed;

    /// <summary>Initializes an instance that reads the time from the system's monotonic clock.</summary>
    public Interruption()
        : this(() => System.Diagnostics.Stopwatch.GetElapsedTime(0))
    {
    }

    /// <summary>Initializes an instance that reads the time from <paramref name="now"/> (tests give their own clock).</summary>
    /// <param name="now">The time elapsed since any fixed moment.</param>
    internal Interruption(Func<TimeSpan> now)
    {
        _now = now;
    }

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
    /// Handles one Ctrl-C: the first (and a signal within <see cref="SamePress"/> of it) requests the stop and keeps the
    /// process; a later one waits for the moves under way, lets no new one start, and lets the process end.
    /// </summary>
    /// <returns>Whether the process stays (the handler's <see cref="ConsoleCancelEventArgs.Cancel"/>).</returns>
    internal bool Press()
    {
        var now = _now();
        lock (_gate)
        {
            if (_firstPress is not TimeSpan first)
            {
                _firstPress = now;
            }
            else if (now - first >= SamePress)
            {
                // The second (or a later one): wait for moves under way, start no more, then let the runtime end the process.
                _ending = true;
                while (_moving > 0)
                {
                    Monitor.Wait(_gate);
                }

                return false;
            }
        }

        // The first (or the same one delivered twice): the process stays; every command sees the stop at its next check.
        _stopRequested.Cancel();
        return true;
    }
}
