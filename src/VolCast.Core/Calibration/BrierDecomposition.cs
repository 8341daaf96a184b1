namespace VolCast.Core.Calibration;

/// <summary>
/// The Brier score and its Murphy (1973) decomposition over predicted-probability bins, with the two within-bin
/// terms that make it exact for any forecasts.
/// </summary>
/// <remarks>
/// With N forecasts f_i of binary outcomes o_i, bins k holding n_k forecasts with mean forecast f̄_k and observed
/// frequency ō_k, and ō the overall frequency:
/// REL = Σ n_k (f̄_k − ō_k)² / N, RES = Σ n_k (ō_k − ō)² / N, UNC = ō(1 − ō),
/// WBV = Σ_k Σ_{i∈k} (f_i − f̄_k)² / N, WBC = 2 Σ_k Σ_{i∈k} (f_i − f̄_k)(o_i − ō_k) / N, and the identity
/// Brier = REL − RES + UNC + WBV − WBC holds exactly. When the forecasts within each bin are equal, WBV = WBC = 0
/// and it is Murphy's three-term form. Lower reliability is better (0 is perfectly calibrated); higher resolution is
/// better.
/// </remarks>
/// <param name="Count">N, the number of forecasts scored.</param>
/// <param name="Brier">(1/N) Σ (f_i − o_i)², computed directly.</param>
/// <param name="Reliability">REL, the calibration term (bin-mean version).</param>
/// <param name="Resolution">RES, how far the bins' observed frequencies spread from the base rate.</param>
/// <param name="Uncertainty">UNC = ō(1 − ō), the base rate's variance.</param>
/// <param name="WithinBinVariance">WBV, the spread of forecasts inside their bins.</param>
/// <param name="WithinBinCovariance">WBC, twice the within-bin covariance of forecasts and outcomes.</param>
public sealed record BrierDecomposition(
    int Count,
    double Brier,
    double Reliability,
    double Resolution,
    double Uncertainty,
    double WithinBinVariance,
    double WithinBinCovariance);
