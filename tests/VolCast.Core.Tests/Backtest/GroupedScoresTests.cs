using VolCast.Core.Backtest;
using VolCast.Core.Data;
using VolCast.Core.Scoring;
using VolCast.Core.Tests.Forecasters;

namespace VolCast.Core.Tests.Backtest;

public sealed class GroupedScoresTests
{
    private static BacktestSettings Settings(int h) => new()
    {
        Horizon = BacktestHorizon.Days(h),
        Forecasters = ["close-to-close:21", "ewma:0.94"],
        Sweep = false,
        McsReplications = 50,
    };

    [Fact]
    public void Compute_ByYear_GroupTestIsTheDieboldMarianoOfTheFullLengthMaskedDifferential()
    {
        // The group's test is defined on z_t = d_t·1{t in group} over every common date (so overlapping windows across the
        // group's edges stay in the long-run variance); recomputed here from the result's own series and losses.
        var (prices, implied) = BacktestData.GarchWithTrueImplied(1400, 5, 11);
        var result = Backtester.Run(prices, implied, Settings(5));
        var groups = GroupedScores.Compute(result, prices);
        var common = Enumerable.Range(0, result.Dates.Length).Where(i => result.Common!.OnCommonDates[i]).ToList();
        var years = groups.Rows.Where(r => r.Grouping == "year" && r.Spec == "ewma:0.94").ToList();
        Assert.Equal(common.Count, years.Sum(r => r.Count));
        Assert.Equal(common.Select(i => result.Dates[i].Year).Distinct().Count(), years.Count);

        var ewma = result.Forecasts.Single(f => f.Spec == "ewma:0.94").Values;
        foreach (var row in years)
        {
            var year = int.Parse(row.Group, System.Globalization.CultureInfo.InvariantCulture);
            var z = common.Select(i => result.Dates[i].Year == year
                ? Losses.Qlike(result.Realized[i]!.Value, ewma[i]!.Value) - Losses.Qlike(result.Realized[i]!.Value, result.Implied[i]!.Value)
                : 0.0).ToArray();
            var inYear = common.Where(i => result.Dates[i].Year == year).ToList();
            var expected = DieboldMariano.TestWithLag(z, 5, 4, LongRunVarianceWindow.Bartlett);
            Assert.Equal(expected.Statistic, row.Dm!.Statistic);
            Assert.Equal(inYear.Average(i => Losses.Qlike(result.Realized[i]!.Value, ewma[i]!.Value)), row.Qlike, 12);
        }
    }

    [Fact]
    public void Regimes_AlteringPricesAfterADate_LeavesEveryRegimeUpToItUnchanged()
    {
        // No look-ahead: the terciles at a date use the trailing volatility of that date and earlier ones only.
        var dates = ForecastData.Dates(900);
        var random = new Random(5);
        var close = new double[900];
        close[0] = 100;
        for (var t = 1; t < close.Length; t++)
        {
            close[t] = close[t - 1] * Math.Exp(0.01 * Gaussian.Next(random));
        }

        var altered = (double[])close.Clone();
        for (var t = 600; t < altered.Length; t++)
        {
            altered[t] = close[t] * Math.Exp(0.05 * (t - 599));
        }

        var rows = Enumerable.Range(0, 900).ToList();
        var a = GroupedScores.Regimes(PriceHistory.FromCloses(dates, close), 0, rows, 252);
        var b = GroupedScores.Regimes(PriceHistory.FromCloses(dates, altered), 0, rows, 252);
        Assert.Equal(a.Take(600), b.Take(600));
        Assert.All(a.Take(GroupedScores.RegimeHistoryDays), r => Assert.Equal(-1, r));
        Assert.Contains(0, a);
        Assert.Contains(2, a);
    }

    [Fact]
    public void Compute_SimulatedJumpDaysAsEvents_WindowsWithEventsShowTheLargerLosses()
    {
        // Simulation with known jump days (invented data): 15% a year of Gaussian noise plus a 6% move every 50 days;
        // implied quotes the diffusion's 15% throughout. Windows that hold a jump realize far more than 15%, so every
        // forecaster's and implied's QLIKE is larger there than in windows without one.
        const int n = 1500;
        var dates = ForecastData.Dates(n);
        var random = new Random(21);
        var close = new double[n];
        close[0] = 100;
        var events = new List<MarketEvent>();
        for (var t = 1; t < n; t++)
        {
            var jump = t % 50 == 0 ? (random.Next(2) == 0 ? -0.06 : 0.06) : 0;
            close[t] = close[t - 1] * Math.Exp((0.15 / Math.Sqrt(252) * Gaussian.Next(random)) + jump);
            if (jump != 0)
            {
                events.Add(new MarketEvent(dates[t], "jump", t % 100 == 0));
            }
        }

        var prices = PriceHistory.FromCloses(dates, close);
        var implied = new ImpliedSeries(dates, [.. Enumerable.Repeat(0.15, n)]);
        var result = Backtester.Run(prices, implied, Settings(5));
        var groups = GroupedScores.Compute(result, prices, events);
        var with = groups.Rows.Where(r => r.Grouping == "events" && r.Group != GroupedScores.NoEventGroup).ToList();
        var without = groups.Rows.Where(r => r.Grouping == "events" && r.Group == GroupedScores.NoEventGroup).ToList();
        Assert.Equal(4, with.Count); // two forecasters × scheduled and added
        foreach (var row in with)
        {
            var calm = without.Single(r => r.Spec == row.Spec);
            Assert.True(row.ImpliedQlike > calm.ImpliedQlike, $"{row.Group}: implied {row.ImpliedQlike} vs {calm.ImpliedQlike}");
            Assert.True(row.Qlike > calm.Qlike, $"{row.Group} {row.Spec}: {row.Qlike} vs {calm.Qlike}");
        }

        // A 5-day window after date t holds the jump of t + 1 … t + 5: five forecast dates per jump.
        var scheduledRow = with.First(r => r.Group == GroupedScores.ScheduledGroup);
        var scheduledJumps = events.Count(e => e.Scheduled && result.Common!.OnCommonDates[Math.Max(0, result.Dates.IndexOf(e.Date) - 1)]);
        Assert.InRange(scheduledRow.Count, (5 * scheduledJumps) - 10, (5 * scheduledJumps) + 10);
        Assert.Equal(events.Count, groups.Events.Length);
    }
}
