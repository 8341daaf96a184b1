using VolCast.Core.Backtest;
using VolCast.Core.Options;
using VolCast.Core.Trading;
using Xunit.Abstractions;

namespace VolCast.Core.Tests.Trading;

public sealed class KnownTruthTests(ITestOutputHelper output)
{
    private const double Sigma = 0.20;

    [Theory]
    [InlineData(0.00)]
    [InlineData(0.03)]
    public void Evaluate_ShortStraddlesAtConstantVolatility_EarnThePricingGap(double premiumPoints)
    {
        // Known truth by seeded simulation, no costs: returns at constant σ (variance σ²·calendar days/365, the time
        // basis of the pricing), straddles sold at implied = σ + gap and hedged at implied. The expected P&L is
        // [straddle(σ + gap) − straddle(σ)] / entry vega (zero at gap 0, ≈ 3.0 vol points at gap 3 points); the
        // standard error is that of the simulated trades, about √(π/4)·σ/√N vol points per trade (Kamal & Derman 1999,
        // from memory). Asserted within three standard errors.
        const int trades = 1500, h = 21;
        var prices = SimulatedMarket.ConstantVolatility(42, (trades * h) + 1, Sigma);
        var implied = Sigma + premiumPoints;
        var pnl = new double[trades];
        var expected = new double[trades];
        for (var i = 0; i < trades; i++)
        {
            var trade = StraddleTrader.Evaluate(prices, i * h, (i + 1) * h, -1, implied, TradeCosts.Zero);
            pnl[i] = trade.PnlVolPoints;
            var tau = trade.CalendarDays / 365.0;
            expected[i] = (Straddle(implied, tau) - Straddle(Sigma, tau)) / (2 * BlackScholesMerton.Vega(100, 100, tau, implied, 0, 0) / 100);
        }

        var mean = pnl.Average();
        var se = Math.Sqrt(pnl.Sum(x => (x - mean) * (x - mean)) / (trades - 1) / trades);
        var truth = expected.Average();
        output.WriteLine($"gap {premiumPoints}: mean {mean:F3} ± {se:F3}, truth {truth:F3}");
        Assert.True(Math.Abs(mean - truth) <= 3 * se, $"mean {mean}, truth {truth}, se {se}");
        if (premiumPoints > 0)
        {
            Assert.Equal(3.0, truth, 0.1);
        }
    }

    [Fact]
    public void Run_AlwaysSellAtThreePointsPremium_EarnsAboutThreeVolPointsPerTrade()
    {
        // The same known truth through the whole rule backtest: implied quoted at σ + 3 points every day, always-sell
        // one trade at a time, no costs; the mean trade earns ≈ 3 vol points within three standard errors (the Newey-West
        // error of the mean trade, lag 2).
        const int days = 6000;
        var prices = SimulatedMarket.ConstantVolatility(11, days, Sigma);
        var implied = SimulatedMarket.Constant(days, Sigma + 0.03);
        var forecast = new RuleForecast("truth", SimulatedMarket.Constant(days, Sigma));
        var settings = new TradingSettings { Costs = TradeCosts.Zero };
        var result = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(21), forecast, forecast, forecast, settings);
        var always = result[TradingRule.AlwaysSell].TradeStatisticsNet;
        var tau = 29 / 365.0; // 21 trading days on weekdays = 29 calendar days
        var truth = (Straddle(Sigma + 0.03, tau) - Straddle(Sigma, tau)) / (2 * BlackScholesMerton.Vega(100, 100, tau, Sigma + 0.03, 0, 0) / 100);
        output.WriteLine($"mean {always.MeanVolPoints:F3} ± {always.MeanTest!.StandardError:F3} over {always.Count}, truth {truth:F3}");
        Assert.True(Math.Abs(always.MeanVolPoints!.Value - truth) <= 3 * always.MeanTest.StandardError!.Value);
        // The proposed rule (implied − forecast = 3 points > 2) fires every day, so it is the always-sell rule.
        Assert.Equal(result[TradingRule.AlwaysSell].DailyPnl.ToArray(), result[TradingRule.Proposed].DailyPnl.ToArray());
    }

    private static double Straddle(double sigma, double tau) =>
        BlackScholesMerton.Price(OptionType.Call, 100, 100, tau, sigma, 0, 0) + BlackScholesMerton.Price(OptionType.Put, 100, 100, tau, sigma, 0, 0);
}
