namespace VolCast.Core.Scoring;

/// <summary>
/// A Diebold-Mariano test of equal predictive accuracy on a loss differential d_t = L1_t − L2_t, with the
/// Harvey-Leybourne-Newbold small-sample correction.
/// </summary>
/// <remarks>
/// Sign convention: a negative <see cref="Statistic"/> means the first forecaster's mean loss is lower (it did
/// better); a positive one means the second did better. The statistic and p-value are absent (null) when the
/// long-run variance is zero, which happens only when the differential is constant (for example two identical
/// forecasts).
/// </remarks>
/// <param name="Count">Number of observations T.</param>
/// <param name="HorizonDays">Forecast horizon h used in the correction.</param>
/// <param name="Lag">Autocovariance lag L used in the long-run variance (h − 1 by default).</param>
/// <param name="MeanDifferential">d̄, the mean of L1 − L2; negative means the first forecaster's loss is lower.</param>
/// <param name="LongRunVariance">V̂ = γ̂_0 + 2 Σ w_j γ̂_j with the window used; the variance of d̄ is V̂ / T.</param>
/// <param name="RequestedWindow">The lag window asked for.</param>
/// <param name="WindowUsed">The lag window used: Bartlett when the rectangular estimate was not positive.</param>
/// <param name="HlnFactor">√[(T + 1 − 2h + h(h − 1)/T) / T], the Harvey-Leybourne-Newbold factor.</param>
/// <param name="UncorrectedStatistic">DM = d̄ / √(V̂ / T), before the correction.</param>
/// <param name="Statistic">DM* = DM × HLN factor, the statistic to report.</param>
/// <param name="PValue">Two-sided p-value of <paramref name="Statistic"/> from Student's t with T − 1 degrees of freedom.</param>
public sealed record DieboldMarianoResult(
    int Count,
    int HorizonDays,
    int Lag,
    double MeanDifferential,
    double LongRunVariance,
    LongRunVarianceWindow RequestedWindow,
    LongRunVarianceWindow WindowUsed,
    double HlnFactor,
    double? UncorrectedStatistic,
    double? Statistic,
    double? PValue)
{
    /// <summary>Gets a value indicating whether the rectangular estimate was not positive and Bartlett weights were used instead.</summary>
    public bool FellBackToBartlett => WindowUsed != RequestedWindow;

    /// <summary>Gets the long-run variance estimator used, in words for output files: <c>rectangular</c>, <c>bartlett</c>, or <c>bartlett (rectangular not positive)</c>.</summary>
    public string VarianceEstimator => FellBackToBartlett
        ? "bartlett (rectangular not positive)"
        : WindowUsed == LongRunVarianceWindow.Rectangular ? "rectangular" : "bartlett";
}
