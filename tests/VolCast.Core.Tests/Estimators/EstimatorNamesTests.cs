using VolCast.Core.Estimators;

namespace VolCast.Core.Tests.Estimators;

public sealed class EstimatorNamesTests
{
    [Fact]
    public void All_ListsDesignNamesInEnumOrder()
    {
        // docs/files.md#names-of-estimators-and-forecasters.
        Assert.Equal(["close-to-close", "parkinson", "garman-klass", "rogers-satchell", "yang-zhang"], EstimatorNames.All);
        for (var i = 0; i < EstimatorNames.All.Count; i++)
        {
            Assert.Equal(EstimatorNames.All[i], EstimatorNames.Name((Estimator)i));
        }
    }

    [Theory]
    // Case is ignored.
    [InlineData("close-to-close", Estimator.CloseToClose)]
    [InlineData("Parkinson", Estimator.Parkinson)]
    [InlineData("GARMAN-KLASS", Estimator.GarmanKlass)]
    [InlineData("rogers-satchell", Estimator.RogersSatchell)]
    [InlineData("Yang-Zhang", Estimator.YangZhang)]
    public void TryParse_KnownName_ReturnsEstimator(string name, Estimator expected)
    {
        Assert.True(EstimatorNames.TryParse(name, out var estimator));
        Assert.Equal(expected, estimator);
    }

    [Theory]
    // Near misses and empty input are not guessed at.
    [InlineData("")]
    [InlineData("yang_zhang")]
    [InlineData("close")]
    [InlineData(" parkinson")]
    [InlineData(null)]
    public void TryParse_UnknownName_ReturnsFalse(string? name)
    {
        Assert.False(EstimatorNames.TryParse(name!, out _));
    }

    [Fact]
    public void NeedsRange_OnlyCloseToCloseWorksWithoutRange()
    {
        Assert.False(EstimatorNames.NeedsRange(Estimator.CloseToClose));
        Assert.True(EstimatorNames.NeedsRange(Estimator.Parkinson));
        Assert.True(EstimatorNames.NeedsRange(Estimator.GarmanKlass));
        Assert.True(EstimatorNames.NeedsRange(Estimator.RogersSatchell));
        Assert.True(EstimatorNames.NeedsRange(Estimator.YangZhang));
    }

    [Fact]
    public void Name_UndefinedEstimator_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => EstimatorNames.Name((Estimator)(-1)));
    }
}
