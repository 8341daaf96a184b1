namespace VolCast.Core.Scoring;

/// <summary>
/// An encompassing regression on variance, RV² = a + b IV² + c F² + e, with Newey-West standard errors: does the
/// forecast F add information beyond implied IV (c ≠ 0), and does implied add information beyond the forecast (b ≠ 0)?
/// </summary>
/// <param name="Count">Number of observations T.</param>
/// <param name="Lag">Newey-West lag used.</param>
/// <param name="Intercept">a, in annualized variance units.</param>
/// <param name="ImpliedSlope">b, the weight on implied variance IV².</param>
/// <param name="ForecastSlope">c, the weight on the forecast variance F².</param>
/// <param name="ImpliedStandardError">HAC standard error of b.</param>
/// <param name="ForecastStandardError">HAC standard error of c.</param>
/// <param name="ImpliedT">t statistic of b against the null b = 0.</param>
/// <param name="ImpliedPValue">Two-sided p-value of <paramref name="ImpliedT"/>, Student's t with T − 3 degrees of freedom.</param>
/// <param name="ForecastT">t statistic of c against the null c = 0.</param>
/// <param name="ForecastPValue">Two-sided p-value of <paramref name="ForecastT"/>; small values say the forecast adds information beyond implied.</param>
/// <param name="RSquared">Centred R² of the regression.</param>
/// <param name="Regression">The underlying fit (coefficients [a, b, c] and their HAC covariance).</param>
public sealed record EncompassingResult(
    int Count,
    int Lag,
    double Intercept,
    double ImpliedSlope,
    double ForecastSlope,
    double ImpliedStandardError,
    double ForecastStandardError,
    double ImpliedT,
    double ImpliedPValue,
    double ForecastT,
    double ForecastPValue,
    double RSquared,
    HacRegressionResult Regression);
