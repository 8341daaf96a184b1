using VolCast.Core.Data;

namespace VolCast.Core.Tests.Data;

public sealed class ReturnsTests
{
    [Fact]
    public void LogReturns_HullTable15_1_SumsMatch()
    {
        // Source: docs/methods.md#close-to-close-and-annualisation, Hull OFOD 11e Ex. 15.4 / Table 15.1, 21 closes: Σu = 0.09531, Σu² = 0.00326 [C].
        double[] closes = [20.00, 20.10, 19.90, 20.00, 20.50, 20.25, 20.90, 20.90, 20.90, 20.75, 20.75,
            21.00, 21.10, 20.90, 20.90, 21.25, 21.40, 21.40, 21.25, 21.75, 22.00];
        var u = Returns.LogReturns(closes);
        Assert.Equal(20, u.Length);
        Assert.Equal(0.09531, u.Sum(), 5);
        Assert.Equal(0.00326, u.Sum(x => x * x), 5);
    }

    [Fact]
    public void LogReturns_FewerThanTwoCloses_Empty()
    {
        Assert.Empty(Returns.LogReturns([100.0]));
        Assert.Empty(Returns.LogReturns([]));
    }

    [Fact]
    public void LogReturns_DestinationTooShort_Throws()
    {
        var ex = Assert.Throws<ArgumentException>(() => Returns.LogReturns([1.0, 2.0, 3.0], new double[1]));
        Assert.Contains("must hold at least 2 returns", ex.Message, StringComparison.Ordinal);
    }
}
