namespace VolCast.Cli;

/// <summary>The exit codes of every command (docs/files.md#exit-codes).</summary>
internal static class ExitCodes
{
    /// <summary>The command did what was asked.</summary>
    public const int Success = 0;

    /// <summary>Something went wrong that is not the user's doing.</summary>
    public const int UnexpectedFailure = 1;

    /// <summary>The command line was wrong: an unknown option, a missing argument, a value out of range.</summary>
    public const int BadUsage = 2;

    /// <summary>An input file held data that could not be used.</summary>
    public const int BadInput = 3;

    /// <summary>The user pressed Ctrl-C: the run stopped and wrote no half-finished output (128 + SIGINT, as shells do).</summary>
    public const int Interrupted = 130;
}
