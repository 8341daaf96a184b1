using VolCast.Core.Trading.Snooping;

namespace VolCast.Core.Tests.Trading.Snooping;

public class AutomaticBlockLengthTests
{
    private const int Days = 20000;

    [Fact]
    public void Of_OverlappingSums_MatchesTheOptimalLengthOfTheTrueAutocovariances()
    {
        // Politis & White (2004) with the correction of Patton, Politis & White (2009): b_opt = (2G²/D)^{1/3} T^{1/3},
        // G = Σ|k|R(k), D = 2(ΣR(k))². For the MA(h − 1) of overlapping h-sums R(k) = h − |k|, so ΣR = h² and
        // G = (h − 1)h(h + 1)/3, hence b_opt = (G / h²)^{2/3} T^{1/3}: 37.1 for h = 5, T = 20,000.
        const int h = 5;
        var expected = Math.Pow((h - 1) * h * (h + 1) / 3.0 / (h * h), 2.0 / 3.0) * Math.Cbrt(Days);
        var mean = MeanOver(seed => SnoopingData.Normalized(new Random(seed), Days, h));
        Assert.InRange(mean, 0.85 * expected, 1.15 * expected);
    }

    [Fact]
    public void Of_AutoregressiveSeries_MatchesTheOptimalLengthOfTheTrueAutocovariances()
    {
        // AR(1) with φ = 0.5: R(k) ∝ φ^|k|, so G / ΣR = 2φ / (1 − φ²) and b_opt = (2φ / (1 − φ²))^{2/3} T^{1/3} ≈ 32.9
        // (Politis & White 2004, the same formula as above).
        const double phi = 0.5;
        var expected = Math.Pow(2 * phi / (1 - (phi * phi)), 2.0 / 3.0) * Math.Cbrt(Days);
        var mean = MeanOver(seed =>
        {
            var random = new Random(seed + 100);
            var x = new double[Days];
            for (var t = 1; t < Days; t++)
            {
                x[t] = (phi * x[t - 1]) + Gaussian.Next(random);
            }

            return x;
        });
        Assert.InRange(mean, 0.85 * expected, 1.15 * expected);
    }

    [Fact]
    public void Of_IndependentDays_GivesBlocksOfAboutOneDayAndTheFloorWins()
    {
        // With no serial dependence there is nothing for blocks to keep (Politis & White 2004: m̂ = 1 or so, Ĝ ≈ 0).
        var rows = new double[3][];
        for (var k = 0; k < rows.Length; k++)
        {
            var random = new Random(k + 7);
            rows[k] = new double[2000];
            for (var t = 0; t < rows[k].Length; t++)
            {
                rows[k][t] = Gaussian.Next(random);
            }
        }

        Assert.InRange(AutomaticBlockLength.Of(rows[0]), 1.0, 3.0);
        Assert.Equal(5.0, AutomaticBlockLength.Of(rows, floor: 5));
    }

    [Fact]
    public void Of_ConstantSeries_GivesOne()
    {
        // A rule that never trades has a constant difference: no variance, so no dependence to keep.
        Assert.Equal(1.0, AutomaticBlockLength.Of(SnoopingData.Filled(100, 0.3)));
    }

    [Fact]
    public void Of_TooFewDates_SaysHowManyItNeeds()
    {
        var ex = Assert.Throws<ArgumentException>(() => AutomaticBlockLength.Of(new double[] { 1, 2, 3 }));
        Assert.Contains("at least 4 dates", ex.Message, StringComparison.Ordinal);
    }

    private static double MeanOver(Func<int, double[]> series)
    {
        var sum = 0.0;
        for (var seed = 0; seed < 10; seed++)
        {
            sum += AutomaticBlockLength.Of(series(seed));
        }

        return sum / 10;
    }
}
