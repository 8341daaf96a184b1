using VolCast.Core.Data;
using VolCast.Core.Forecasters;
using VolCast.Core.Garch;
using VolCast.Core.Tests.Garch;

namespace VolCast.Core.Tests.Forecasters;

public sealed class GarchForecasterTests
{
    private const int Horizon = 21;

    [Fact]
    public void Forecast_FirstFitAndFilterBetweenRefits_MatchDirectComputation()
    {
        // Naive reference: fit the window directly with the fitter, then apply the recursion and the discrete
        // horizon average by hand; the walk-forward session must give the same numbers.
        var returns = GarchSimulation.Returns(new GarchParameters(0.0003, 2e-6, 0.08, 0.9), 400, seed: 2);
        var prices = PriceHistory.FromCloses(ForecastData.Dates(401), GarchSimulation.Closes(returns));
        var session = new GarchForecaster(refitEveryDays: 5, rollingWindowDays: 300, minimumReturns: 250)
            .Start(new ForecastInput(prices, null, Horizon));

        var actual = new double?[401];
        for (var t = 0; t <= 400; t++)
        {
            actual[t] = session.Forecast(t);
        }

        // No forecast before 250 returns (day 250 is the first with 250 returns).
        Assert.All(actual[..250], Assert.Null);
        var realized = Returns.LogReturns(prices.Close);
        var fit = GarchFitter.Fit(realized.AsSpan(0, 250), new GarchFitOptions { ComputeStandardErrors = false });
        var p = fit.Parameters;
        Assert.Equal(Expected(p, fit.NextVariance), actual[250]!.Value, 14);

        // Days 251..254: same parameters, variance filter updated daily with the new returns.
        var next = fit.NextVariance;
        for (var day = 251; day <= 254; day++)
        {
            next = p.NextVariance(next, realized[day - 1] - p.Mu);
            Assert.Equal(Expected(p, next), actual[day]!.Value, 14);
        }

        // Day 255 refits (warm-started); the new estimate differs from the old one.
        Assert.NotEqual(Expected(p, p.NextVariance(next, realized[254] - p.Mu)), actual[255]!.Value);
        Assert.Equal(new ForecasterCounts(31, 0, 0, 0), session.Counts);
    }

    [Fact]
    public void Forecast_RollingWindowWarmStarted_CloseToColdFitOnSameWindow()
    {
        // A warm-started refit maximizes the same likelihood as a cold one, so the forecasts agree closely.
        var returns = GarchSimulation.Returns(new GarchParameters(0.0003, 2e-6, 0.08, 0.9), 700, seed: 6);
        var prices = PriceHistory.FromCloses(ForecastData.Dates(701), GarchSimulation.Closes(returns));
        var session = new GarchForecaster(refitEveryDays: 1, rollingWindowDays: 400).Start(new ForecastInput(prices, null, Horizon));
        double? last = null;
        for (var t = 0; t <= 700; t++)
        {
            last = session.Forecast(t);
        }

        var realized = Returns.LogReturns(prices.Close);
        var cold = GarchFitter.Fit(realized.AsSpan(300, 400), new GarchFitOptions { ComputeStandardErrors = false });
        Assert.Equal(Expected(cold.Parameters, cold.NextVariance), last!.Value, 4);
    }

    [Fact]
    public void Forecast_ConstantPricesAfterAGoodFit_CountsFailuresAndKeepsParameters()
    {
        // 260 returns of clustering, then a long flat stretch: the refits over windows of only flat prices fail and are
        // counted, and the session keeps forecasting with the last good parameters (no NaN, no exception).
        var returns = GarchSimulation.Returns(new GarchParameters(0, 2e-6, 0.08, 0.9), 260, seed: 3);
        var closes = GarchSimulation.Closes(returns).Concat(Enumerable.Repeat(0.0, 200)).ToArray();
        for (var i = 261; i < closes.Length; i++)
        {
            closes[i] = closes[260];
        }

        var prices = PriceHistory.FromCloses(ForecastData.Dates(closes.Length), closes);
        var session = new GarchForecaster(rollingWindowDays: 100, minimumReturns: 100).Start(new ForecastInput(prices, null, Horizon));
        double? last = null;
        for (var t = 0; t < closes.Length; t++)
        {
            last = session.Forecast(t);
            if (last is double v)
            {
                Assert.True(double.IsFinite(v) && v > 0);
            }
        }

        // Windows of only flat prices throw (counted as failed); windows mostly flat may end with persistence at one
        // (counted as not stationary). Either way the last good parameters keep forecasting.
        Assert.True(session.Counts.FailedFits > 0, session.Counts.ToString());
        Assert.NotNull(last);
    }

    [Theory]
    // Window shorter than the minimum history, refit interval zero, minimum below the fitter's.
    [InlineData(5, 200, 250)]
    [InlineData(0, 2520, 250)]
    [InlineData(5, 2520, 50)]
    public void Constructor_BadSettings_Throw(int refit, int window, int minimum)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new GarchForecaster(GarchVariant.Garch, true, refit, window, minimum));
    }

    private static double Expected(GarchParameters p, double nextVariance) =>
        Math.Sqrt(252 * GarchHorizon.AverageVariance(nextVariance, p.LongRunVariance!.Value, p.Persistence, Horizon));
}
