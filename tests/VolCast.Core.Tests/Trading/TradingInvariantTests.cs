using System.Collections.Immutable;
using FsCheck;
using FsCheck.Xunit;
using VolCast.Core.Backtest;
using VolCast.Core.Data;
using VolCast.Core.Trading;

namespace VolCast.Core.Tests.Trading;

public sealed class TradingInvariantTests
{
    [Property(MaxTest = 30)]
    public bool EvaluateLong_BothDailyPaths_SumToTheTradePnlAtExpiry(PositiveInt seed)
    {
        // Accounting identity (a fact of the trade, no source needed): the daily changes of a position's value, marked
        // at any volatilities, add up to its value at expiry, where the option is worth its payoff.
        var prices = SimulatedMarket.ConstantVolatility(seed.Get, 30, 0.25);
        var random = new Random(seed.Get);
        var marks = new double?[30];
        for (var i = 0; i < 30; i++)
        {
            marks[i] = random.NextDouble() < 0.1 ? null : 0.1 + (0.4 * random.NextDouble());
        }

        var costs = new TradeCosts(0.5, 2.0);
        var mark = new double[22];
        var entryVol = new double[22];
        var cost = new double[22];
        var trade = StraddleTrader.EvaluateLong(prices.Dates, prices.Close, 3, 24, 0.22, 0.22, 0.03, 0.01, costs, -0.1, 0.1, marks, mark, entryVol, cost);
        var vega = trade.VegaPerVolPoint;
        return Math.Abs(mark.Sum() - (trade.Outcome.GrossPnl / vega)) < 1e-9
            && Math.Abs(entryVol.Sum() - (trade.Outcome.GrossPnl / vega)) < 1e-9
            && Math.Abs(cost.Sum() - (trade.Costs / vega)) < 1e-9
            && Math.Abs(mark[0]) < 1e-12;
    }

    [Fact]
    public void Run_EverySignalLadder_PathsSumToTheTradesRecomputedOneByOne()
    {
        // The ladder's two daily paths (marked at the quoted implied and at the entry implied) each add up to the
        // every-signal trades' P&L at expiry, each trade sized 1/h; the trades recomputed one by one through the public
        // trade engine.
        var (prices, implied, proposed, current, historical) = RuleBacktestTests.Market(3, 260);
        var result = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(21), proposed, current, historical, new TradingSettings());
        var always = result[TradingRule.AlwaysSell];
        double total = 0, totalGross = 0;
        var count = 0;
        for (var e = 0; e + 21 < prices.Count; e++)
        {
            var trade = StraddleTrader.Evaluate(prices, e, e + 21, -1, implied[e]!.Value, TradeCosts.Default);
            total += trade.PnlVolPoints / 21;
            totalGross += trade.GrossPnlVolPoints / 21;
            count++;
        }

