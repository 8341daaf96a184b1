using System.Collections.Immutable;
using VolCast.Core.Backtest;
using VolCast.Core.Data;
using VolCast.Core.Estimators;
using VolCast.Core.Forecasters;
using VolCast.Core.Scoring;
using VolCast.Core.Tests.Forecasters;
using Xunit.Abstractions;

namespace VolCast.Core.Tests.Backtest;

public sealed class BacktesterTests(ITestOutputHelper output)
{
    /// <summary>A small, fast configuration: a short sweep and selection window so that adaptive choices happen in a short history.</summary>
    private static BacktestSettings Small(int horizon) => new()
    {
        Horizon = BacktestHorizon.Days(horizon),
        Forecasters = ["close-to-close:21", "yang-zhang:10", "ewma:0.94", "garch", "har"],
        SweepLookbacks = [5, 10, 21],
        EwmaLambdas = [0.90, 0.94, 0.97],
        SelectionWindowDays = 60,
        McsReplications = 200,
    };

    [Fact]
    public void Run_TradingDayHorizon_RealizedTargetsMatchDirectRecomputationFromCloses()
    {
        const int h = 5;
        var prices = ForecastData.Bars(300, seed: 3);
        var result = Backtester.Run(prices, null, Small(h) with { Sweep = false });
        var close = prices.Close;
        for (var t = 0; t < prices.Count; t++)
        {
            if (t + h >= prices.Count)
            {
                // The last h dates have forecasts but no target.
                Assert.Null(result.Realized[t]);
                Assert.Null(result.WindowDays[t]);
                continue;
            }

            // docs/conventions.md#the-realized-target: RV(t,h) = sqrt(A/h · Σ_{i=1..h} r²_{t+i}), zero mean, A = 252.
            double sum = 0;
            for (var i = 1; i <= h; i++)
            {
                var r = Math.Log(close[t + i] / close[t + i - 1]);
                sum += r * r;
            }

            Assert.Equal(Math.Sqrt(252.0 / h * sum), result.Realized[t]!.Value, 14);
            Assert.Equal(h, result.WindowDays[t]);
        }

        Assert.Equal(h, result.DataQuality.DatesWithoutTarget);
        Assert.True(result.Forecasts.Single(f => f.Spec == "ewma:0.94").Values[^1].HasValue);
        Assert.Equal(h - 1, result.HacLag);
    }

    [Fact]
    public void Run_CalendarTenor_WindowIsTradingDaysInHalfOpenCalendarInterval()
    {
        const int tenor = 30;
        var prices = ForecastData.Bars(300, seed: 5);
        var result = Backtester.Run(prices, null, Small(21) with { Horizon = BacktestHorizon.Tenor(tenor), Sweep = false });
        var dates = prices.Dates;
        var close = prices.Close;
        var seen = new HashSet<int>();
        for (var t = 0; t < prices.Count; t++)
        {
            var end = dates[t].AddDays(tenor);
            if (dates[^1] < end)
            {
                // The window (t, t + 30d] is not fully inside the history: no target.
                Assert.Null(result.Realized[t]);
                continue;
            }

            double sum = 0;
            var h = 0;
            for (var j = t + 1; j < prices.Count && dates[j] <= end; j++)
            {
                var r = Math.Log(close[j] / close[j - 1]);
                sum += r * r;
                h++;
            }

            Assert.Equal(h, result.WindowDays[t]);
            Assert.Equal(Math.Sqrt(252.0 / h * sum), result.Realized[t]!.Value, 14);
            seen.Add(h);
        }

        // Business days only: 30 calendar days (four weeks and two days) hold 20 to 22 weekdays, so h_t varies and
        // the lag takes the longest.
        Assert.Subset(new HashSet<int> { 20, 21, 22 }, seen);
        Assert.True(seen.Count >= 2);
        Assert.Equal(seen.Max() - 1, result.HacLag);
        Assert.Equal(21, result.Settings.Horizon.NominalDays);
    }

