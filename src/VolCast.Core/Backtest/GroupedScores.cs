using System.Collections.Immutable;
using System.Globalization;
using VolCast.Core.Data;
using VolCast.Core.Scoring;

namespace VolCast.Core.Backtest;

/// <summary>
/// Splits the common dates of a backtest by calendar year, by the volatility regime known at the forecast date and by
/// whether the forecast window held an event, and tests each forecaster against implied within each group.
/// </summary>
/// <remarks>
/// <para>
/// Each group's test is the Diebold-Mariano test of the full-length series z_t = d_t·1{t in group} over every common
/// date, with the run's lag (h − 1, Bartlett) and the Harvey-Leybourne-Newbold correction: its mean is the group's
/// mean differential scaled by the group's share of the dates, and its long-run variance keeps the autocovariances of
/// overlapping windows across the group's edges, which a test on the group's dates alone, glued together, would not.
/// </para>
/// <para>
/// Regimes: the trailing 63-day close-to-close volatility at the forecast date (sample standard deviation of the 63 log
/// returns ending there, annualized) against the terciles of the same quantity on that date and every earlier date
/// (type-7 quantiles), so the cut-offs use no later data. A date gets a regime only once the history before it holds
/// <see cref="RegimeHistoryDays"/> returns. Calm is at or below the lower tercile, stressed above the upper one.
/// </para>
/// <para>
/// Events: the window of forecast date t spans the calendar dates after t up to and including the last day of its
/// realized window, so an event on a weekend falls in the window that covers it.
/// </para>
/// </remarks>
public static class GroupedScores
{
    /// <summary>Gets the trailing window of the regime's realized volatility, in trading days.</summary>
    public const int RegimeWindowDays = 63;

    /// <summary>Gets the returns of history a date needs before it gets a regime.</summary>
    public const int RegimeHistoryDays = 252;

    /// <summary>Gets the regime names, calmest first.</summary>
    public static ImmutableArray<string> RegimeNames { get; } = ["calm", "middle", "stressed"];

    /// <summary>The group of windows that held a scheduled event.</summary>
    public const string ScheduledGroup = "with a scheduled event";

    /// <summary>The group of windows that held an event added after the fact.</summary>
    public const string AddedGroup = "with an event added after the fact";

    /// <summary>The group of windows that held no event.</summary>
    public const string NoEventGroup = "without events";

    /// <summary>Computes the groups of a backtest.</summary>
    /// <param name="result">The backtest; without implied or common dates the result is empty.</param>
    /// <param name="prices">The price history the backtest ran on.</param>
    /// <param name="events">The events, or null for none (the events grouping is then left out).</param>
    /// <returns>The groups.</returns>
    /// <exception cref="ArgumentException">The result's dates are not a run of the price history's dates.</exception>
    public static GroupedResults Compute(BacktestResult result, PriceHistory prices, IReadOnlyList<MarketEvent>? events = null)
    {
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(prices);
        var sortedEvents = (events ?? []).OrderBy(e => e.Date).ToImmutableArray();
        if (!result.HasImplied || result.Common is not { Count: > 1 } common || result.Dates.IsEmpty)
        {
            return GroupedResults.Empty with { Events = sortedEvents };
        }

        var offset = prices.Dates.IndexOf(result.Dates[0]);
        if (offset < 0 || offset + result.Dates.Length > prices.Count || prices.Dates[offset + result.Dates.Length - 1] != result.Dates[^1])
        {
            throw new ArgumentException("The result's forecast dates are not a run of the price history's dates; pass the history the backtest ran on.", nameof(prices));
        }

        var dates = new List<int>(common.Count);
        for (var i = 0; i < result.Dates.Length; i++)
        {
            if (common.OnCommonDates[i])
            {
                dates.Add(i);
            }
        }

        var regimes = Regimes(prices, offset, dates, result.Settings.AnnualizationFactor);
        var labels = new List<(string Grouping, string Group, bool[] In)>();
        foreach (var year in dates.Select(i => result.Dates[i].Year).Distinct())
        {
            labels.Add(("year", year.ToString(CultureInfo.InvariantCulture), [.. dates.Select(i => result.Dates[i].Year == year)]));
        }

        for (var r = 0; r < RegimeNames.Length; r++)
        {
            var k = r;
            labels.Add(("regime", RegimeNames[r], [.. regimes.Select(x => x == k)]));
        }

        var eventsInWindows = 0;
        if (events is not null)
        {
            var (scheduled, added, counted) = EventWindows(result, prices, offset, dates, sortedEvents);
            eventsInWindows = counted;
            labels.Add(("events", ScheduledGroup, scheduled));
            labels.Add(("events", AddedGroup, added));
            labels.Add(("events", NoEventGroup, [.. scheduled.Select((s, j) => !s && !added[j])]));
        }

        var rows = ImmutableArray.CreateBuilder<GroupComparisonRow>();
        var horizon = result.HacLag + 1;
        var specs = common.Rows.Where(r => r.Kind != ForecastKind.Implied).Select(r => r.Spec).ToList();
        var forecasts = specs.Select(s => result.Forecasts.First(f => f.Spec == s).Values).ToList();
        foreach (var (grouping, group, inGroup) in labels)
        {
            var size = inGroup.Count(b => b);
            if (size == 0)
            {
                continue;
            }

            for (var s = 0; s < specs.Count; s++)
            {
                rows.Add(Row(grouping, group, specs[s], result, forecasts[s], dates, inGroup, size, horizon));
            }
        }

        return new GroupedResults(rows.ToImmutable(), dates.Count, regimes.Count(r => r < 0), sortedEvents, eventsInWindows);
    }

