namespace VolCast.IO;

/// <summary>
/// A value that passed the row checks but looks wrong: an isolated spike, a stale run, a value far outside the
/// realized range, a change of scale, an outage. With <see cref="SuspectAction.Drop"/> the row of <see cref="Date"/> is removed.
/// </summary>
/// <param name="File">The file, as the user gave it.</param>
/// <param name="Line">The 1-based physical line it concerns, or null when it concerns a stretch or the whole file.</param>
/// <param name="Date">The date of the row that would be dropped, or null when no single row can be dropped to repair it (a change of scale, an outage, a late start).</param>
/// <param name="Reason">What was found, as a sentence.</param>
public sealed record SuspectFinding(string File, int? Line, DateOnly? Date, string Reason)
{
    /// <summary>Gets whether dropping the row of <see cref="Date"/> removes the problem.</summary>
    public bool Droppable => Date is not null;

    /// <summary>Formats the finding as "file, line N: reason".</summary>
    /// <returns>The finding as one line of text.</returns>
    public override string ToString() => new InputWarning(File, Line, Reason).ToString();
}
