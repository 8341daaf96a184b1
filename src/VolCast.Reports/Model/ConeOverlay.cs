namespace VolCast.Reports.Model;

/// <summary>A point drawn on the volatility cone: the latest implied volatility or a forecast at its horizon.</summary>
/// <param name="Name">The label, e.g. <c>implied 30d</c> or a forecaster's spec.</param>
/// <param name="HorizonDays">The horizon in trading days.</param>
/// <param name="AnnualizedVolatility">The value as a decimal (0.20 = 20%).</param>
public sealed record ConeOverlay(string Name, int HorizonDays, double AnnualizedVolatility);
