using VolCast.Core.Calibration;

namespace VolCast.Core.Tests.Calibration;

public sealed class AboveStrikeProbabilityTests
{
    [Fact]
    public void D2_HullExample15_6_Matches()
    {
        // Hull, Options, Futures, and Other Derivatives 11e, Ex. 15.6 (docs/methods.md#black-scholes-merton-and-black-76) [C]:
        // S = 42, K = 40, r = 10%, σ = 20%, T = 0.5 → d2 = 0.6278 (printed to 4 decimals).
        var d2 = AboveStrikeProbability.D2(42, 40, 0.20, 0.5, 0.10);

        Assert.Equal(0.6278, d2, 4);
    }

    [Fact]
    public void Compute_HullExample15_6_IsNormalCdfOfD2()
    {
        // Same inputs; N(0.627841) = 0.734946 [D: R 4.2.2, pnorm((log(42/40) + 0.08 * 0.5) / (0.2 * sqrt(0.5)))].
        var p = AboveStrikeProbability.Compute(42, 40, 0.20, 0.5, 0.10);

        Assert.Equal(0.734946036845909, p, 12);
    }

    [Fact]
    public void Compute_DividendYield_LowersTheDriftLikeANegativeRate()
    {
        // Only r − q enters d2 [D: the formula]: r = 5%, q = 5% is the same as r = q = 0.
        var withBoth = AboveStrikeProbability.Compute(100, 105, 0.3, 0.25, 0.05, 0.05);
        var withNone = AboveStrikeProbability.Compute(100, 105, 0.3, 0.25);

        Assert.Equal(withNone, withBoth, 15);
    }

    [Fact]
    public void Compute_AtTheMoneyWithoutDrift_IsBelowOneHalfByTheLognormalCorrection()
    {
        // d2 = −σ√τ/2 at K = S, r = q = 0 [D: the formula]: σ = 0.2, τ = 1 → N(−0.1) = 0.460172162722971 (R pnorm(-0.1)).
        Assert.Equal(0.460172162722971, AboveStrikeProbability.Compute(100, 100, 0.2, 1.0), 13);
    }

    [Theory]
    [InlineData(0.0, 100.0, 0.2, 1.0)] // spot zero
    [InlineData(100.0, -1.0, 0.2, 1.0)] // negative strike
    [InlineData(100.0, 100.0, 0.0, 1.0)] // zero volatility
    [InlineData(100.0, 100.0, 0.2, double.NaN)] // NaN time
    public void D2_InvalidInput_Throws(double spot, double strike, double volatility, double time)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => AboveStrikeProbability.D2(spot, strike, volatility, time));
    }
}
