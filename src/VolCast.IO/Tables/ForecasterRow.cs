using VolCast.Core.Backtest;

namespace VolCast.IO.Tables;

/// <summary>One row of the forecaster table: the forecaster's scores and, when it produced a series, its fit counts.</summary>
/// <param name="Metrics">The scores and tests.</param>
/// <param name="Series">The forecast series (null for implied).</param>
public sealed record ForecasterRow(ForecasterMetrics Metrics, ForecastSeries? Series);
