using VolCast.Core;

namespace VolCast.Core.Tests;

public class PreconditionsTests
{
    [Fact]
    public void Positive_Zero_NamesTheArgumentFromTheCallSiteAndSaysWhatWasExpected()
    {
        var spot = 0.0;

        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => Preconditions.Positive(spot, "price"));

        Assert.Equal("spot", ex.ParamName);
        Assert.StartsWith("spot must be a finite price above zero, was 0.", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(-1e-300)]
    public void Positive_NotAUsablePositiveNumber_Throws(double value)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => Preconditions.Positive(value));
        Assert.False(Preconditions.IsPositive(value));
        Assert.False(Preconditions.IsPositive((double?)value));
    }

    [Fact]
    public void IsPositive_MissingValue_IsFalse() => Assert.False(Preconditions.IsPositive((double?)null));

    [Fact]
    public void SameLength_Differs_ThrowsArgumentExceptionNamingBothLengths()
    {
        var ex = Assert.Throws<ArgumentException>(() => Preconditions.SameLength(3, 4, "the dates", "close"));

        Assert.Equal("close", ex.ParamName);
        Assert.StartsWith("close must be aligned with the dates and have the same length (4), was 3.", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void PositiveAt_NegativeElement_NamesTheIndexAndTheReason()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => Preconditions.PositiveAt(-2, 7, "volatility", "forecast", "for this test"));

        Assert.Equal("forecast", ex.ParamName);
        Assert.StartsWith("forecast[7] must be a finite volatility above zero for this test, was -2.", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(1.0)]
    [InlineData(double.NaN)]
    public void Fraction_OutsideOpenUnitInterval_Throws(double level) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => Preconditions.Fraction(level));

    [Fact]
    public void Between_Above_SaysWhatTheMaximumMeans()
    {
        var lag = 5;

        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => Preconditions.Between(lag, 0, 4, "the number of observations minus one"));

        Assert.Equal("lag", ex.ParamName);
        Assert.StartsWith("lag must be between 0 and the number of observations minus one (4), was 5.", ex.Message, StringComparison.Ordinal);
    }
}
