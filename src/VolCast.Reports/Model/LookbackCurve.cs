namespace VolCast.Reports.Model;

/// <summary>The average loss of one estimator family at each lookback, with the lookbacks chosen out of sample.</summary>
/// <param name="Family">The estimator family, e.g. <c>yang-zhang</c>.</param>
/// <param name="LookbackDays">The lookbacks tried, in trading days, increasing.</param>
/// <param name="MeanLoss">The mean QLIKE loss at each lookback (same length as <paramref name="LookbackDays"/>).</param>
/// <param name="ChosenLookbackDays">The lookbacks the walk-forward selection picked (each one of <paramref name="LookbackDays"/>), in any order, repeats allowed.</param>
internal sealed record LookbackCurve(
    string Family,
    IReadOnlyList<int> LookbackDays,
    IReadOnlyList<double> MeanLoss,
    IReadOnlyList<int> ChosenLookbackDays);
