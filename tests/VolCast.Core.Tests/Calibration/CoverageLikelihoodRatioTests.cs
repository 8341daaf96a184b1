using System.Globalization;
using VolCast.Core.Calibration;

namespace VolCast.Core.Tests.Calibration;

public sealed class CoverageLikelihoodRatioTests
{
    // Hand-worked example [D], failure sequence 0 0 1 1 1 0 0 0 0 0 tested against p = 0.1:
    //   n = 10, x = 3, π̂ = 0.3.
    //   LR_pof = −2 [7 ln 0.9 + 3 ln 0.1 − 7 ln 0.7 − 3 ln 0.3] = −2 [7 ln(9/7) + 3 ln(1/3)]
    //          = −2 [7 · 0.2513144 − 3 · 1.0986123] = −2 [1.7592007 − 3.2958369] = 3.0732717.
    //   Transitions (0,0) (0,1) (1,1) (1,1) (1,0) (0,0) (0,0) (0,0) (0,0): n00 = 5, n01 = 1, n10 = 1, n11 = 2.
    //   π = 3/9 = 1/3, π01 = 1/6, π11 = 2/3.
    //   LR_ind = −2 [6 ln(2/3) + 3 ln(1/3) − 5 ln(5/6) − ln(1/6) − ln(1/3) − 2 ln(2/3)]
    //          = −2 [4 ln(2/3) + 2 ln(1/3) − 5 ln(5/6) − ln(1/6)]
    //          = −2 [−1.6218604 − 2.1972246 + 0.9116078 + 1.7917595] = −2 · (−1.1157177) = 2.2314355.
    //   LR_cc = 5.3047072; with 2 degrees of freedom the p-value is exactly e^{−LR/2} = e^{−2.6523536} = 0.0704851.
    private static readonly bool[] HandSequence = [false, false, true, true, true, false, false, false, false, false];

    [Fact]
    public void Kupiec_HandWorkedExample_Matches()
    {
        var test = CoverageLikelihoodRatio.Kupiec(10, 3, 0.1);

        Assert.Equal(3.0732717, test.Statistic, 6);
        Assert.Equal(1, test.DegreesOfFreedom);
        // χ²(1) upper tail = erfc(√(LR/2)) [D]: R pchisq(3.0732717360759718, 1, lower.tail = FALSE) = 0.0795891449.
        Assert.Equal(0.0795891448997447, test.PValue, 10);
    }

    [Fact]
    public void Christoffersen_HandWorkedExample_Matches()
    {
        var transitions = CoverageLikelihoodRatio.Transitions(HandSequence);
        var independence = CoverageLikelihoodRatio.Independence(HandSequence);
        var conditional = CoverageLikelihoodRatio.ConditionalCoverage(CoverageLikelihoodRatio.Kupiec(10, 3, 0.1), independence);

        Assert.Equal(new HitTransitions(5, 1, 1, 2), transitions);
        Assert.Equal(2.2314355, independence.Statistic, 6);
        Assert.Equal(5.3047072, conditional.Statistic, 6);
        Assert.Equal(2, conditional.DegreesOfFreedom);
        Assert.Equal(Math.Exp(-conditional.Statistic / 2), conditional.PValue, 14);
        Assert.Equal(0.0704851, conditional.PValue, 6);
    }

    [Fact]
    public void Christoffersen_NoFailureClusters_IndependenceIsZeroWhenRatesAgree()
    {
        // 0 0 1 0 0 0 1 1 0 0: n00 = 4, n01 = 2, n10 = 2, n11 = 1 → π01 = π11 = π = 1/3, so LR_ind = 0 [D].
        var test = CoverageLikelihoodRatio.Independence([false, false, true, false, false, false, true, true, false, false]);

        Assert.Equal(0, test.Statistic, 12);
        Assert.Equal(1, test.PValue, 12);
    }

    [Fact]
    public void Kupiec_NoFailures_IsFinite()
    {
        // x = 0: LR = −2 n ln(1 − p) [D]; n = 20, p = 0.0455 → 1.8625…
        var test = CoverageLikelihoodRatio.Kupiec(20, 0, 0.0455);

        Assert.Equal(-2 * 20 * Math.Log(1 - 0.0455), test.Statistic, 12);
    }

    [Fact]
    public void Tests_RFixture_AgreeWithIndependentRecomputation()
    {
        // Fixtures/Calibration/coverage-tests.csv: LR statistics and χ² p-values computed from first principles in base R
        // 4.2.2 by make-coverage-tests.R on the committed sequences in coverage-hits.csv [D: independent recomputation].
        var folder = Path.Combine(AppContext.BaseDirectory, "Fixtures", "Calibration");
        var hits = File.ReadAllLines(Path.Combine(folder, "coverage-hits.csv")).Skip(1)
            .Select(l => l.Split(','))
            .GroupBy(f => f[0])
            .ToDictionary(g => g.Key, g => g.OrderBy(f => int.Parse(f[1], CultureInfo.InvariantCulture)).Select(f => f[2] == "1").ToArray());
        var rows = File.ReadAllLines(Path.Combine(folder, "coverage-tests.csv")).Where(l => !l.StartsWith('#')).Skip(1).ToList();

        Assert.Equal(3, rows.Count);
        foreach (var row in rows)
        {
            var f = row.Split(',');
            var sequence = hits[f[0]];
            double D(int i) => double.Parse(f[i], CultureInfo.InvariantCulture);
            var n = int.Parse(f[1], CultureInfo.InvariantCulture);
            var x = int.Parse(f[2], CultureInfo.InvariantCulture);
            Assert.Equal(n, sequence.Length);
            Assert.Equal(x, sequence.Count(b => b));

            var kupiec = CoverageLikelihoodRatio.Kupiec(n, x, D(3));
            var transitions = CoverageLikelihoodRatio.Transitions(sequence);
            var independence = CoverageLikelihoodRatio.Independence(transitions);
            var conditional = CoverageLikelihoodRatio.ConditionalCoverage(kupiec, independence);

            Assert.Equal(new HitTransitions(int.Parse(f[4], CultureInfo.InvariantCulture), int.Parse(f[5], CultureInfo.InvariantCulture), int.Parse(f[6], CultureInfo.InvariantCulture), int.Parse(f[7], CultureInfo.InvariantCulture)), transitions);
            Assert.Equal(D(8), kupiec.Statistic, 11);
            Assert.Equal(D(9), kupiec.PValue, 11);
            Assert.Equal(D(10), independence.Statistic, 11);
            Assert.Equal(D(11), independence.PValue, 11);
            Assert.Equal(D(12), conditional.Statistic, 11);
            Assert.Equal(D(13), conditional.PValue, 11);
        }
    }

    [Theory]
    [InlineData(0.0)] // no failures allowed
    [InlineData(1.0)] // every observation a failure
    public void Kupiec_ProbabilityOutsideOpenInterval_Throws(double p)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => CoverageLikelihoodRatio.Kupiec(10, 1, p));
    }
}