    [Fact]
    public void Run_SessionsOneAfterAnother_GiveTheSameForecastsAndScoresBitForBit()
    {
        // Common practice, no source: each forecaster session is sequential and independent, so running them on one
        // thread (as a batch does) or one per core must give the same bits.
        var prices = ForecastData.Bars(520, seed: 13);
        var implied = ForecastData.Implied(prices);
        var parallel = Backtester.Run(prices, implied, Small(5));
        var sequential = Backtester.Run(prices, implied, Small(5), sessionsInParallel: 1);
        Assert.Equal(parallel.Forecasts.Length, sequential.Forecasts.Length);
        for (var f = 0; f < parallel.Forecasts.Length; f++)
        {
            Assert.Equal(parallel.Forecasts[f].Spec, sequential.Forecasts[f].Spec);
            for (var t = 0; t < parallel.Forecasts[f].Values.Length; t++)
            {
                Assert.True(parallel.Forecasts[f].Values[t] == sequential.Forecasts[f].Values[t], $"{parallel.Forecasts[f].Spec} at {t}: {parallel.Forecasts[f].Values[t]:R} against {sequential.Forecasts[f].Values[t]:R}");
            }
        }

        Assert.Equal(parallel.Metrics.Select(m => m.Losses?.Qlike), sequential.Metrics.Select(m => m.Losses?.Qlike));
        Assert.Throws<ArgumentOutOfRangeException>(() => Backtester.Run(prices, implied, Small(5), sessionsInParallel: -1));
    }

    [Fact]
    public void Run_AlteringDataAfterD_LeavesEveryForecastOnOrBeforeDUnchangedBitForBit()
    {
        var prices = ForecastData.Bars(520, seed: 11);
        var implied = ForecastData.Implied(prices);
        var settings = Small(5);
        var baseline = Backtester.Run(prices, implied, settings);
        Assert.NotEmpty(baseline.Adaptive);
        var random = new Random(77);
        foreach (var d in new[] { 150, 260, 333, 419, 500 })
        {
            var altered = Alter(prices, d, random);
            var rerun = Backtester.Run(altered, implied, settings);
            Assert.Equal(baseline.Forecasts.Length, rerun.Forecasts.Length);
            var changedAfter = 0;
            for (var k = 0; k < baseline.Forecasts.Length; k++)
            {
                var a = baseline.Forecasts[k];
                var b = rerun.Forecasts[k];
                Assert.Equal(a.Spec, b.Spec);
                for (var t = 0; t <= d; t++)
                {
                    Assert.True(Bits(a.Values[t]) == Bits(b.Values[t]), $"{a.Spec} changed at {t} <= D = {d}");
                }

                for (var t = d + 1; t < prices.Count; t++)
                {
                    changedAfter += Bits(a.Values[t]) == Bits(b.Values[t]) ? 0 : 1;
                }
            }

            foreach (var (a, b) in baseline.Adaptive.Zip(rerun.Adaptive))
            {
                for (var t = 0; t <= d; t++)
                {
                    Assert.Equal(a.Choices[t], b.Choices[t]);
                }
            }

            // Not vacuous: the alteration did reach the forecasts after D.
            Assert.True(changedAfter > 0);
        }
    }

