using VolCast.Core.Garch;

namespace VolCast.Core.Tests.Garch;

/// <summary>Hull's worked GARCH(1,1) examples (docs/methods.md#garch).</summary>
public sealed class GarchHorizonTests
{
    // Hull's S&P 500 fit (OFOD 8e–10e and RMFI): ω = 0.0000013465, α = 0.083394, β = 0.910116 [C2, RMFI p. 247].
    private static readonly GarchParameters SpFit = new(0, 0.0000013465, 0.083394, 0.910116);

    // Hull 11e Table 23.1 refit: ω = 0.0000039818, α = 0.223793, β = 0.747577 [C2].
    private static readonly GarchParameters Sp2020Fit = new(0, 0.0000039818, 0.223793, 0.747577);

    [Fact]
    public void NextVariance_HullExample232_Is0_00023516()
    {
        // Source: docs/methods.md#garch, Hull OFOD 11e Ex. 23.2: ω = 0.000002, α = 0.13, β = 0.86, σ = 1.6%, u = 1%
        // → σ² = 0.00023516, σ = 1.53349% [C2; D]. Arithmetic: 0.000002 + 0.13·0.0001 + 0.86·0.000256
        // = 0.000002 + 0.000013 + 0.00022016 = 0.00023516.
        var p = new GarchParameters(0, 0.000002, 0.13, 0.86);
        var next = p.NextVariance(0.016 * 0.016, 0.01);
        Assert.Equal(0.00023516, next, 12);
        Assert.Equal(0.0153349, Math.Sqrt(next), 6);
        // Long-run variance 0.000002 / 0.01 = 0.0002, i.e. 1.4%/day [C2].
        Assert.Equal(0.0002, p.LongRunVariance!.Value, 12);
        Assert.Equal(0.014, Math.Sqrt(p.LongRunVariance.Value), 3);
    }

    [Fact]
    public void NextVariance_HullProblem_Is1_078Percent()
    {
        // Source: docs/methods.md#garch: ω = 2e−6, α = 0.06, β = 0.92, σ = 1%, index 1,040 → 1,060; new σ = 1.078% [C2; D].
        // Hull's u is the proportional change 20/1040 = 0.0192308.
        var p = new GarchParameters(0, 2e-6, 0.06, 0.92);
        var next = p.NextVariance(0.0001, 20.0 / 1040.0);
        Assert.Equal(0.01078, Math.Sqrt(next), 5);
    }

    [Fact]
    public void LongRun_HullSp500Fit_Is1_4404PercentPerDay()
    {
        // Source: docs/methods.md#garch: V_L = 0.0002075 i.e. 1.4404%/day; a = ln(1/(α+β)) = 0.006511 [C2; D].
        Assert.Equal(0.0002075, SpFit.LongRunVariance!.Value, 7);
        Assert.Equal(0.014404, Math.Sqrt(SpFit.LongRunVariance.Value), 6);
        Assert.Equal(0.006511, Math.Log(1 / SpFit.Persistence), 6);
    }

    [Fact]
    public void ExpectedVariance_HullSp500FromV0003_Is1_72And1_45Percent()
    {
        // Source: docs/methods.md#garch: from V(0) = 0.0003, expected daily vol 10 days ahead 1.72% (1.7151%),
        // 500 days ahead 1.45% [C2; D].
        var vl = SpFit.LongRunVariance!.Value;
        Assert.Equal(0.017151, Math.Sqrt(GarchHorizon.ExpectedVariance(0.0003, vl, SpFit.Persistence, 10)), 5);
        Assert.Equal(0.0145, Math.Sqrt(GarchHorizon.ExpectedVariance(0.0003, vl, SpFit.Persistence, 500)), 4);
    }

    [Theory]
    // Source: docs/methods.md#garch σ(T) row, Hull's continuous formula [C2, reproduced exactly D]; ±0.005 points (printed to 2 dp).
    [InlineData(10, 27.36)]
    [InlineData(30, 27.10)]
    [InlineData(50, 26.87)]
    [InlineData(100, 26.35)]
    [InlineData(500, 24.32)]
    public void AverageVarianceContinuous_HullTermStructure_MatchesTable(int days, double expectedPercent)
    {
        var average = GarchHorizon.AverageVarianceContinuous(0.0003, SpFit.LongRunVariance!.Value, SpFit.Persistence, days);
        Assert.Equal(expectedPercent, 100 * GarchHorizon.AnnualizedVolatility(average), 0.005);
    }

