using System.Collections.Immutable;

namespace VolCast.Core.Calibration;

/// <summary>How well one forecaster's probabilities of finishing above one strike (K = m·S_t) held.</summary>
/// <param name="Moneyness">m = K / S_t.</param>
/// <param name="Decomposition">Brier score and its decomposition over the bins.</param>
/// <param name="LogScore">−(1/N) Σ [o ln p + (1 − o) ln(1 − p)] with p clipped to [ε, 1 − ε]; lower is better.</param>
/// <param name="ClippedCount">How many predicted probabilities were clipped for the log score.</param>
/// <param name="MeanPredicted">Mean predicted probability over all dates.</param>
/// <param name="ObservedFrequency">Share of dates on which S_{t+h} &gt; K.</param>
/// <param name="Bins">The reliability table, one row per bin.</param>
public sealed record StrikeCalibration(
    double Moneyness,
    BrierDecomposition Decomposition,
    double LogScore,
    int ClippedCount,
    double MeanPredicted,
    double ObservedFrequency,
    ImmutableArray<ReliabilityBin> Bins);
