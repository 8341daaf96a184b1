namespace VolCast.Core.Backtest;

/// <summary>
/// The full-sample loss of one lookback of one estimator family. IN-SAMPLE: choosing the best row after seeing the
/// whole sample is look-ahead; the honest choice is the adaptive forecaster.
/// </summary>
/// <param name="Family">The estimator family, for example <c>yang-zhang</c> or <c>ewma</c>.</param>
/// <param name="Spec">The forecaster spec of this lookback, for example <c>yang-zhang:21</c> or <c>ewma:0.94</c>.</param>
/// <param name="Count">Number of dates scored: the family's common dates (every lookback of the family has a forecast and the target is positive).</param>
/// <param name="Qlike">Mean QLIKE over those dates; null when there are none.</param>
/// <param name="MseVariance">Mean squared error on variance over those dates; null when there are none.</param>
/// <param name="RmseVolatility">Root mean squared error on volatility; null when there are none.</param>
/// <param name="IsBestInSample">True for the family's lowest mean QLIKE (in-sample, shown for reference only).</param>
public sealed record SweepRow(string Family, string Spec, int Count, double? Qlike, double? MseVariance, double? RmseVolatility, bool IsBestInSample);