    [Fact]
    public void AverageVariance_HullTermStructureDiscreteAtTen_Is27_37()
    {
        // Source: docs/methods.md#garch: the discrete daily average (what forecasters use, σ²ₜ₊₁ = V(0), k = 1..10)
        // gives 27.37 at T = 10 where Hull's continuous form gives 27.36 [D, brute-force checked].
        var vl = SpFit.LongRunVariance!.Value;
        var discrete = GarchHorizon.AverageVariance(0.0003, vl, SpFit.Persistence, 10);
        Assert.Equal(27.37, 100 * GarchHorizon.AnnualizedVolatility(discrete), 0.005);

        // The closed form equals the brute-force mean of the daily expectations.
        double sum = 0;
        for (var k = 1; k <= 10; k++)
        {
            sum += GarchHorizon.ExpectedVariance(0.0003, vl, SpFit.Persistence, k - 1);
        }

        Assert.Equal(sum / 10, discrete, 15);
    }

    [Theory]
    // Source: docs/methods.md#garch impact row, Δσ(T) for +1 point in σ(0) [D; matches Hull's printed table as recalled, M];
    // checked by a central difference of ±0.5 points on the continuous form, to ±0.006.
    [InlineData(10, 0.97)]
    [InlineData(30, 0.92)]
    [InlineData(50, 0.87)]
    [InlineData(100, 0.77)]
    [InlineData(500, 0.33)]
    public void AverageVarianceContinuous_HullImpactOfOnePoint_MatchesTable(int days, double expected)
    {
        Assert.Equal(expected, Impact(SpFit, 0.0003, days), 0.006);
    }

    [Theory]
    // Source: docs/methods.md#garch, Hull 11e Tables 23.3 and 23.4 (V(0) = 0.0003) [C2; D reproduces to ±0.005].
    [InlineData(10, 26.5, 0.90)]
    [InlineData(30, 24.9, 0.74)]
    [InlineData(50, 23.8, 0.61)]
    [InlineData(100, 22.0, 0.41)]
    [InlineData(500, 19.5, 0.10)]
    public void AverageVarianceContinuous_Hull11eTables_Match(int days, double expectedPercent, double expectedImpact)
    {
        Assert.Equal(0.0001391, Sp2020Fit.LongRunVariance!.Value, 7);
        var average = GarchHorizon.AverageVarianceContinuous(0.0003, Sp2020Fit.LongRunVariance.Value, Sp2020Fit.Persistence, days);
        Assert.Equal(expectedPercent, 100 * GarchHorizon.AnnualizedVolatility(average), 0.05);
        Assert.Equal(expectedImpact, Impact(Sp2020Fit, 0.0003, days), 0.006);
    }

    [Fact]
    public void AverageVariance_OneDay_IsNextVariance()
    {
        // Definition: the one-day average is σ²ₜ₊₁ itself (common practice, no source).
        Assert.Equal(0.0003, GarchHorizon.AverageVariance(0.0003, 0.0002, 0.99, 1), 15);
    }

    [Fact]
    public void AverageVariance_PersistenceOne_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => GarchHorizon.AverageVariance(0.0003, 0.0002, 1.0, 10));
    }

    private static double Impact(GarchParameters p, double v0, int days)
    {
        // Annualized volatility points of σ(T) per point of σ(0), by central difference.
        var vl = p.LongRunVariance!.Value;
        var sigma0 = Math.Sqrt(252 * v0);
        double Sigma(double s0) =>
            Math.Sqrt(252 * GarchHorizon.AverageVarianceContinuous(s0 * s0 / 252, vl, p.Persistence, days));
        return (Sigma(sigma0 + 0.005) - Sigma(sigma0 - 0.005)) / 0.01;
    }
}
