using VolCast.Core.Backtest;
using VolCast.Core.Forecasters;

namespace VolCast.Core.Tests.Backtest;

// Ctrl-C must stop a forecaster in the middle of its walk, not only between forecasters: a model forecaster on a long
// history can walk for minutes.
public sealed class CancellationTests
{
    [Fact]
    public void Run_CancelledWhileAForecasterWalks_StopsWithinSixtyFourDates()
    {
        var (prices, _) = BacktestData.GarchWithTrueImplied(days: 1500, horizon: 5, seed: 21);
        using var cancel = new CancellationTokenSource();
        var walker = new CancellingForecaster(cancel, cancelAt: 300);
        var settings = new BacktestSettings { Horizon = BacktestHorizon.Days(5), Sweep = false, SelectionWindowDays = 60, Forecasters = ["ewma:0.94"] };

        Assert.ThrowsAny<OperationCanceledException>(() => Backtester.Run(prices, null, settings, [walker], cancellationToken: cancel.Token));

        // Without a check inside the walk the session would be asked for all 1,500 dates.
        Assert.InRange(walker.LastDate, 300, 300 + 64);
    }

    /// <summary>A forecaster whose walk cancels the token at one date and records the last date it was asked for.</summary>
    private sealed class CancellingForecaster(CancellationTokenSource cancel, int cancelAt) : IVolatilityForecaster, IForecastSession
    {
        public int LastDate { get; private set; } = -1;

        public string Spec => "cancelling";

        public ForecasterCounts Counts => ForecasterCounts.None;

        public IForecastSession Start(ForecastInput input) => this;

        public double? Forecast(int t)
        {
            LastDate = t;
            if (t == cancelAt)
            {
                cancel.Cancel();
            }

            return 0.2;
        }
    }
}
