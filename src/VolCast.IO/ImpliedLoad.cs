using VolCast.Core.Data;

namespace VolCast.IO;

/// <summary>The result of loading an implied-volatility file.</summary>
/// <param name="Series">The validated series as decimals (0.20 = 20%), sorted by date.</param>
/// <param name="Warnings">Warnings raised while loading, including the inferred unit when it was inferred.</param>
/// <param name="UnitUsed">The unit the file's values were read in: <see cref="ImpliedUnit.Percent"/> or <see cref="ImpliedUnit.Decimal"/>, never <see cref="ImpliedUnit.Infer"/>.</param>
/// <param name="UnitInferred">Whether the unit was inferred from the values rather than declared.</param>
/// <param name="Sha256">Lowercase hexadecimal SHA-256 of the file's bytes, for run.json traceability.</param>
public sealed record ImpliedLoad(
    ImpliedSeries Series,
    IReadOnlyList<InputWarning> Warnings,
    ImpliedUnit UnitUsed,
    bool UnitInferred,
    string Sha256)
{
    /// <summary>Gets the suspect values found (spikes, stale runs, changes of scale); each is also in <see cref="Warnings"/>.</summary>
    public IReadOnlyList<SuspectFinding> Suspects { get; init; } = [];

    /// <summary>Gets the rows left out because they failed a row check (only with <see cref="DataChecks.SkipBadRows"/>).</summary>
    public IReadOnlyList<RejectedRow> Rejected { get; init; } = [];

    /// <summary>Gets each value's physical line in the file, in the order of <see cref="Series"/> (empty when unknown).</summary>
    public IReadOnlyList<int> Lines { get; init; } = [];
}
