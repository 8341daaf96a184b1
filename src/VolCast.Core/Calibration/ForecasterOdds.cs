using System.Collections.Immutable;

namespace VolCast.Core.Calibration;

/// <summary>Every odds check of one forecaster: its probability calibration, its range coverage, the coverage by regime, the verdict and the pooled reliability curve.</summary>
/// <param name="Spec">The forecaster's spec, e.g. <c>implied</c> or <c>garch</c>.</param>
/// <param name="Calibration">How its probabilities of finishing above each strike held.</param>
/// <param name="Coverage">How its forecast move bands held.</param>
/// <param name="Regimes">The |z| ≤ 1 coverage in terciles of realized volatility RV(t, h_t); empty when too few dates or no realized value.</param>
/// <param name="Verdict">The plain-words verdict on its ranges, naming the regimes where they failed.</param>
/// <param name="InvalidValueCount">How many present values were not a volatility above zero and were counted as missing.</param>
/// <param name="PooledReliability">The reliability curve pooled over strikes (<see cref="ReliabilityPooling"/>); empty when it had no forecast.</param>
public sealed record ForecasterOdds(
    string Spec,
    ForecasterCalibration Calibration,
    CoverageResult Coverage,
    ImmutableArray<RegimeCoverage> Regimes,
    string Verdict,
    int InvalidValueCount,
    ImmutableArray<PooledReliabilityBin> PooledReliability);
