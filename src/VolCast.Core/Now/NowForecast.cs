namespace VolCast.Core.Now;

/// <summary>One forecaster's reading on the last date: its forecast, implied minus it, and where that gap stands among earlier dates.</summary>
/// <param name="Spec">The forecaster's spec.</param>
/// <param name="Forecast">Its forecast made at the last date's close (decimal annualized volatility), or null when it has none.</param>
/// <param name="ImpliedMinusForecast">Implied minus the forecast on the last date (decimal), or null without both.</param>
/// <param name="Percentile">
/// The percentile (0 to 100) of today's implied minus forecast among the same quantity on every earlier forecast date
/// that has both: 100 × (dates below + half the dates equal) / dates; null without an earlier date or without today's gap.
/// </param>
/// <param name="EarlierDates">The number of earlier dates the percentile is taken over.</param>
public sealed record NowForecast(string Spec, double? Forecast, double? ImpliedMinusForecast, double? Percentile, int EarlierDates);
