using VolCast.Core.Backtest;
using VolCast.Core.Data;
using VolCast.Core.Trading;

namespace VolCast.Core.Tests.Trading;

public sealed class RuleBacktestTests
{
    [Fact]
    public void Run_SimulatedPremium_ProducesEveryRuleWithoutNaN()
    {
        var (prices, implied, proposed, current, historical) = Market(7, 800);
        var result = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(21), proposed, current, historical, new TradingSettings());
        Assert.Equal(5, result.Rules.Length);
        Assert.Equal(21, result.Sweep.Length);
        Assert.Equal(21, result.SnoopingDifferences.Length);
        foreach (var rule in result.Rules)
        {
            Assert.All(rule.DailyPnl, x => Assert.True(double.IsFinite(x)));
            Assert.True(rule.TradeStatisticsNet.Count > 0, rule.Rule.ToString());
        }
    }

    [Fact]
    public void Run_AlwaysSell_StartOffsetRangesMatchEveryHthTradeOfTheSignalTable()
    {
        // Always-sell fires on every date, so one trade at a time from the o-th date takes the trades entered on dates
        // o, o + h, o + 2h, … (a new trade enters at the close where the last one settles). Recomputed here from the
        // every-signal trade table, not from the range code: each figure's range over the h offsets must match.
        const int h = 21;
        var (prices, implied, proposed, current, historical) = Market(11, 700);
        var settings = new TradingSettings { Entries = TradeEntries.EverySignal };
        var result = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(h), proposed, current, historical, settings);
        var always = result.Rules[0];
        Assert.Equal(TradingRule.AlwaysSell, always.Rule);
        var trades = always.Trades.OrderBy(t => t.EntryIndex).ToArray();
        Assert.True(trades.Length > 10 * h);
        for (var j = 1; j < trades.Length; j++)
        {
            Assert.Equal(trades[j - 1].EntryIndex + 1, trades[j].EntryIndex);
        }

        double countLow = double.MaxValue, countHigh = 0, meanLow = double.MaxValue, meanHigh = double.MinValue;
        double worstLow = double.MaxValue, worstHigh = double.MinValue, grossMeanLow = double.MaxValue, grossMeanHigh = double.MinValue;
        for (var o = 0; o < h; o++)
        {
            var chosen = trades.Where((_, j) => j >= o && (j - o) % h == 0).ToArray();
            countLow = Math.Min(countLow, chosen.Length);
            countHigh = Math.Max(countHigh, chosen.Length);
            var mean = chosen.Average(t => t.PnlVolPoints);
            meanLow = Math.Min(meanLow, mean);
            meanHigh = Math.Max(meanHigh, mean);
            var worst = chosen.Min(t => t.PnlVolPoints);
            worstLow = Math.Min(worstLow, worst);
            worstHigh = Math.Max(worstHigh, worst);
            var gross = chosen.Average(t => t.GrossPnlVolPoints);
            grossMeanLow = Math.Min(grossMeanLow, gross);
            grossMeanHigh = Math.Max(grossMeanHigh, gross);
        }

        var net = always.OneAtATimeRangeNet;
        Assert.Equal(h, net.Starts);
        Assert.Equal(new FigureRange(countLow, countHigh), net.Trades);
        Assert.Equal(meanLow, net.MeanVolPoints!.Low, 12);
        Assert.Equal(meanHigh, net.MeanVolPoints.High, 12);
        Assert.Equal(worstLow, net.WorstVolPoints!.Low, 12);
        Assert.Equal(worstHigh, net.WorstVolPoints.High, 12);
        Assert.Equal(grossMeanLow, always.OneAtATimeRangeZeroCost.MeanVolPoints!.Low, 12);
        Assert.Equal(grossMeanHigh, always.OneAtATimeRangeZeroCost.MeanVolPoints.High, 12);
        // Costs are charged on every trade, so the net range lies below the zero-cost one.
        Assert.True(net.PnlPerYear.High < always.OneAtATimeRangeZeroCost.PnlPerYear.High);
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Run_TradesSharedBetweenTheTwoEntryTimings_GiveTheSameResultsAsEachRunAlone(bool tenor)
    {
        // A trade depends only on its entry close, so a next-day run that reuses the firing-close run's trades must give
        // what it gives when it prices every trade itself, to the bit: every path, trade and sweep row.
        var (prices, implied, proposed, current, historical) = Market(5, 600);
        var horizon = tenor ? BacktestHorizon.Tenor(30) : BacktestHorizon.Days(21);
        var settings = new TradingSettings { Sides = RuleSides.Both };
        var nextDay = settings with { EntryTiming = EntryTiming.NextClose };
        var shared = RuleBacktest.SharedTrades(prices, implied, horizon, settings);
        var closeShared = RuleBacktest.Run(prices, implied, horizon, proposed, current, historical, settings, shared: shared);
        var nextShared = RuleBacktest.Run(prices, implied, horizon, proposed, current, historical, nextDay, shared: shared);
        var closeAlone = RuleBacktest.Run(prices, implied, horizon, proposed, current, historical, settings);
        var nextAlone = RuleBacktest.Run(prices, implied, horizon, proposed, current, historical, nextDay);
        foreach (var (a, b) in new[] { (closeShared, closeAlone), (nextShared, nextAlone) })
        {
            Assert.Equal(b.Sweep.ToArray(), a.Sweep.ToArray());
            for (var r = 0; r < b.Rules.Length; r++)
            {
                Assert.Equal(b.Rules[r].DailyPnl.ToArray(), a.Rules[r].DailyPnl.ToArray());
                Assert.Equal(b.Rules[r].DailyPnlEntryVol.ToArray(), a.Rules[r].DailyPnlEntryVol.ToArray());
                Assert.Equal(b.Rules[r].Trades.ToArray(), a.Rules[r].Trades.ToArray());
                Assert.Equal(b.Rules[r].TradeStatisticsNet, a.Rules[r].TradeStatisticsNet);
            }
        }
    }

    /// <summary>
    /// A simulated market at 20% volatility where implied is quoted 3 vol points high, a forecaster that knows the truth
    /// (20%), a noisier baseline around 21%, and a historical one that forecasts 21%.
    /// </summary>
    internal static (PriceHistory Prices, double?[] Implied, RuleForecast Proposed, RuleForecast Current, RuleForecast Historical) Market(int seed, int days)
    {
        var prices = SimulatedMarket.ConstantVolatility(seed, days, 0.20);
        var random = new Random(seed + 1);
        var implied = new double?[days];
        var proposed = new double?[days];
        var current = new double?[days];
        var historical = new double?[days];
        for (var i = 0; i < days; i++)
        {
            implied[i] = 0.23 + (0.02 * (random.NextDouble() - 0.5));
            proposed[i] = 0.20 + (0.03 * (random.NextDouble() - 0.5));
            current[i] = 0.21 + (0.03 * (random.NextDouble() - 0.5));
            historical[i] = 0.21;
        }

        return (prices, implied, new RuleForecast("candidate", proposed), new RuleForecast("baseline", current), new RuleForecast("close-to-close:21", historical));
    }
}
