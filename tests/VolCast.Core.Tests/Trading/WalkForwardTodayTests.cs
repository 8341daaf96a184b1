using VolCast.Core.Backtest;
using VolCast.Core.Trading;

namespace VolCast.Core.Tests.Trading;

/// <summary>
/// The walk-forward threshold's choice on the last date (what the Now section and now.json report): the same rule as the
/// walk-forward path, which on each firing date takes the sweep threshold whose trades closed by then earned the most.
/// Simulated market (seeded), not reference data.
/// </summary>
public sealed class WalkForwardTodayTests
{
    [Theory]
    [InlineData(300)]
    [InlineData(450)]
    [InlineData(620)]
    public void WalkForwardToday_OnAFiringDate_IsTheThresholdTheWalkForwardPathUsedThatDay(int day)
    {
        // The path's threshold on firing date f is chosen from the trades that expired by f (RuleBacktest's remarks);
        // the choice "today" at f must be the same threshold. Sell-only, horizon 10.
        var (prices, implied, proposed, current, historical) = RuleBacktestTests.Market(5, 700);
        var settings = new TradingSettings { Threshold = 0.01 };
        var whole = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(10), proposed, current, historical, settings);
        var walk = whole[TradingRule.WalkForwardThreshold];
        var date = prices.Dates[day];
        var pathDay = whole.Dates.IndexOf(date);
        Assert.True(pathDay >= 0 && walk.ChosenThresholds[pathDay] is not null, "the day must be a firing date of the path");

        var today = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(10), proposed, current, historical, settings, date).WalkForwardToday!;

        Assert.Equal(date, today.Date);
        Assert.Equal(walk.ChosenThresholds[pathDay], today.Threshold);
        Assert.Contains(today.Threshold, settings.SweepThresholds);
        Assert.InRange(today.TradesClosed, 1, whole.FiringDates);
    }

    [Fact]
    public void WalkForwardToday_BeforeAnyTradeClosed_IsTheSweepThresholdNearestTheConfiguredOne()
    {
        // Before anything has expired, the walk-forward rule uses the sweep threshold nearest the configured one
        // (RuleBacktest's remarks); 0.012 is nearest to 0.01 in the default sweep 0, 0.005, 0.01, 0.02, …, 0.05.
        var (prices, implied, proposed, current, historical) = RuleBacktestTests.Market(5, 700);
        var settings = new TradingSettings { Threshold = 0.012 };

        var today = RuleBacktest.Run(prices, implied, BacktestHorizon.Days(10), proposed, current, historical, settings, prices.Dates[5]).WalkForwardToday!;

        Assert.Equal(0, today.TradesClosed);
        Assert.True(today.Fallback);
        Assert.Equal(settings.SweepThresholds.MinBy(t => Math.Abs(t - 0.012)), today.Threshold);
    }
}
