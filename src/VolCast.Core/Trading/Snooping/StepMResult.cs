using System.Collections.Immutable;

namespace VolCast.Core.Trading.Snooping;

/// <summary>
/// Romano &amp; Wolf's (2005) StepM: the rules that beat the benchmark with the familywise error rate held at the level,
/// found step down.
/// </summary>
/// <param name="Level">The familywise error rate α.</param>
/// <param name="Rejected">Indices of the rules whose null (no edge over the benchmark) is rejected, in the order they were rejected (within a step, by decreasing t-statistic).</param>
/// <param name="RejectedAtStep">For each entry of <paramref name="Rejected"/>, the step (1, 2, …) that rejected it.</param>
/// <param name="CriticalValues">The critical value of each step: the 1 − α bootstrap quantile of the largest studentized deviation over the rules not yet rejected; the last step is the one that rejected nothing more (or left no rule).</param>
public sealed record StepMResult(
    double Level,
    ImmutableArray<int> Rejected,
    ImmutableArray<int> RejectedAtStep,
    ImmutableArray<double> CriticalValues);
