using VolCast.Core.Trading.Snooping;

namespace VolCast.Core.Tests.Trading.Snooping;

public class DataSnoopingGuardTests
{
    private static readonly DataSnoopingOptions Options = new(5, seed: 1, replications: 20);

    [Fact]
    public void TestMeans_NoRule_IsRefusedWithAMessageThatSaysSo()
    {
        var error = Assert.Throws<ArgumentException>(() => DataSnooping.TestMeans([], Options));
        Assert.Contains("at least one rule", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void TestMeans_FewerThanTwoDays_IsRefused()
    {
        var error = Assert.ThrowsAny<ArgumentException>(() => DataSnooping.TestMeans([[0.1]], Options));
        Assert.Contains("at least 2 days", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void TestMeans_RaggedRows_AreRefusedNamingTheRow()
    {
        var error = Assert.Throws<ArgumentException>(() => DataSnooping.TestMeans([[0.1, 0.2, 0.3], [0.1, 0.2]], Options));
        Assert.Contains("differences[1] has 2 days but differences[0] has 3", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(double.NegativeInfinity)]
    public void TestMeans_NonFiniteValue_IsRefusedNamingRuleAndDay(double value)
    {
        var error = Assert.Throws<ArgumentException>(() => DataSnooping.TestMeans([[0.1, 0.2, 0.3], [0.1, value, 0.3]], Options));
        Assert.Contains("differences[1][1] must be a finite number", error.Message, StringComparison.Ordinal);

        var flat = Assert.Throws<ArgumentException>(() => DataSnooping.TestMeans([0.1, 0.2, 0.3, 0.1, value, 0.3], 2, 3, Options));
        Assert.Contains("differences[1][1] must be a finite number", flat.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void TestMeans_FlatArrayOfTheWrongLength_IsRefused()
    {
        var error = Assert.Throws<ArgumentException>(() => DataSnooping.TestMeans(new double[7], 2, 4, Options));
        Assert.Contains("2 × 4 = 8 values", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(0.5)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void Options_MeanBlockLengthBelowOne_IsRefused(double meanBlockLength)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new DataSnoopingOptions(meanBlockLength, seed: 1));
        Assert.Contains("at least 1", error.Message, StringComparison.Ordinal);
        Assert.Throws<ArgumentOutOfRangeException>(() => StationaryBootstrap.Draw(10, meanBlockLength, 10, 1));
    }

    [Theory]
    [InlineData(0)]
    [InlineData(-5)]
    public void Options_NoReplication_IsRefused(int replications)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new DataSnoopingOptions(5, seed: 1, replications: replications));
        Assert.Contains("at least 1 bootstrap replication", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(1.0)]
    [InlineData(double.NaN)]
    public void Options_LevelOutsideZeroOne_IsRefused(double level)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new DataSnoopingOptions(5, seed: 1, level: level));
    }

    [Fact]
    public void Options_ForHorizon_UsesTheHorizonAsBlockLengthAndTheDefaults()
    {
        // The defaults of the rule search: B = 1,000, mean block length = horizon, familywise level 5%.
        var options = DataSnoopingOptions.ForHorizon(21, seed: 3);
        Assert.Equal(21.0, options.MeanBlockLength);
        Assert.Equal(1000, options.Replications);
        Assert.Equal(0.05, options.Level);
    }

    [Fact]
    public void TestMeans_DrawsForAnotherLength_AreRefused()
    {
        var draws = StationaryBootstrap.Draw(10, 2, 5, 1);
        var error = Assert.Throws<ArgumentException>(() => DataSnooping.TestMeans([new double[12]], draws, 0.05));
        Assert.Contains("resample 10 dates but the data has 12", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void TestSharpeRatios_BenchmarkOfAnotherLengthOrConstantPath_IsRefused()
    {
        var length = Assert.Throws<ArgumentException>(() => DataSnooping.TestSharpeRatios([[0.1, 0.2, 0.3]], [0.1, 0.2], Options));
        Assert.Contains("benchmarkPath has 2 days but the rule paths have 3", length.Message, StringComparison.Ordinal);

        var idle = Assert.Throws<ArgumentException>(() => DataSnooping.TestSharpeRatios([[0.0, 0.0, 0.0]], [0.1, 0.2, -0.1], Options));
        Assert.Contains("rulePaths[0] is the same value", idle.Message, StringComparison.Ordinal);
        Assert.Contains("Sharpe ratio is undefined", idle.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void CopyIndices_ReplicationOutOfRange_IsRefused()
    {
        var draws = StationaryBootstrap.Draw(10, 2, 5, 1);
        Assert.Throws<ArgumentOutOfRangeException>(() => draws.CopyIndices(5, new int[10]));
        Assert.Throws<ArgumentException>(() => draws.CopyIndices(0, new int[9]));
    }
}
