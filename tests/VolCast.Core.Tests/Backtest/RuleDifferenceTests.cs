using MathNet.Numerics.Distributions;
using VolCast.Core.Backtest;

namespace VolCast.Core.Tests.Backtest;

public sealed class RuleDifferenceTests
{
    // Four dates, threshold 2 vol points. IV − RV = 1, 2, 3, 6 points; implied − forecast = 0, 5, 0, 5 points, so the
    // rule sells on the second and fourth dates.
    private static readonly RuleTestResult Rule = new(
        0.02,
        "garch",
        "close-to-close:21",
        [],
        [new DateOnly(2024, 1, 2), new DateOnly(2024, 1, 3), new DateOnly(2024, 1, 4), new DateOnly(2024, 1, 5)],
        [0.20, 0.20, 0.20, 0.20],
        [0.19, 0.18, 0.17, 0.14],
        [0.20, 0.15, 0.20, 0.15],
        [0.20, 0.20, 0.20, 0.20]);

    [Fact]
    public void SignalledMinusAll_IsTheDifferenceOfTheTwoMeans()
    {
        var test = Rule.SignalledMinusAll(RuleSignal.SellVolatility, lag: 0);

        // Worked by hand: signalled (2 + 6) / 2 = 4 points, all (1 + 2 + 3 + 6) / 4 = 3 points, difference 1 point.
        Assert.Equal(0.01, test.Mean, 12);
        Assert.Equal(4, test.Count);
    }

    [Fact]
    public void SignalledMinusAll_LagZero_ErrorIsTheDeltaMethodsSampleError()
    {
        var test = Rule.SignalledMinusAll(RuleSignal.SellVolatility, lag: 0);

        // Worked by hand (delta method, share π = 1/2): d_t = s_t (g_t − 4) / π − (g_t − 3) + 1 = 3, −2, 1, 2 points;
        // their deviations from 1 are 2, −3, 0, 1, so γ̂_0 = 14 / 4 = 3.5 points² and the error is √(3.5 / 4) points.
        Assert.Equal(Math.Sqrt(3.5e-4 / 4), test.StandardError!.Value, 12);
        var t = 0.01 / Math.Sqrt(3.5e-4 / 4);
        Assert.Equal(t, test.TStatistic!.Value, 9);

        // Two-sided normal p from MathNet's normal distribution, an implementation outside the project.
        Assert.Equal(2 * Normal.CDF(0, 1, -t), test.PValue!.Value, 12);
    }

    [Fact]
    public void SignalledMinusAll_LagOne_AddsTheBartlettWeightedFirstAutocovariance()
    {
        var test = Rule.SignalledMinusAll(RuleSignal.SellVolatility, lag: 1);

        // Newey and West (1987), Bartlett weight 1 − 1/2: γ̂_1 = (2·(−3) + (−3)·0 + 0·1) / 4 = −1.5 points², so the
        // long-run variance is 3.5 + 2 · 0.5 · (−1.5) = 2 points² and the error √(2 / 4) points.
        Assert.Equal(Math.Sqrt(2e-4 / 4), test.StandardError!.Value, 12);
    }

    [Fact]
    public void SignalledMinusAll_NoDateSignalled_HasNoErrorAndNoP()
    {
        var test = Rule.SignalledMinusAll(RuleSignal.BuyVolatility, lag: 0);

        Assert.Null(test.StandardError);
        Assert.Null(test.PValue);
    }
}
