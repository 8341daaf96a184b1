namespace VolCast.Core.Backtest;

/// <summary>One row of the rule test: what implied minus the realized volatility that followed looked like on a set of dates.</summary>
/// <remarks>
/// Standard errors are Newey-West (Bartlett, lag h − 1) standard errors of the mean, √(LRV / n), computed on the
/// signalled dates in date order; on sparse signals this treats neighbouring signalled dates as h-overlapping, which
/// errs on the wide side.
/// </remarks>
/// <param name="Source">Spec of the forecast that made the signal.</param>
/// <param name="Signal">Which dates: all, sell or buy signals.</param>
/// <param name="Count">Number of dates.</param>
/// <param name="HitRate">For sell and all dates the share with IV &gt; RV; for buy the share with IV &lt; RV (the side that would have been right); null when no dates.</param>
/// <param name="HitRateStandardError">HAC standard error of the hit rate; null when not computable.</param>
/// <param name="MeanVolatilityGap">Mean IV − RV in volatility points (decimal); null when no dates.</param>
/// <param name="MeanVolatilityGapStandardError">HAC standard error of that mean; null when not computable.</param>
/// <param name="MeanVarianceGap">Mean IV² − RV² in annualized variance points; null when no dates.</param>
/// <param name="MeanVarianceGapStandardError">HAC standard error of that mean; null when not computable.</param>
public sealed record RuleTestRow(
    string Source,
    RuleSignal Signal,
    int Count,
    double? HitRate,
    double? HitRateStandardError,
    double? MeanVolatilityGap,
    double? MeanVolatilityGapStandardError,
    double? MeanVarianceGap,
    double? MeanVarianceGapStandardError);
