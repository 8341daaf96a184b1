using VolCast.Core.Scoring;

namespace VolCast.Core.Tests.Scoring;

public class NeweyWestTests
{
    private static readonly double[] Toy = [1, 2, 3, 4, 5];

    [Theory]
    // docs/methods.md#newey-west lag table [D] from the rule L = floor(4(T/100)^(2/9)) [C: Patton's newey_west default].
    [InlineData(100, 4)]
    [InlineData(250, 4)]
    [InlineData(500, 5)]
    [InlineData(1000, 6)]
    [InlineData(2500, 8)]
    public void AutomaticLag_ReferenceTable_Matches(int sampleSize, int expected)
    {
        Assert.Equal(expected, NeweyWest.AutomaticLag(sampleSize));
    }

    [Theory]
    // Each row: max(automatic lag, h − 1) (docs/methods.md#newey-west: "for overlapping h-step targets use L ≥ h − 1").
    [InlineData(5000, 21, 20)] // h − 1 dominates: the default 21-day horizon.
    [InlineData(5000, 5, 9)]   // automatic lag floor(4 · 50^(2/9)) = 9 dominates.
    [InlineData(5000, 1, 9)]   // one-day horizon: automatic lag only.
    [InlineData(10, 21, 9)]    // capped at T − 1.
    public void LagForHorizon_Cases_TakesTheLargerAndCaps(int sampleSize, int horizon, int expected)
    {
        Assert.Equal(expected, NeweyWest.LagForHorizon(sampleSize, horizon));
    }

    [Fact]
    public void Autocovariance_ReferenceToy_Matches()
    {
        // docs/methods.md#diebold-mariano toy, d = [1..5]: γ̂_0 = 2, γ̂_1 = 0.8 [D] (divisor T, mean removed).
        Approx.Relative(2.0, NeweyWest.Autocovariance(Toy, 0), 1e-14);
        Approx.Relative(0.8, NeweyWest.Autocovariance(Toy, 1), 1e-14);
    }

    [Fact]
    public void LongRunVariance_ReferenceToy_MatchesBothWindows()
    {
        // docs/methods.md#diebold-mariano toy [D]: rectangular with L = 1 gives V̂ = 3.6; Bartlett L = 1 gives 2 + 2 · 0.5 · 0.8 = 2.8
        // (the value behind DM = 4.008919).
        Approx.Relative(3.6, NeweyWest.LongRunVariance(Toy, 1, LongRunVarianceWindow.Rectangular), 1e-14);
        Approx.Relative(2.8, NeweyWest.LongRunVariance(Toy, 1, LongRunVarianceWindow.Bartlett), 1e-14);
    }

    [Fact]
    public void Weight_Bartlett_IsOneMinusJOverLPlusOne()
    {
        // docs/methods.md#newey-west [C]: weights 1 − j/(L + 1).
        Assert.Equal(0.75, NeweyWest.Weight(LongRunVarianceWindow.Bartlett, 1, 3));
        Assert.Equal(0.25, NeweyWest.Weight(LongRunVarianceWindow.Bartlett, 3, 3));
        Assert.Equal(1.0, NeweyWest.Weight(LongRunVarianceWindow.Rectangular, 3, 3));
    }

    [Fact]
    public void LongRunVariance_LagNotBelowCount_Throws()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => NeweyWest.LongRunVariance(Toy, 5));
        Assert.Contains("between 0 and the number of observations minus one (4), was 5", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void LongRunVariance_NaN_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => NeweyWest.LongRunVariance([1, double.NaN, 3], 1));
    }

    [Fact]
    public void AutomaticLag_ZeroSample_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => NeweyWest.AutomaticLag(0));
    }
}
