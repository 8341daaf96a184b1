using System.Collections.Immutable;

namespace VolCast.Core.Trading;

/// <summary>Statistics of one daily P&amp;L path (the every-signal ladder marked daily at the quoted implied), in vol points.</summary>
/// <remarks>
/// Sharpe = mean / standard deviation (divisor n − 1) × √A; Sortino = mean / √(mean of min(x, 0)²) × √A, A the trading
/// days per year; the drawdown is the largest fall of the cumulative path from its running peak (the start counts as a
/// peak of 0). A statistic that cannot be computed (a flat path) is null, never NaN.
/// </remarks>
/// <param name="Days">Days in the path.</param>
/// <param name="Total">Sum of the path.</param>
/// <param name="PnlPerYear">Total ÷ (days / A).</param>
/// <param name="Sharpe">Annualized Sharpe ratio; null when the path is flat.</param>
/// <param name="Sortino">Annualized Sortino ratio; null without a losing day.</param>
/// <param name="MaxDrawdown">Largest peak-to-trough fall of the cumulative path (0 or more).</param>
/// <param name="DrawdownPeak">Date of the peak before the largest fall; null when there was no fall.</param>
/// <param name="DrawdownTrough">Date of the trough of the largest fall; null when there was no fall.</param>
/// <param name="WorstMonth">First day of the worst calendar month.</param>
/// <param name="WorstMonthPnl">P&amp;L of that month.</param>
/// <param name="ByYear">P&amp;L by calendar year.</param>
public sealed record PathStatistics(
    int Days,
    double Total,
    double PnlPerYear,
    double? Sharpe,
    double? Sortino,
    double MaxDrawdown,
    DateOnly? DrawdownPeak,
    DateOnly? DrawdownTrough,
    DateOnly WorstMonth,
    double WorstMonthPnl,
    ImmutableArray<YearPnl> ByYear);
