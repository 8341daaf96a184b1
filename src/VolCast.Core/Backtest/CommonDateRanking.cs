using System.Collections.Immutable;

namespace VolCast.Core.Backtest;

/// <summary>
/// Every compared forecaster and implied scored on one date set, the dates all of them share, so that the ranking, the
/// verdict, the head-to-head and the premium are measured on the same dates and cannot contradict each other.
/// </summary>
/// <remarks>
/// The members are those of the model confidence set: a forecaster with forecasts on fewer than half of the scored dates
/// (one that starts late, such as a long lookback or an adaptive choice on a short history) would shrink the common
/// set too far, so it is left out of it and keeps only its own-date figures (<see cref="ForecasterMetrics"/>).
/// </remarks>
/// <param name="Count">Number of common dates.</param>
/// <param name="OnCommonDates">For each date of <see cref="BacktestResult.Dates"/>, whether it is a common date.</param>
/// <param name="LeftOut">Forecasters left out of the common set because they have too few dates.</param>
/// <param name="Rows">Every member (implied included) on the common dates, lowest QLIKE first; ties keep the order of the run.</param>
public sealed record CommonDateRanking(int Count, ImmutableArray<bool> OnCommonDates, ImmutableArray<string> LeftOut, ImmutableArray<CommonDateRow> Rows);
