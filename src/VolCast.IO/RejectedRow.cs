namespace VolCast.IO;

/// <summary>A row left out of the run, with why: written to rejected-rows.csv so that nothing is dropped silently.</summary>
/// <param name="File">The file, as the user gave it.</param>
/// <param name="Line">The 1-based physical line of the row.</param>
/// <param name="Date">The row's date, or null when the date itself could not be read.</param>
/// <param name="Kind"><see cref="BadRow"/> (failed a row check, left out with --skip-bad-rows) or <see cref="Suspect"/> (dropped with --suspect drop).</param>
/// <param name="Reason">Why the row was left out, as a sentence.</param>
public sealed record RejectedRow(string File, int Line, DateOnly? Date, string Kind, string Reason)
{
    /// <summary>The kind of a row that failed a row check (unparseable, low above high, a duplicate date).</summary>
    public const string BadRow = "bad row";

    /// <summary>The kind of a row that passed the row checks but was found suspect and dropped.</summary>
    public const string Suspect = "suspect";
}
