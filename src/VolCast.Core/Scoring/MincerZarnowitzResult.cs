namespace VolCast.Core.Scoring;

/// <summary>
/// A Mincer-Zarnowitz regression on variance, RV² = a + b F² + e, with Newey-West standard errors and the Wald
/// test of an unbiased forecast (a = 0 and b = 1 jointly).
/// </summary>
/// <param name="Count">Number of observations T.</param>
/// <param name="Lag">Newey-West lag used (h − 1 for overlapping h-day targets).</param>
/// <param name="Intercept">a, in annualized variance units.</param>
/// <param name="Slope">b; 1 for an unbiased forecast.</param>
/// <param name="InterceptStandardError">HAC standard error of a.</param>
/// <param name="SlopeStandardError">HAC standard error of b.</param>
/// <param name="Wald">Wald χ²(2) statistic for a = 0, b = 1.</param>
/// <param name="WaldPValue">Its p-value, P(χ²(2) ≥ Wald); small values reject an unbiased forecast.</param>
/// <param name="RSquared">Centred R² of the regression.</param>
/// <param name="Regression">The underlying fit (coefficients [a, b] and their HAC covariance).</param>
public sealed record MincerZarnowitzResult(
    int Count,
    int Lag,
    double Intercept,
    double Slope,
    double InterceptStandardError,
    double SlopeStandardError,
    double Wald,
    double WaldPValue,
    double RSquared,
    HacRegressionResult Regression);
