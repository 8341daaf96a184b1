using VolCast.Core.Backtest;
using Xunit.Abstractions;

namespace VolCast.Core.Tests.Backtest;

public sealed class CommonDateTests(ITestOutputHelper output)
{
    [Fact]
    public void Run_SimulatedGarch_TrueModelRanksFirstOnCommonDatesAndTheLateStarterIsLeftOut()
    {
        // Known truth by simulation (common practice, no source): the path is GARCH(1,1) with known parameters, so the
        // true-parameter GARCH forecast is the best forecaster there is; a copy of it that starts at 70% of the history has
        // the same forecasts where it has any, so on its own (later, calmer or wilder) dates it may look better or worse,
        // and must be left out of the common set rather than shrink it. 20 seeds; the rate asserted is stated below.
        const int seeds = 20;
        const int h = 5;
        var first = 0;
        for (var seed = 1; seed <= seeds; seed++)
        {
            var (prices, implied) = BacktestData.GarchWithTrueImplied(3000, h, seed);
            var settings = new BacktestSettings
            {
                Horizon = BacktestHorizon.Days(h),
                Forecasters = ["close-to-close:21", "close-to-close:63", "ewma:0.94"],
                Sweep = false,
                McsReplications = 100,
            };
            var result = Backtester.Run(prices, implied, settings,
                [new TrueGarchForecaster(BacktestData.Truth), new LateForecaster(new TrueGarchForecaster(BacktestData.Truth), 0.7, "late-true")]);
            var common = result.Common!;

            Assert.Equal("late-true", Assert.Single(common.LeftOut));
            Assert.DoesNotContain(common.Rows, r => r.Spec == "late-true");

            // The late starter keeps its own-date figures, on fewer dates than the common set.
            var late = result.Metrics.Single(m => m.Spec == "late-true");
            Assert.True(late.Losses!.Count < common.Count);

            // Recount the common dates from the series themselves: realized positive, implied and every member positive.
            var members = result.Forecasts.Where(f => f.Spec != "late-true").ToList();
            var recount = 0;
            for (var i = 0; i < result.Dates.Length; i++)
            {
                var all = result.Realized[i] is > 0 && result.Implied[i] is > 0 && members.TrueForAll(m => m.Values[i] is > 0);
                recount += all ? 1 : 0;
                Assert.Equal(all, common.OnCommonDates[i]);
            }

            Assert.Equal(recount, common.Count);
            Assert.All(common.Rows, r => Assert.Equal(common.Count, r.Losses.Count));

            // Ranked best first, and every comparison with implied on the same dates.
            Assert.True(common.Rows.Zip(common.Rows.Skip(1)).All(p => p.First.Losses.Qlike <= p.Second.Losses.Qlike));
            Assert.All(common.Rows.Where(r => r.Kind != ForecastKind.Implied), r => Assert.Equal(common.Count, r.VersusImplied!.Count));
            first += common.Rows.First(r => r.Kind != ForecastKind.Implied).Spec == "true-garch" ? 1 : 0;
        }

        output.WriteLine($"true-garch first among forecasters on common dates in {first}/{seeds} seeds");

        // Rate tested: first in at least 18 of 20 seeds (against 21- and 63-day close-to-close and EWMA 0.94, whose
        // losses on 3,000 dates are clearly higher than the true model's).
        Assert.True(first >= 18, $"true-garch first in {first} of {seeds} seeds");
    }

    [Fact]
    public void Run_CandidateAndBaselineOnCommonDates_HeadToHeadUsesTheCommonDates()
    {
        // The head-to-head is counted on the common dates, not on the pair's own (longer) set, so it cannot contradict the ranking.
        var (prices, implied) = BacktestData.GarchWithTrueImplied(1500, 5, 3);
        var settings = new BacktestSettings
        {
            Horizon = BacktestHorizon.Days(5),
            Forecasters = ["close-to-close:5", "close-to-close:252"],
            Sweep = false,
            McsReplications = 50,
            Candidate = "close-to-close:5",
        };
        var result = Backtester.Run(prices, implied, settings);
        var ownDates = result.Metrics.Single(m => m.Spec == "close-to-close:5").VersusImplied!.Count;
        Assert.Equal(result.Common!.Count, result.CandidateVersusBaseline.Count);
        Assert.True(ownDates > result.Common.Count, "the 252-day lookback starts later, so the common set is shorter than the 5-day pair's");
    }
}
