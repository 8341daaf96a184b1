using VolCast.Core.Calibration;

namespace VolCast.Core.Tests.Calibration;

public sealed class WilsonIntervalTests
{
    [Theory]
    // R 4.2.2: prop.test(40, 50, correct = FALSE)$conf.int (the Wilson score interval) [D].
    [InlineData(0.8, 50.0, 0.669628940677746, 0.887562499842239)]
    // R 4.2.2: prop.test(0, 10, correct = FALSE)$conf.int; upper = z²/(n + z²) [D].
    [InlineData(0.0, 10.0, 0.0, 0.277532799862889)]
    public void Compute_KnownCases_MatchR(double proportion, double n, double lower, double upper)
    {
        var (lo, hi) = WilsonInterval.Compute(proportion, n);

        Assert.Equal(lower, lo, 12);
        Assert.Equal(upper, hi, 12);
    }

    [Fact]
    public void Compute_SmallerEffectiveSample_GivesAWiderInterval()
    {
        // n_eff = n / h for overlapping windows (common practice, no source): 210 outcomes at h = 21 act like 10.
        var (lo210, hi210) = WilsonInterval.Compute(0.3, 210);
        var (lo10, hi10) = WilsonInterval.Compute(0.3, 210 / 21.0);

        Assert.True(hi10 - lo10 > 2.5 * (hi210 - lo210), $"{hi10 - lo10} vs {hi210 - lo210}");
    }

    [Fact]
    public void Compute_ProportionOutsideUnitInterval_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => WilsonInterval.Compute(1.2, 10));
    }
}