        Assert.Equal(count, always.LadderTrades);
        Assert.Equal(total, always.DailyPnl.Sum(), 9);
        Assert.Equal(total, always.DailyPnlEntryVol.Sum(), 9);
        Assert.Equal(totalGross, always.DailyPnlZeroCost.Sum(), 9);
        Assert.Equal(totalGross, always.DailyPnlEntryVolZeroCost.Sum(), 9);
        Assert.Equal(always.PathNet.Total, always.DailyPnl.Sum(), 9);
    }

    [Fact]
    public void Run_ZeroCosts_NetEqualsGrossEverywhere()
    {
        // With no costs the net and zero-cost figures must coincide (definition of the cost columns).
        var (prices, implied, proposed, current, historical) = RuleBacktestTests.Market(5, 300);
        var result = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(10), proposed, current, historical, new TradingSettings { Costs = TradeCosts.Zero });
        foreach (var rule in result.Rules)
        {
            Assert.Equal(rule.DailyPnlZeroCost.ToArray(), rule.DailyPnl.ToArray());
            Assert.Equal(rule.DailyPnlEntryVolZeroCost.ToArray(), rule.DailyPnlEntryVol.ToArray());
            Assert.All(rule.Trades, t => Assert.Equal(t.GrossPnl, t.Pnl));
            Assert.Equal(rule.TradeStatisticsZeroCost, rule.TradeStatisticsNet);
        }

        Assert.All(result.Sweep, row => Assert.Equal(row.PnlPerYearZeroCost, row.PnlPerYear));
    }

    [Property(MaxTest = 15)]
    public bool Run_PriceLevelScaled_LeavesVolPointPnlUnchanged(PositiveInt scaleSeed)
    {
        // Scale invariance (Black-Scholes-Merton is homogeneous of degree one in S and K, and costs are proportional to
        // notional): multiplying every close by c leaves every vol-point figure unchanged.
        var scale = Math.Pow(10, ((scaleSeed.Get % 7) - 3) / 1.5);
        var (prices, implied, proposed, current, historical) = RuleBacktestTests.Market(9, 120);
        var close = prices.Close.ToArray().Select(c => c * scale).ToArray();
        var scaled = PriceHistory.FromCloses(prices.Dates, close);
        var a = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(5), proposed, current, historical, new TradingSettings());
        var b = RuleBacktest.Run(scaled, implied, BacktestHorizon.Days(5), proposed, current, historical, new TradingSettings());
        for (var r = 0; r < a.Rules.Length; r++)
        {
            for (var t = 0; t < a.Rules[r].DailyPnl.Length; t++)
            {
                if (Math.Abs(a.Rules[r].DailyPnl[t] - b.Rules[r].DailyPnl[t]) > 1e-9)
                {
                    return false;
                }
            }
        }

        return true;
    }

    [Fact]
    public void Run_SpreadSetToTheBreakEven_LeavesNoEdge()
    {
        // Self-consistency of the break-even: charging the half-spread it reports makes the proposed rule's edge over
        // always-sell vanish (the P&L is linear in the spread: each trade pays the spread in vol points).
        var (prices, implied, proposed, current, historical) = RuleBacktestTests.Market(21, 600);
        var first = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(21), proposed, current, historical, new TradingSettings());
        Assert.NotNull(first.BreakEven.EdgeHalfSpreadVolPoints);
        var spread = first.BreakEven.EdgeHalfSpreadVolPoints!.Value;
        var settings = new TradingSettings { Costs = new TradeCosts(spread, 1.0) };
        var second = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(21), proposed, current, historical, settings);
        Assert.Equal(0, second.BreakEven.EdgePerYear, 9);
        var own = first.BreakEven.ProposedHalfSpreadVolPoints!.Value;
        var third = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(21), proposed, current, historical, new TradingSettings { Costs = new TradeCosts(own, 1.0) });
        Assert.Equal(0, third[TradingRule.Proposed].PathNet.Total, 9);
    }

    [Fact]
    public void Run_TenorOfThirtyDays_ExpiresOnTheLastTradingDateWithinThirtyDays()
    {
        // The expiry convention: entry + 30 calendar days, rolled back to the last trading date on or before it.
        var (prices, implied, proposed, current, historical) = RuleBacktestTests.Market(4, 200);
        var result = RuleBacktest.Run(prices, implied, BacktestHorizon.Tenor(30), proposed, current, historical, new TradingSettings());
        var dates = prices.Dates.ToArray();
        foreach (var trade in result[TradingRule.AlwaysSell].Trades)
        {
            var limit = trade.EntryDate.AddDays(30);
            Assert.True(trade.ExpiryDate <= limit);
            Assert.DoesNotContain(dates, d => d > trade.ExpiryDate && d <= limit);
        }
    }

    [Fact]
    public void Run_NextCloseEntry_EntersOneTradingDayAfterFiring()
    {
        var (prices, implied, proposed, current, historical) = RuleBacktestTests.Market(4, 200);
        var late = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(10), proposed, current, historical, new TradingSettings { EntryTiming = EntryTiming.NextClose });
        var first = late[TradingRule.AlwaysSell].Trades[0];
        Assert.Equal(1, first.EntryIndex);
        Assert.Equal(implied[1], first.ImpliedVolatility);
        Assert.Equal(prices.Close[1], first.Strike);
    }

    [Fact]
    public void Run_HedgeAtForecast_HedgesEachTradeAtItsFiringDateForecast()
    {
        // The published alternative (hedging at the volatility one expects to be realized): the deltas use the rule's
        // forecast on the firing date; recomputed through the public trade engine.
        var (prices, implied, proposed, current, historical) = RuleBacktestTests.Market(4, 200);
        var result = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(10), proposed, current, historical, new TradingSettings { HedgeVolatility = HedgeVolatility.Forecast });
        var trades = result[TradingRule.Proposed].Trades;
        Assert.NotEmpty(trades);
        foreach (var trade in trades)
        {
            Assert.Equal(trade.Forecast, trade.HedgeVolatility);
            var again = StraddleTrader.Evaluate(prices, trade.EntryIndex, trade.ExpiryIndex, trade.Side, trade.ImpliedVolatility, TradeCosts.Default, hedgeVolatility: trade.Forecast);
            Assert.Equal(again.Pnl, trade.Pnl, 12);
        }
    }

    [Fact]
    public void Run_WalkForwardThreshold_ChoosesFromTheSweepStartingNearestTheConfigured()
    {
        var (prices, implied, proposed, current, historical) = RuleBacktestTests.Market(8, 400);
        var settings = new TradingSettings { Threshold = 0.018 };
        var result = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(21), proposed, current, historical, settings);
        var chosen = result[TradingRule.WalkForwardThreshold].ChosenThresholds.Where(x => x is not null).Select(x => x!.Value).ToArray();
        Assert.NotEmpty(chosen);
        Assert.Equal(0.02, chosen[0]);
        Assert.All(chosen, c => Assert.Contains(c, settings.SweepThresholds));
    }

    [Fact]
    public void Run_RuleThatNeverFiresBesideTheProposed_GivesEmptyStatisticsNotNaN()
    {
        var (prices, implied, proposed, _, historical) = RuleBacktestTests.Market(6, 200);
        var never = new RuleForecast("never", implied.Select(x => (double?)(x!.Value + 0.5)).ToArray());
        var result = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(10), proposed, never, historical, new TradingSettings());
        var current = result[TradingRule.Current];
        Assert.Equal(0, current.TradeStatisticsNet.Count);
        Assert.Null(current.TradeStatisticsNet.MeanVolPoints);
        Assert.Null(current.PathNet.Sharpe);
        Assert.All(current.DailyPnl, x => Assert.Equal(0, x));
        Assert.All(result.Sweep.Where(r => r.Rule == TradingRule.Current), r => Assert.Null(r.Sharpe));
    }

    [Fact]
    public void Run_ProposedNeverFires_SaysWhyAndWhatToChange()
    {
        var (prices, implied, _, current, historical) = RuleBacktestTests.Market(6, 200);
        var never = new RuleForecast("candidate", implied.Select(x => (double?)(x!.Value + 0.5)).ToArray());
        var error = Assert.Throws<ArgumentException>(() => RuleBacktest.Run(prices, implied, BacktestHorizon.Days(10), never, current, historical, new TradingSettings()));
        Assert.Contains("never fired", error.Message, StringComparison.Ordinal);
        Assert.Contains("lower the rule threshold", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_OneThresholdSweep_IsRefused()
    {
        var (prices, implied, proposed, current, historical) = RuleBacktestTests.Market(6, 100);
        var settings = new TradingSettings { SweepThresholds = [0.02] };
        var error = Assert.Throws<ArgumentException>(() => RuleBacktest.Run(prices, implied, BacktestHorizon.Days(10), proposed, current, historical, settings));
        Assert.Contains("at least two distinct thresholds", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(1, 0)]
    [InlineData(0, 2)]
    public void Run_HorizonBelowTwoTradingDays_IsRefused(int tradingDays, int tenorDays)
    {
        var (prices, implied, proposed, current, historical) = RuleBacktestTests.Market(6, 100);
        var horizon = tradingDays > 0 ? BacktestHorizon.Days(tradingDays) : BacktestHorizon.Tenor(tenorDays);
        var error = Assert.Throws<ArgumentException>(() => RuleBacktest.Run(prices, implied, horizon, proposed, current, historical, new TradingSettings()));
        Assert.Contains("at least two trading days", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_ImpliedInPercent_IsRefusedAsAUnitMistake()
    {
        var (prices, implied, proposed, current, historical) = RuleBacktestTests.Market(6, 100);
        var percent = implied.Select(x => x * 100).ToArray();
        var error = Assert.ThrowsAny<ArgumentException>(() => RuleBacktest.Run(prices, percent, BacktestHorizon.Days(10), proposed, current, historical, new TradingSettings()));
        Assert.Contains("decimal: 0.20 = 20%", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_MisalignedForecast_NamesTheSeries()
    {
        var (prices, implied, proposed, current, _) = RuleBacktestTests.Market(6, 100);
        var shortSeries = new RuleForecast("close-to-close:21", new double?[50]);
        var error = Assert.Throws<ArgumentException>(() => RuleBacktest.Run(prices, implied, BacktestHorizon.Days(10), proposed, current, shortSeries, new TradingSettings()));
        Assert.Contains("close-to-close:21", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_SnoopingDifferences_AreEachSweepRuleMinusAlwaysSell()
    {
        var (prices, implied, proposed, current, historical) = RuleBacktestTests.Market(2, 300);
        var result = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(10), proposed, current, historical, new TradingSettings { Sides = RuleSides.Both });
        Assert.Equal(3 * 2 * 7, result.Sweep.Length);
        Assert.Equal(result.Sweep.Length, result.SnoopingDifferences.Length);
        var always = result[TradingRule.AlwaysSell].DailyPnl;
        var row = result.Sweep.Single(r => r.Rule == TradingRule.Proposed && r.Sides == RuleSides.Both && r.Threshold == 0.02);
        var k = result.Sweep.IndexOf(row);
        var proposedPath = result[TradingRule.Proposed].DailyPnl;
        for (var t = 0; t < always.Length; t++)
        {
            Assert.Equal(proposedPath[t] - always[t], result.SnoopingDifferences[k][t], 12);
        }

        Assert.Equal(row.PnlPerYear, result[TradingRule.Proposed].PathNet.PnlPerYear, 12);

        // The sweep row's figures are the rule's own path figures, to the bit, and its Sharpe ratio is the mean over the
        // sample standard deviation (divisor n − 1) times the square root of the trading days a year (Sharpe 1994),
        // recomputed here with Math.NET's statistics.
        var rule = result[TradingRule.Proposed];
        Assert.Equal(rule.PathNet.PnlPerYear, row.PnlPerYear);
        Assert.Equal(rule.PathNet.Sharpe, row.Sharpe);
        Assert.Equal(rule.PathZeroCost.PnlPerYear, row.PnlPerYearZeroCost);
        Assert.Equal(rule.PathZeroCost.Sharpe, row.SharpeZeroCost);
        var annual = new TradingSettings().AnnualizationDays;
        var expected = MathNet.Numerics.Statistics.Statistics.Mean(proposedPath) / MathNet.Numerics.Statistics.Statistics.StandardDeviation(proposedPath) * Math.Sqrt(annual);
        Assert.Equal(expected, row.Sharpe!.Value, 10);
    }
}
