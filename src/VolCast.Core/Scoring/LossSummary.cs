namespace VolCast.Core.Scoring;

/// <summary>Mean losses of one forecaster over a set of aligned observations.</summary>
/// <param name="Count">Number of observations scored.</param>
/// <param name="Bias">Mean of F − RV, in volatility points (decimal, 0.01 = one vol point); positive means over-forecasting.</param>
/// <param name="MaeVolatility">Mean absolute error |F − RV| in volatility (decimal).</param>
/// <param name="RmseVolatility">Root mean squared error √mean((F − RV)²) in volatility (decimal).</param>
/// <param name="MseVariance">Mean squared error on annualized variance, mean((F² − RV²)²).</param>
/// <param name="Qlike">Mean normalized QLIKE, mean(RV²/F² − ln(RV²/F²) − 1); at least 0.</param>
public sealed record LossSummary(
    int Count,
    double Bias,
    double MaeVolatility,
    double RmseVolatility,
    double MseVariance,
    double Qlike);
