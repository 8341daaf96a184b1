using System.Collections.Immutable;

namespace VolCast.Core.Backtest;

/// <summary>Every forecaster against implied by calendar year, by volatility regime and, with an events file, by whether the window held an event.</summary>
/// <param name="Rows">The rows: years in order, then calm, middle, stressed, then the event groups; forecasters in ranking order within each group.</param>
/// <param name="CommonDates">The common dates the groups split (see <see cref="CommonDateRanking"/>).</param>
/// <param name="DatesWithoutRegime">Common dates too early for a regime (fewer than <see cref="GroupedScores.RegimeHistoryDays"/> days of history before them).</param>
/// <param name="Events">The events given, in date order; empty without an events file.</param>
/// <param name="EventsInWindows">How many of the events fall inside at least one scored window.</param>
public sealed record GroupedResults(ImmutableArray<GroupComparisonRow> Rows, int CommonDates, int DatesWithoutRegime, ImmutableArray<MarketEvent> Events, int EventsInWindows)
{
    /// <summary>Gets an empty result (no implied series, or no common dates).</summary>
    public static GroupedResults Empty { get; } = new([], 0, 0, [], 0);
}
