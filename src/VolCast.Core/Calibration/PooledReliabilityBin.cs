namespace VolCast.Core.Calibration;

/// <summary>One bin of a reliability curve pooled over strikes: every strike's forecasts whose probability fell in the bin.</summary>
/// <param name="Index">The bin's index, 0-based, as in <see cref="ReliabilityBin.Index"/>.</param>
/// <param name="Count">n = Σ n_k, the forecasts in the bin over all strikes.</param>
/// <param name="EffectiveCount">Σ n_eff,k, the strikes' effective counts summed.</param>
/// <param name="MeanPredicted">The n-weighted mean of the strikes' mean predicted probabilities.</param>
/// <param name="ObservedFrequency">The n-weighted mean of the strikes' observed frequencies, clamped to [0, 1].</param>
/// <param name="IntervalLower">Lower end of Wilson's interval for the observed frequency on the summed n_eff.</param>
/// <param name="IntervalUpper">Upper end of that interval.</param>
public sealed record PooledReliabilityBin(
    int Index,
    int Count,
    double EffectiveCount,
    double MeanPredicted,
    double ObservedFrequency,
    double IntervalLower,
    double IntervalUpper);
