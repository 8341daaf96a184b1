using VolCast.Core.Forecasters;

namespace VolCast.Core.Backtest;

/// <summary>One series the backtest scores (implied, a configured forecaster or an adaptive choice), on every row of the history.</summary>
/// <param name="Spec">The canonical spec, for example <c>implied</c>, <c>ewma:0.94</c> or <c>adaptive:yang-zhang</c>.</param>
/// <param name="Kind">Implied, configured or adaptive.</param>
/// <param name="Values">The forecast at each row of the price history up to the end date; null where there was none.</param>
/// <param name="Counts">Events the session counted; <see cref="ForecasterCounts.None"/> for implied and adaptive.</param>
internal sealed record ScoredSeries(string Spec, ForecastKind Kind, double?[] Values, ForecasterCounts Counts);
