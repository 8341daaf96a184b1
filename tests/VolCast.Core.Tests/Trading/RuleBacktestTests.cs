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
