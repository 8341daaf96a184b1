namespace VolCast.IO;

/// <summary>The inputs of a run after the suspect-value checks: what the run uses, what was added to its warnings, and the rows left out.</summary>
/// <param name="Prices">The prices the run uses (suspect bars removed with <see cref="SuspectAction.Drop"/>).</param>
/// <param name="Implied">The implied series the run uses, or null.</param>
/// <param name="Warnings">Warnings added by the checks against the prices and by dropping rows, to list after the readers' own.</param>
/// <param name="Rejected">Every row left out, bad rows and dropped suspect rows, in file and line order (rejected-rows.csv).</param>
public sealed record CheckedInputs(
    PriceLoad Prices,
    ImpliedLoad? Implied,
    IReadOnlyList<InputWarning> Warnings,
    IReadOnlyList<RejectedRow> Rejected);
