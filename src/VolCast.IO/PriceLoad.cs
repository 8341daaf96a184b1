using VolCast.Core.Data;

namespace VolCast.IO;

/// <summary>The result of loading a price file: the history, what was noticed on the way, and how to trace the input.</summary>
/// <param name="History">The validated history, sorted by date; prices already scaled by adj_close / close when that column was present.</param>
/// <param name="Warnings">Warnings raised while loading, in the order they were found.</param>
/// <param name="RowsRead">How many data rows were read (blank lines not counted).</param>
/// <param name="AdjustedCloseApplied">Whether an adj_close column was present and used to scale open, high, low and close.</param>
/// <param name="Sha256">Lowercase hexadecimal SHA-256 of the file's bytes, for run.json traceability.</param>
public sealed record PriceLoad(
    PriceHistory History,
    IReadOnlyList<InputWarning> Warnings,
    int RowsRead,
    bool AdjustedCloseApplied,
    string Sha256)
{
    /// <summary>Gets the suspect values found (spikes, changes of scale, large one-day moves); each is also in <see cref="Warnings"/>.</summary>
    public IReadOnlyList<SuspectFinding> Suspects { get; init; } = [];

    /// <summary>Gets the rows left out because they failed a row check (only with <see cref="DataChecks.SkipBadRows"/>).</summary>
    public IReadOnlyList<RejectedRow> Rejected { get; init; } = [];
}