    [Fact]
    public void Run_SimulatedGarchWithTrueImplied_TrueForecastTiesAndWorseForecastsLose()
    {
        // Known truth by simulation (common practice, no source): implied is the true conditional expected h-day
        // vol, so it is the optimal forecast under MSE and QLIKE; the true-parameter GARCH forecast differs from it only
        // through the filter's unobservable starting variance. 20 seeds; the rates asserted are stated below.
        const int seeds = 20;
        const int h = 5;
        var ties = 0;
        var closeToCloseLoses = 0;
        var scaledLosesQlike = 0;
        var scaledLosesMse = 0;
        for (var seed = 1; seed <= seeds; seed++)
        {
            var (prices, implied) = BacktestData.GarchWithTrueImplied(4000, h, seed);
            var settings = new BacktestSettings
            {
                Horizon = BacktestHorizon.Days(h),
                Forecasters = ["close-to-close:5"],
                Sweep = false,
                McsReplications = 200,
            };
            var result = Backtester.Run(prices, implied, settings,
                [new TrueGarchForecaster(BacktestData.Truth), new ScaledImpliedForecaster(1.2)]);
            var truth = result.Metrics.Single(m => m.Spec == "true-garch").VersusImplied!;
            ties += truth.Qlike?.PValue is not double p || p >= 0.05 ? 1 : 0;
            var c2c = result.Metrics.Single(m => m.Spec == "close-to-close:5").VersusImplied!;
            closeToCloseLoses += c2c.Qlike!.Statistic > 0 && c2c.Qlike.PValue < 0.05 ? 1 : 0;
            var pair = result.Pairs.Single(x => x.First == "true-garch" && x.Second == "implied*1.2");
            scaledLosesQlike += pair.Qlike!.Statistic < 0 && pair.Qlike.PValue < 0.05 ? 1 : 0;
            scaledLosesMse += pair.MseVariance!.Statistic < 0 && pair.MseVariance.PValue < 0.05 ? 1 : 0;
        }

        output.WriteLine($"ties {ties}/{seeds}, close-to-close:5 loses {closeToCloseLoses}/{seeds}, implied*1.2 loses QLIKE {scaledLosesQlike}/{seeds}, MSE {scaledLosesMse}/{seeds}");

        // Rates tested: a tie (DM on QLIKE not rejected at 5%) in at least 16 of 20 seeds (a 5% test rejects about 1 in 20);
        // the 5-day close-to-close and implied × 1.2 lose significantly in at least 18 of 20.
        Assert.True(ties >= 16, $"true-garch tied with implied in {ties} of {seeds} seeds");
        Assert.True(closeToCloseLoses >= 18, $"close-to-close:5 lost significantly in {closeToCloseLoses} of {seeds} seeds");
        Assert.True(scaledLosesQlike >= 18, $"implied*1.2 lost on QLIKE in {scaledLosesQlike} of {seeds} seeds");
        Assert.True(scaledLosesMse >= 18, $"implied*1.2 lost on MSE in {scaledLosesMse} of {seeds} seeds");
    }

    [Fact]
    public void Run_ImpliedMissingOnSomeDates_CountsThemAndScoresOnCommonDates()
    {
        var prices = ForecastData.Bars(400, seed: 8);
        var implied = ForecastData.Implied(prices);
        var result = Backtester.Run(prices, implied, Small(5) with { Sweep = false });
        var quality = result.DataQuality;
        Assert.Equal(400, quality.ForecastDates);
        Assert.Equal(400 / 7 + (400 % 7 > 3 ? 1 : 0), quality.ForecastDatesWithoutImplied);
        Assert.Equal(quality.ForecastDates, quality.ForecastDatesWithImplied + quality.ForecastDatesWithoutImplied);
        Assert.True(quality.ImpliedDatesWithoutPrices > 0);

        // Scored dates are the dates with a target above zero; implied coverage is counted on them, not on all dates.
        var scored = Enumerable.Range(0, result.Dates.Length).Where(i => result.Realized[i] > 0).ToList();
        Assert.Equal(scored.Count, quality.ScoredDates);
        Assert.Equal(quality.DatesWithTarget - quality.ZeroRealizedDates, quality.ScoredDates);
        Assert.Equal(scored.Count(i => result.Implied[i] is not null), quality.ScoredDatesWithImplied);
        Assert.True(quality.ScoredDatesWithImplied < quality.ForecastDatesWithImplied, "the unscored last dates are quoted too");
        Assert.Equal("implied", result.Metrics[0].Spec);
        var vsImplied = result.Metrics.Single(m => m.Spec == "ewma:0.94").VersusImplied!;
        Assert.True(vsImplied.Count < result.Metrics.Single(m => m.Spec == "ewma:0.94").Losses!.Count);
        Assert.Equal("implied", result.Baseline);
        Assert.Equal("close-to-close:21", result.Candidate);
        Assert.Equal("close-to-close:21", result.CandidateVersusBaseline.First);
        Assert.NotNull(result.RuleTest);
        Assert.Equal(6, result.RuleTest!.Rows.Length);

        // Every Diebold-Mariano test of the run (head to head, against implied, between forecasters) asks for the
        // rectangular window at lag h − 1, the standard test (Diebold and Mariano 1995; forecast::dm.test's default).
        var tests = new[] { result.CandidateVersusBaseline.Qlike, result.CandidateVersusBaseline.MseVariance, vsImplied.Qlike, vsImplied.MseVariance }
            .Concat(result.Pairs.SelectMany(p => new[] { p.Qlike, p.MseVariance }))
            .Where(t => t is not null)
            .ToList();
        Assert.NotEmpty(tests);
        Assert.All(tests, t => Assert.Equal(LongRunVarianceWindow.Rectangular, t!.RequestedWindow));
        Assert.All(tests, t => Assert.Equal(4, t!.Lag));
    }