    private static GroupComparisonRow Row(string grouping, string group, string spec, BacktestResult result, ImmutableArray<double?> forecast, List<int> dates, bool[] inGroup, int size, int horizon)
    {
        var n = dates.Count;
        var z = new double[n];
        var f = 0.0;
        var iv = 0.0;
        for (var j = 0; j < n; j++)
        {
            if (!inGroup[j])
            {
                continue;
            }

            var i = dates[j];
            var rv = result.Realized[i]!.Value;
            var lf = Losses.Qlike(rv, forecast[i]!.Value);
            var li = Losses.Qlike(rv, result.Implied[i]!.Value);
            f += lf;
            iv += li;
            z[j] = lf - li;
        }

        DieboldMarianoResult? dm = null;
        var lag = horizon - 1;
        if (size >= 2 && n >= lag + 2 && n + 1.0 - (2.0 * horizon) + (horizon * (horizon - 1.0) / n) > 0)
        {
            dm = DieboldMariano.TestWithLag(z, horizon, lag, LongRunVarianceWindow.Bartlett);
        }

        return new GroupComparisonRow(grouping, group, spec, size, f / size, iv / size, dm);
    }

    /// <summary>Each common date's regime (0 calm, 1 middle, 2 stressed) or −1 when too early.</summary>
    internal static int[] Regimes(PriceHistory prices, int offset, List<int> dates, double annualization)
    {
        var trailing = TrailingVolatility(prices, annualization);
        var regimes = new int[dates.Count];
        var sorted = new List<double>();
        var next = RegimeWindowDays;
        for (var j = 0; j < dates.Count; j++)
        {
            var row = offset + dates[j];

            // The cut-offs at row use the trailing volatility of every row up to it, and nothing after.
            for (; next <= row; next++)
            {
                var at = sorted.BinarySearch(trailing[next]);
                sorted.Insert(at < 0 ? ~at : at, trailing[next]);
            }

            if (row < RegimeHistoryDays)
            {
                regimes[j] = -1;
                continue;
            }

            var span = System.Runtime.InteropServices.CollectionsMarshal.AsSpan(sorted);
            var low = Cone.Quantile.Type7(span, 1.0 / 3);
            var high = Cone.Quantile.Type7(span, 2.0 / 3);
            var v = trailing[row];
            regimes[j] = v <= low ? 0 : v > high ? 2 : 1;
        }

        return regimes;
    }

    /// <summary>The sample standard deviation of the 63 log returns ending at each row, annualized; 0 before row 63.</summary>
    internal static double[] TrailingVolatility(PriceHistory prices, double annualization)
    {
        var r = Returns.LogReturns(prices.Close);
        var vol = new double[prices.Count];
        double sum = 0, sq = 0;
        const int w = RegimeWindowDays;
        for (var i = 0; i < r.Length; i++)
        {
            sum += r[i];
            sq += r[i] * r[i];
            if (i >= w)
            {
                sum -= r[i - w];
                sq -= r[i - w] * r[i - w];
            }

            if (i >= w - 1)
            {
                var variance = Math.Max(0, (sq - (sum * sum / w)) / (w - 1));
                vol[i + 1] = Math.Sqrt(annualization * variance);
            }
        }

        return vol;
    }

    private static (bool[] Scheduled, bool[] Added, int Counted) EventWindows(BacktestResult result, PriceHistory prices, int offset, List<int> dates, ImmutableArray<MarketEvent> events)
    {
        var scheduled = new bool[dates.Count];
        var added = new bool[dates.Count];
        var used = new bool[events.Length];
        var eventDates = events.Select(e => e.Date).ToArray();
        for (var j = 0; j < dates.Count; j++)
        {
            var i = dates[j];
            var row = offset + i;
            var end = prices.Dates[Math.Min(prices.Count - 1, row + result.WindowDays[i]!.Value)];
            var start = prices.Dates[row];

            // The first event after the forecast date, then every one up to the window's last day.
            var k = Array.BinarySearch(eventDates, start.AddDays(1));
            k = k < 0 ? ~k : k;
            while (k > 0 && eventDates[k - 1] > start)
            {
                k--;
            }

            for (; k < events.Length && eventDates[k] <= end; k++)
            {
                used[k] = true;
                if (events[k].Scheduled)
                {
                    scheduled[j] = true;
                }
                else
                {
                    added[j] = true;
                }
            }
        }

        return (scheduled, added, used.Count(u => u));
    }
}
