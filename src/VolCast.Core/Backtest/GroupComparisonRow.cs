using VolCast.Core.Scoring;

namespace VolCast.Core.Backtest;

/// <summary>One forecaster against implied on one group of forecast dates (a calendar year, a volatility regime, windows with or without events).</summary>
/// <param name="Grouping">What the dates are grouped by: <c>year</c>, <c>regime</c> or <c>events</c>.</param>
/// <param name="Group">The group, for example <c>2020</c>, <c>stressed</c> or <c>with a scheduled event</c>.</param>
/// <param name="Spec">The forecaster's spec.</param>
/// <param name="Count">Common dates in the group.</param>
/// <param name="Qlike">The forecaster's mean QLIKE on them.</param>
/// <param name="ImpliedQlike">Implied's mean QLIKE on them.</param>
/// <param name="Dm">
/// Diebold-Mariano on the full-length series d_t·1{t in group} over all common dates (d_t = L(forecaster) − L(implied)),
/// so the long-run variance sees the overlap of windows across the group's edges; negative favours the forecaster.
/// Null when it cannot be computed (too few dates, or a constant differential).
/// </param>
public sealed record GroupComparisonRow(string Grouping, string Group, string Spec, int Count, double Qlike, double ImpliedQlike, DieboldMarianoResult? Dm);
