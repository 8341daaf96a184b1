using System.Collections.Immutable;
using VolCast.Core.Forecasters;

namespace VolCast.Core.Backtest;

/// <summary>One forecaster's forecasts on every date of a backtest, aligned with <see cref="BacktestResult.Dates"/>.</summary>
/// <param name="Spec">The canonical spec (for example <c>yang-zhang:21</c>, <c>adaptive:ewma</c>, <c>implied</c>); also the forecasts.csv column name.</param>
/// <param name="Kind">Configured, adaptive or implied.</param>
/// <param name="Values">Annualized volatility (decimal) forecast at each date's close for the horizon; null where the method had none.</param>
/// <param name="Counts">Events the session counted (refits, failed fits, fallbacks); <see cref="ForecasterCounts.None"/> for implied and adaptive.</param>
public sealed record ForecastSeries(string Spec, ForecastKind Kind, ImmutableArray<double?> Values, ForecasterCounts Counts);
