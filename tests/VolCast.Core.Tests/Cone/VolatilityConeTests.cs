using VolCast.Core.Cone;

namespace VolCast.Core.Tests.Cone;

public sealed class VolatilityConeTests
{
    private static double[] SeededReturns(int seed, int count, double dailyVolatility)
    {
        var random = new Random(seed);
        var returns = new double[count];
        for (var i = 0; i < count; i++)
        {
            // The scale is enough to make a cone with a spread; the law does not matter here.
            returns[i] = dailyVolatility * Gaussian.Next(random);
        }

        return returns;
    }

    [Fact]
    public void Quantile_Type7_MatchesR()
    {
        // R 4.2.2: quantile(c(3,1,4,1,5,9,2,6), c(0,.1,.25,.5,.75,.9,1), type = 7) = 1, 1, 1.75, 3.5, 5.25, 6.9, 9.
        double[] sorted = [1, 1, 2, 3, 4, 5, 6, 9];
        double[] expected = [1, 1, 1.75, 3.5, 5.25, 6.9, 9];
        for (var i = 0; i < expected.Length; i++)
        {
            Assert.Equal(expected[i], Quantile.Type7(sorted, ConePercentiles.Levels[i]), 12);
        }
    }

    [Fact]
    public void Compute_HorizonOne_MedianEqualsDailyRealizedVolQuantile()
    {
        var returns = SeededReturns(7, 1001, 0.012);

        var cone = VolatilityCone.Compute(returns, [1], 252);

        // Directly: one-day zero-mean realized vol is sqrt(252 r²) = sqrt(252)|r|; 1001 values, so the median is the 501st.
        var daily = new double[returns.Length];
        for (var i = 0; i < returns.Length; i++)
        {
            daily[i] = Math.Sqrt(252.0) * Math.Abs(returns[i]);
        }

        Array.Sort(daily);
        var row = Assert.Single(cone.Horizons);
        Assert.Equal(daily[500], row.Raw.Median, 14);
        Assert.Equal(daily[0], row.Raw.Min, 14);
        Assert.Equal(daily[^1], row.Raw.Max, 14);
        // At h = 1, m = T/(T − 1), so the adjusted median is the direct one times sqrt(T/(T − 1)).
        Assert.Equal(daily[500] * Math.Sqrt(1001.0 / 1000.0), row.Adjusted.Median, 14);
    }

    [Fact]
    public void Compute_Adjusted_EqualsPercentilesOfWindowVariancesScaledByFactor()
    {
        var returns = SeededReturns(11, 600, 0.01);
        const int h = 21;

        var cone = VolatilityCone.Compute(returns, [h], 252);

        // The documented rule: multiply each window's variance by m, then take type 7 percentiles of the vols.
        var m = HodgesTompkins.VarianceFactor(returns.Length, h);
        var n = returns.Length - h + 1;
        var vols = new double[n];
        for (var s = 0; s < n; s++)
        {
            var sum = 0.0;
            for (var k = s; k < s + h; k++)
            {
                sum += returns[k] * returns[k];
            }

            vols[s] = Math.Sqrt(m * 252.0 / h * sum);
        }

        Array.Sort(vols);
        var row = Assert.Single(cone.Horizons);
        var adjusted = row.Adjusted.ToArray();
        for (var i = 0; i < adjusted.Length; i++)
        {
            Assert.Equal(Quantile.Type7(vols, ConePercentiles.Levels[i]), adjusted[i], 12);
        }

        Assert.Equal(n, row.WindowCount);
        Assert.Equal(m, row.VarianceFactor);
    }

    [Fact]
    public void Compute_ConstantAbsoluteReturns_EveryPercentileIsThatVolatility()
    {
        // |r| = 1% every day: every window's zero-mean vol is 0.01 × sqrt(252) whatever the signs.
        var returns = new double[300];
        for (var i = 0; i < returns.Length; i++)
        {
            returns[i] = i % 3 == 0 ? -0.01 : 0.01;
        }

        var cone = VolatilityCone.Compute(returns, [5, 10, 21], 252);

        foreach (var row in cone.Horizons)
        {
            foreach (var value in row.Raw.ToArray())
            {
                Assert.Equal(0.01 * Math.Sqrt(252), value, 12);
            }

            Assert.Equal(0.01 * Math.Sqrt(252), row.Latest, 12);
        }
    }

    [Fact]
    public void Compute_PercentilesAreOrderedAndLatestIsLastWindow()
    {
        var returns = SeededReturns(3, 2000, 0.01);

        var cone = VolatilityCone.Compute(returns, VolatilityCone.DefaultHorizons, 252);

        Assert.Equal(VolatilityCone.DefaultHorizons, cone.Horizons.Select(r => r.HorizonDays));
        foreach (var row in cone.Horizons)
        {
            var values = row.Raw.ToArray();
            for (var i = 1; i < values.Length; i++)
            {
                Assert.True(values[i] >= values[i - 1], $"h={row.HorizonDays}: percentile {i} below the one before");
            }

            var h = row.HorizonDays;
            var last = 0.0;
            for (var k = returns.Length - h; k < returns.Length; k++)
            {
                last += returns[k] * returns[k];
            }

            Assert.Equal(Math.Sqrt(252.0 / h * last), row.Latest, 12);
        }
    }

    [Fact]
    public void Compute_ShortSample_SkipsHorizonsWithFewerThanTwoHWindows()
    {
        var returns = SeededReturns(5, 300, 0.01);

        var cone = VolatilityCone.Compute(returns, VolatilityCone.DefaultHorizons, 252);

        // 300 returns: h = 63 gives 238 ≥ 126 windows; h = 126 gives 175 < 252, h = 252 gives 49.
        Assert.Equal([5, 10, 21, 42, 63], cone.Horizons.Select(r => r.HorizonDays));
        Assert.Equal([126, 252], cone.SkippedHorizons);
    }

    [Fact]
    public void Compute_NonFiniteReturn_ThrowsWithIndex()
    {
        double[] returns = [0.01, double.NaN, 0.02];

        var ex = Assert.Throws<ArgumentException>(() => VolatilityCone.Compute(returns, [1], 252));
        Assert.Contains("logReturns[1]", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Compute_HorizonsNotIncreasing_Throws()
    {
        var ex = Assert.Throws<ArgumentException>(() => VolatilityCone.Compute(new double[100], [10, 5], 252));
        Assert.Contains("strictly increasing", ex.Message, StringComparison.Ordinal);
    }
}
