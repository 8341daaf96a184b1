namespace VolCast.IO;

/// <summary>How the readers treat rows that fail a row check and rows that look wrong.</summary>
/// <param name="Suspect">What to do with suspect rows (default <see cref="SuspectAction.Warn"/>).</param>
/// <param name="SkipBadRows">Whether rows failing a row check are left out (and listed) instead of refusing the file.</param>
public sealed record DataChecks(SuspectAction Suspect = SuspectAction.Warn, bool SkipBadRows = false)
{
    /// <summary>At most this many bad rows or findings are listed in one refusal message; the rest are counted.</summary>
    public const int MaxListed = 20;

    /// <summary>Gets the defaults: warn about suspect rows, refuse a file with bad rows.</summary>
    public static DataChecks Default { get; } = new();
}
