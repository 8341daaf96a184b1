using MathNet.Numerics.Distributions;
using VolCast.Core.Numerics;

namespace VolCast.Core.Tests.Options;

public class StandardNormalTests
{
    [Fact]
    public void Z95_IsTheNormalQuantileAtZeroPointNineSevenFive()
    {
        // Abramowitz and Stegun (1964), Table 26.5: the 2.5% upper point of the standard normal is 1.959963985.
        Assert.Equal(1.959963985, StandardNormal.Z95, 9);

        // MathNet.Numerics' inverse normal CDF, an independent implementation, to 1e-14.
        Assert.Equal(StandardNormal.Z95, Normal.InvCDF(0, 1, 0.975), 14);
    }
}
