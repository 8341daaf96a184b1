using VolCast.Core.Data;
using VolCast.Core.Forecasters;
using VolCast.Core.Tests.Garch;

namespace VolCast.Core.Tests.Forecasters;

public sealed class EwmaForecasterTests
{
    [Fact]
    public void NextVariance_HullLambda090Example_Is1_14PercentPerDay()
    {
        // Source: docs/methods.md#ewma, Hull OFOD 11e Ex. 23.1: λ = 0.90, σₙ₋₁ = 1%, uₙ₋₁ = 2% → σₙ² = 0.00013,
        // 1.14%/day [C2; D]. Arithmetic: 0.90·0.0001 + 0.10·0.0004 = 0.00009 + 0.00004 = 0.00013.
        var variance = EwmaForecaster.NextVariance(0.0001, 0.02, 0.90);
        Assert.Equal(0.00013, variance, 15);
        Assert.Equal(0.0114, Math.Sqrt(variance), 4);
    }

    [Fact]
    public void Forecast_HandWorkedFiveDays_MatchesArithmetic()
    {
        // Hand-worked (D): returns 0.01, −0.02, 0.015, 0, −0.01; λ = 0.94; seed from the first k = 2 returns.
        // seed σ²(1|0) = (0.0001 + 0.0004)/2 = 0.00025
        // after r₁ = 0.01:   0.94·0.00025 + 0.06·0.0001 = 0.000235 + 0.000006 = 0.000241
        // after r₂ = −0.02:  0.94·0.000241 + 0.06·0.0004 = 0.00022654 + 0.000024 = 0.00025054   (forecast at day 2)
        // after r₃ = 0.015:  0.94·0.00025054 + 0.06·0.000225 = 0.0002355076 + 0.0000135 = 0.0002490076
        // after r₄ = 0:      0.94·0.0002490076 = 0.000234067144
        // after r₅ = −0.01:  0.94·0.000234067144 + 0.06·0.0001 = 0.00022002311536 + 0.000006 = 0.00022602311536
        double[] returns = [0.01, -0.02, 0.015, 0.0, -0.01];
        var prices = PriceHistory.FromCloses(ForecastData.Dates(6), GarchSimulation.Closes(returns));
        var session = new EwmaForecaster(0.94, seedReturns: 2).Start(new ForecastInput(prices, null, horizonDays: 10));

        Assert.Null(session.Forecast(0));
        Assert.Null(session.Forecast(1));
        Assert.Equal(Math.Sqrt(252 * 0.00025054), session.Forecast(2)!.Value, 12);
        Assert.Equal(Math.Sqrt(252 * 0.0002490076), session.Forecast(3)!.Value, 12);
        Assert.Equal(Math.Sqrt(252 * 0.000234067144), session.Forecast(4)!.Value, 12);
        // Flat over the horizon: the 10-day forecast is the next-day volatility, √(252·0.00022602311536) = 0.23866…
        Assert.Equal(Math.Sqrt(252 * 0.00022602311536), session.Forecast(5)!.Value, 12);
    }

    [Fact]
    public void Forecast_AnnualizationFactor_Used()
    {
        double[] returns = [0.01, -0.02, 0.015];
        var prices = PriceHistory.FromCloses(ForecastData.Dates(4), GarchSimulation.Closes(returns));
        var a252 = new EwmaForecaster(0.94, 2).Start(new ForecastInput(prices, null, 1)).Forecast(3)!.Value;
        var a365 = new EwmaForecaster(0.94, 2).Start(new ForecastInput(prices, null, 1, 365)).Forecast(3)!.Value;
        Assert.Equal(a252 * Math.Sqrt(365.0 / 252.0), a365, 14);
    }

    [Theory]
    // λ must be strictly inside (0, 1).
    [InlineData(0.0)]
    [InlineData(1.0)]
    [InlineData(double.NaN)]
    public void Constructor_LambdaOutside_Throws(double lambda)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new EwmaForecaster(lambda));
        Assert.Contains("strictly between 0 and 1", ex.Message, StringComparison.Ordinal);
    }
}
