namespace VolCast.Core.Calibration;

/// <summary>The |z| ≤ 1 range's coverage on the dates of one regime (for example the top third of realized volatility).</summary>
/// <param name="Label">The regime's name: <c>calm</c>, <c>middle</c> or <c>stressed</c>.</param>
/// <param name="Lower">Smallest value of the regime variable in the regime.</param>
/// <param name="Upper">Largest value of the regime variable in the regime.</param>
/// <param name="Count">Dates with a forecast in the regime.</param>
/// <param name="ShareWithinOne">Share of those dates with |z| ≤ 1.</param>
/// <param name="NominalWithinOne">68.27%, the share a calibrated forecaster would show.</param>
/// <param name="IntervalLower">Lower end of the Wilson interval of the share on n_eff = Count / h.</param>
/// <param name="IntervalUpper">Upper end of the Wilson interval of the share on n_eff = Count / h.</param>
/// <param name="ZScale">√(mean z²) in the regime: above 1, ranges too narrow; below 1, too wide.</param>
public sealed record RegimeCoverage(
    string Label,
    double Lower,
    double Upper,
    int Count,
    double ShareWithinOne,
    double NominalWithinOne,
    double IntervalLower,
    double IntervalUpper,
    double ZScale);
