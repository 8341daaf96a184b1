namespace VolCast.Core.Calibration;

/// <summary>One row of a reliability table: forecasts whose predicted probability fell in [Lower, Upper).</summary>
/// <remarks>
/// The interval is Wilson's score interval for the observed frequency computed with the effective sample size
/// n_eff = n / h instead of n (see <see cref="WilsonInterval"/>); the last bin includes 1. Mean, frequency and
/// interval are null in an empty bin.
/// </remarks>
/// <param name="Index">Bin number from 0.</param>
/// <param name="Lower">Lower edge of the bin (inclusive).</param>
/// <param name="Upper">Upper edge of the bin (exclusive, except 1 for the last bin).</param>
/// <param name="Count">Number of forecasts in the bin.</param>
/// <param name="EffectiveCount">n_eff = Count / h used for the interval.</param>
/// <param name="MeanPredicted">Mean predicted probability in the bin.</param>
/// <param name="ObservedFrequency">Share of the bin's forecasts whose outcome happened.</param>
/// <param name="IntervalLower">Lower end of the Wilson interval for the observed frequency.</param>
/// <param name="IntervalUpper">Upper end of the Wilson interval for the observed frequency.</param>
public sealed record ReliabilityBin(
    int Index,
    double Lower,
    double Upper,
    int Count,
    double EffectiveCount,
    double? MeanPredicted,
    double? ObservedFrequency,
    double? IntervalLower,
    double? IntervalUpper);
