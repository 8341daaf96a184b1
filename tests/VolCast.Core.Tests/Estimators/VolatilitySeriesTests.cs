using VolCast.Core.Estimators;

namespace VolCast.Core.Tests.Estimators;

public sealed class VolatilitySeriesTests
{
    [Fact]
    public void Constructor_Values_AreCopied()
    {
        var values = new[] { 0.1, 0.2 };

        var series = new VolatilitySeries(Estimator.Parkinson, 10, 9, values);
        values[0] = 9;

        Assert.Equal(0.1, series.AnnualizedVolatility[0]);
        Assert.Equal(2, series.Count);
        Assert.Equal(9, series.FirstIndex);
        Assert.Equal(Estimator.Parkinson, series.Estimator);
        Assert.Equal(10, series.Window);
    }

    [Theory]
    // NaN, infinite and negative volatilities are not volatilities.
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(-0.1)]
    public void Constructor_BadValue_Throws(double bad)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new VolatilitySeries(Estimator.Parkinson, 10, 9, [0.1, bad]));

        Assert.Contains("annualizedVolatility[1]", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Constructor_NegativeFirstIndex_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new VolatilitySeries(Estimator.Parkinson, 10, -1, [0.1]));
    }
}
