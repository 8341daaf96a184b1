using System.Globalization;
using FsCheck;
using FsCheck.Fluent;
using VolCast.Core.Scoring;

namespace VolCast.Core.Tests.Scoring;

public sealed class FalseDiscoveryRateTests
{
    private static readonly string FixturePath = Path.Combine(AppContext.BaseDirectory, "Fixtures", "Batch", "bh-reference.csv");

    [Fact]
    public void BenjaminiHochberg_RFixture_MatchesPAdjust()
    {
        // R 4.2.2 stats::p.adjust(method = "BH"), Fixtures/Batch/make-bh-fixture.R [C]: an independent recomputation.
        var rows = File.ReadAllLines(FixturePath).Where(l => !l.StartsWith('#')).Skip(1)
            .Select(l => l.Split(','))
            .Select(f => (Case: int.Parse(f[0], CultureInfo.InvariantCulture), P: double.Parse(f[2], CultureInfo.InvariantCulture), Bh: double.Parse(f[3], CultureInfo.InvariantCulture)))
            .ToList();
        var cases = rows.GroupBy(r => r.Case).ToList();
        Assert.Equal(4, cases.Count);
        var worst = 0.0;
        foreach (var group in cases)
        {
            var p = group.Select(r => r.P).ToArray();
            var expected = group.Select(r => r.Bh).ToArray();
            var actual = FalseDiscoveryRate.BenjaminiHochberg(p);
            for (var i = 0; i < p.Length; i++)
            {
                worst = Math.Max(worst, Math.Abs(actual[i] - expected[i]));
                Assert.Equal(expected[i], actual[i], 1e-14);
            }
        }

        Assert.True(worst < 1e-14, $"largest difference from R was {worst}");
    }

    [Fact]
    public void BenjaminiHochberg_PaperExample_RejectsFourAtFivePercent()
    {
        // Benjamini & Hochberg (1995), JRSS B 57, section 4 example: 15 p-values, q = 0.05 rejects the four smallest
        // (from memory; the same vector is case 1 of the R fixture).
        double[] p = [0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.3240, 0.4262, 0.5719, 0.6528, 0.7590, 1.0000];
        var adjusted = FalseDiscoveryRate.BenjaminiHochberg(p);
        Assert.Equal(4, adjusted.Count(a => a <= 0.05));
    }

    [Fact]
    public void BenjaminiHochberg_Empty_ReturnsEmpty() =>
        Assert.Empty(FalseDiscoveryRate.BenjaminiHochberg(ReadOnlySpan<double>.Empty));

    [Theory]
    [InlineData(double.NaN)] // a missing test must be left out by the caller, not passed as NaN
    [InlineData(-0.01)] // below the range of a probability
    [InlineData(1.5)] // above it
    public void BenjaminiHochberg_InvalidPValue_Throws(double bad)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => FalseDiscoveryRate.BenjaminiHochberg([0.1, bad]));
        Assert.Contains("p-value 1 was", ex.Message, StringComparison.Ordinal);
    }

    [FsCheck.Xunit.Property]
    public Property BenjaminiHochberg_AnyPValues_AdjustedAtLeastRawAtMostOneAndOrderKept()
    {
        // Common practice, no source: BH never lowers a p-value, caps at 1 and keeps the ranking of the raw p-values.
        var gen = Gen.Choose(0, 1000).Select(i => i / 1000.0).ArrayOf().Where(a => a.Length > 0);
        return Prop.ForAll(gen.ToArbitrary(), p =>
        {
            var adjusted = FalseDiscoveryRate.BenjaminiHochberg(p);
            var ok = true;
            for (var i = 0; i < p.Length; i++)
            {
                ok &= adjusted[i] >= p[i] - 1e-15 && adjusted[i] <= 1.0;
                for (var j = 0; j < p.Length; j++)
                {
                    ok &= !(p[i] < p[j]) || adjusted[i] <= adjusted[j];
                }
            }

            return ok;
        });
    }
}
