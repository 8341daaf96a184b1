namespace VolCast.IO;

/// <summary>
/// Something odd in an input file that did not stop the load (rows sorted, a gap in the dates, a stale
/// stretch, ignored columns, an inferred unit). Warnings are counted and repeated in the report.
/// </summary>
/// <param name="File">The file the warning concerns, as the user gave it.</param>
/// <param name="Line">The 1-based physical line it concerns, or null when it concerns the whole file.</param>
/// <param name="Message">What was noticed and what was done about it, as a sentence.</param>
public sealed record InputWarning(string File, int? Line, string Message)
{
    /// <summary>Formats the warning as "file, line N: message".</summary>
    /// <returns>The warning as one line of text.</returns>
    public override string ToString() =>
        Line is int l
            ? FormattableString.Invariant($"{File}, line {l}: {Message}")
            : FormattableString.Invariant($"{File}: {Message}");
}
