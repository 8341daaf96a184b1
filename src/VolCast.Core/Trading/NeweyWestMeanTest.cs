namespace VolCast.Core.Trading;

/// <summary>A test that the mean of a series is zero, with a Newey-West (Bartlett) standard error and a normal p-value.</summary>
/// <param name="Count">Number of observations.</param>
/// <param name="Lag">The Newey-West lag used (capped at the count − 1).</param>
/// <param name="Mean">The sample mean.</param>
/// <param name="StandardError">√(long-run variance / count); null with fewer than two observations or a zero variance.</param>
/// <param name="TStatistic">Mean ÷ standard error; null when the error is.</param>
/// <param name="PValue">Two-sided p-value from the standard normal; null when the statistic is.</param>
public sealed record NeweyWestMeanTest(int Count, int Lag, double Mean, double? StandardError, double? TStatistic, double? PValue);