    [Fact]
    public void Run_HorizonLongerThanData_ThrowsNamingTheNumbers()
    {
        var prices = ForecastData.Bars(30, seed: 2);
        var ex = Assert.Throws<BacktestDataException>(() => Backtester.Run(prices, null, Small(40) with { Sweep = false }));
        Assert.Contains("40 trading days", ex.Message, StringComparison.Ordinal);
        Assert.Contains("30 rows", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_NoSharedImpliedDates_Throws()
    {
        var prices = ForecastData.Bars(100, seed: 2);
        var implied = new ImpliedSeries([new DateOnly(1999, 1, 4), new DateOnly(1999, 1, 5)], [0.2, 0.21]);
        var ex = Assert.Throws<BacktestDataException>(() => Backtester.Run(prices, implied, Small(5) with { Sweep = false }));
        Assert.Contains("No date is shared", ex.Message, StringComparison.Ordinal);
        Assert.Contains("1999-01-04", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_SelectionWindowLongerThanSample_Throws()
    {
        var prices = ForecastData.Bars(100, seed: 2);
        var ex = Assert.Throws<BacktestDataException>(() => Backtester.Run(prices, null, Small(5) with { SelectionWindowDays = 504 }));
        Assert.Contains("504", ex.Message, StringComparison.Ordinal);
        Assert.Contains("100 rows", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_UnknownForecaster_ThrowsListingValidSpecs()
    {
        var prices = ForecastData.Bars(100, seed: 2);
        var ex = Assert.Throws<ArgumentException>(() => Backtester.Run(prices, null, Small(5) with { Forecasters = ["garch", "magic:3"] }));
        Assert.Contains("Valid forecasters", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_WithoutFullSweep_SweepsOnlyTheFamiliesOfTheListedForecasters()
    {
        // Listed: close-to-close and yang-zhang windows, EWMA, GARCH and HAR; GARCH and HAR have no lookback to sweep.
        var prices = ForecastData.Bars(520, seed: 13);
        var result = Backtester.Run(prices, null, Small(5));
        Assert.Equal(["close-to-close", "yang-zhang", "ewma"], result.Adaptive.Select(a => a.Family).ToArray());
        Assert.Equal(["close-to-close", "yang-zhang", "ewma"], result.Lookbacks.Select(a => a.Family).ToArray());

        var noWindows = Backtester.Run(prices, null, Small(5) with { Forecasters = ["garch", "har"] });
        Assert.Empty(noWindows.Adaptive);
    }

    [Fact]
    public void Run_AdaptiveChoice_UsesOnlyCandidatesAndReportsChanges()
    {
        var prices = ForecastData.Bars(520, seed: 13);
        var result = Backtester.Run(prices, null, Small(5) with { FullSweep = true });
        Assert.Equal(["close-to-close", "parkinson", "garman-klass", "rogers-satchell", "yang-zhang", "ewma"], result.Adaptive.Select(a => a.Family).ToArray());
        foreach (var adaptive in result.Adaptive)
        {
            var series = result.Forecasts.Single(f => f.Spec == adaptive.Spec);
            Assert.Equal(ForecastKind.Adaptive, series.Kind);
            for (var t = 0; t < result.Dates.Length; t++)
            {
                if (adaptive.Choices[t] is string chosen)
                {
                    Assert.Contains(chosen, adaptive.Candidates);
                }
                else
                {
                    Assert.Null(series.Values[t]);
                }
            }

            Assert.True(adaptive.DatesWithChoice > 300);
        }

        // The sweep has one best (in-sample) row per family.
        Assert.Equal(result.Adaptive.Length, result.Sweep.Count(r => r.IsBestInSample));
    }

    [Fact]
    public void Run_RuleHistoricalNotAmongTheForecasters_ResultHoldsItsSeries()
    {
        // The rule's default historical estimate is close-to-close over the horizon; with horizon 10 and a list
        // without it, the series exists only inside the rule test, which must carry it for any chart or file.
        var prices = ForecastData.Bars(400, seed: 8);
        var implied = ForecastData.Implied(prices);
        var result = Backtester.Run(prices, implied, Small(10) with { Sweep = false, Forecasters = ["ewma:0.94"] });

        var rule = result.RuleTest!;
        Assert.Equal("close-to-close:10", rule.HistoricalSpec);
        Assert.DoesNotContain(result.Forecasts, f => f.Spec == rule.HistoricalSpec);
        Assert.True(rule.Dates.Length > 300);

        // The historical series is the 10-day sample close-to-close estimate (pinned against TTR in the estimator tests).
        var c2c = RollingVolatility.Compute(prices, Estimator.CloseToClose, 10);
        var dates = prices.Dates.ToArray();
        for (var i = 0; i < rule.Dates.Length; i++)
        {
            var t = Array.IndexOf(dates, rule.Dates[i]);
            Assert.Equal(c2c.AnnualizedVolatility[t - c2c.FirstIndex], rule.Historical[i], 12);
        }

        // Each source's all-dates row counts every date of the series, and its mean gap is the mean of IV − RV there.
        foreach (var source in new[] { rule.ForecastSpec, rule.HistoricalSpec })
        {
            var all = rule.Rows.Single(r => r.Source == source && r.Signal == RuleSignal.AllDates);
            Assert.Equal(rule.Dates.Length, all.Count);
            Assert.Equal(rule.Implied.Zip(rule.Realized, (iv, rv) => iv - rv).Average(), all.MeanVolatilityGap!.Value, 12);
        }

        var sell = rule.Rows.Single(r => r.Source == rule.ForecastSpec && r.Signal == RuleSignal.SellVolatility);
        Assert.Equal(sell.Count, rule.VolatilityGaps(RuleSignal.SellVolatility).Length);
        Assert.Equal(
            Enumerable.Range(0, rule.Dates.Length).Count(i => rule.Implied[i] - rule.Forecast[i] > rule.ThresholdVolatility),
            sell.Count);
    }

    private static long? Bits(double? value) => value is double v ? BitConverter.DoubleToInt64Bits(v) : null;

    /// <summary>The same history with every bar after index d scaled by a random factor (dates kept).</summary>
    private static PriceHistory Alter(PriceHistory prices, int d, Random random)
    {
        var open = prices.Open.ToArray();
        var high = prices.High.ToArray();
        var low = prices.Low.ToArray();
        var close = prices.Close.ToArray();
        for (var t = d + 1; t < prices.Count; t++)
        {
            var f = Math.Exp(0.05 * ((2 * random.NextDouble()) - 1));
            open[t] *= f;
            high[t] *= f * 1.01;
            low[t] *= f * 0.99;
            close[t] *= f;
        }

        return PriceHistory.FromBars(prices.Dates, open, high, low, close);
    }
}
