using VolCast.Core.Tests.Scoring;
using VolCast.Core.Trading.Snooping;
using Xunit.Abstractions;

namespace VolCast.Core.Tests.Trading.Snooping;

public class DataSnoopingPropertyTests(ITestOutputHelper output)
{
    [Fact]
    public void TestMeans_SpaPValues_LowerAtMostConsistentAtMostUpperEqualToStudentizedRealityCheck()
    {
        // Hansen (2005): the three recentrings give p_l ≤ p_c ≤ p_u, and p_u (all null means at 0, the least favourable
        // configuration) is the studentized Reality Check whenever the statistic is above 0 (below it, the floor at 0
        // gives p = 1 for all three). Twenty samples with good, null and poor rules.
        var means = new[] { 0.05, 0.0, 0.0, -0.05, -0.2, -0.4, 0.02, -0.1 };
        var strictSomewhere = false;
        for (var seed = 0; seed < 20; seed++)
        {
            var d = SnoopingData.Differences(new Random(seed + 300), 800, 2, means, SnoopingData.Filled(means.Length, 1.0), rho: 0.4);
            var result = DataSnooping.TestMeans(d, new DataSnoopingOptions(10, seed, replications: 300));
            var spa = result.Spa;
            Assert.True(spa.Lower <= spa.Consistent && spa.Consistent <= spa.Upper, $"seed {seed}: {spa}");
            if (spa.Statistic > 0)
            {
                Assert.Equal(result.StudentizedRealityCheckPValue, spa.Upper);
            }
            else
            {
                // No rule ahead of the benchmark: every recentring gives p = 1.
                Assert.Equal((1.0, 1.0, 1.0), (spa.Lower, spa.Consistent, spa.Upper));
            }

            strictSomewhere |= spa.Lower < spa.Upper;
        }

        Assert.True(strictSomewhere, "with poor rules present the lower and upper p-values must differ somewhere");
    }

    [Fact]
    public void TestMeans_EveryRuleClearlyBehindTheBenchmark_GivesSpaPValuesOfOne()
    {
        // Hansen (2005): H0 is that no rule beats the benchmark. With every rule's mean difference clearly negative the
        // statistic max(max_k √T d̄_k/ω̂_k, 0) is 0 and the data hold no evidence against H0, so no p-value may be small;
        // the consistent recentring keeps the poor rules' negative means in the draws, which is where a strict
        // inequality would have given a p-value near 0.
        var means = new[] { -0.3, -0.4, -0.5, -0.6 };
        var d = SnoopingData.Differences(new Random(7), 1500, 2, means, SnoopingData.Filled(means.Length, 1.0), rho: 0.2);

        var spa = DataSnooping.TestMeans(d, new DataSnoopingOptions(10, 7, replications: 300)).Spa;

        Assert.Equal(0.0, spa.Statistic);
        Assert.Equal((1.0, 1.0, 1.0), (spa.Lower, spa.Consistent, spa.Upper));
    }

    [Fact]
    public void TestMeans_AddingPoorRules_LeavesSpaConsistentNearlyUnchangedButRaisesTheRealityCheck()
    {
        // Hansen (2005), the motivating point of the SPA test: the Reality Check's p-value rises when poor, noisy
        // alternatives are added (its null puts every rule at the boundary), while SPA_c leaves rules far below the
        // benchmark out of its null distribution. The same draws serve both sets (they depend on T, L, B and the seed
        // only), so the change comes from the added rules alone. Ten samples: five null rules and one with a small edge,
        // then ten rules with mean −1 and three times the noise added (t ≈ −7: poor by
        // any threshold).
        var baseMeans = new[] { 0.0, 0.0, 0.0, 0.0, 0.0, 0.06 };
        double realityRise = 0, consistentChange = 0;
        for (var seed = 0; seed < 10; seed++)
        {
            var random = new Random(seed + 700);
            var good = SnoopingData.Differences(random, 1000, 2, baseMeans, SnoopingData.Filled(6, 1.0), rho: 0.4);
            var poor = SnoopingData.Differences(random, 1000, 2, SnoopingData.Filled(10, -1.0), SnoopingData.Filled(10, 3.0), rho: 0.4);
            var options = new DataSnoopingOptions(10, seed, replications: 500);
            var before = DataSnooping.TestMeans(good, options);
            var after = DataSnooping.TestMeans([.. good, .. poor], options);
            output.WriteLine($"seed {seed}: RC {before.RealityCheckPValue:F3} -> {after.RealityCheckPValue:F3}, SPA_c {before.Spa.Consistent:F3} -> {after.Spa.Consistent:F3}, SPA_u {before.Spa.Upper:F3} -> {after.Spa.Upper:F3}");
            // More rules can only raise each replication's maximum while the observed maximum stays the good rules'.
            Assert.True(after.RealityCheckPValue >= before.RealityCheckPValue);
            Assert.True(after.Spa.Upper >= before.Spa.Upper);
            Assert.True(Math.Abs(after.Spa.Consistent - before.Spa.Consistent) <= 0.01, $"seed {seed}: SPA_c moved from {before.Spa.Consistent} to {after.Spa.Consistent}");
            realityRise += (after.RealityCheckPValue - before.RealityCheckPValue) / 10;
            consistentChange += Math.Abs(after.Spa.Consistent - before.Spa.Consistent) / 10;
        }

        output.WriteLine($"mean rise of the RC p-value {realityRise:F3}, mean change of SPA_c {consistentChange:F4}");
        Assert.True(realityRise >= 0.1, $"the Reality Check p-value rose by only {realityRise:F3} on average");
        Assert.True(consistentChange <= 0.005);
    }

    [Fact]
    public void TestMeans_SameSeed_IsBitForBitRepeatableAndIndependentOfTheInputLayout()
    {
        // Seeded determinism: the same data, settings and seed give the same result; the flat rule-major layout and the
        // jagged one are the same data; passing draws made from the options equals letting the test draw them.
        var d = SnoopingData.Differences(new Random(5), 400, 2, rules: 7, mean: 0.0, rho: 0.3);
        var options = new DataSnoopingOptions(6, seed: 21, replications: 250, level: 0.10);
        var flat = new double[7 * 400];
        for (var k = 0; k < 7; k++)
        {
            d[k].CopyTo(flat, k * 400);
        }

        var first = DataSnooping.TestMeans(d, options);
        var again = DataSnooping.TestMeans(d, options);
        var fromFlat = DataSnooping.TestMeans(flat, 7, 400, options);
        var fromDraws = DataSnooping.TestMeans(d, DataSnooping.Draw(400, options), options.Level);
        foreach (var other in new[] { again, fromFlat, fromDraws })
        {
            Assert.Equal(first.Estimates.ToArray(), other.Estimates.ToArray());
            Assert.Equal(first.StandardDeviations.ToArray(), other.StandardDeviations.ToArray());
            Assert.Equal(first.RealityCheckPValue, other.RealityCheckPValue);
            Assert.Equal(first.Spa, other.Spa);
            Assert.Equal(first.StepM.Rejected.ToArray(), other.StepM.Rejected.ToArray());
            Assert.Equal(first.StepM.CriticalValues.ToArray(), other.StepM.CriticalValues.ToArray());
        }

        Assert.Equal(21, first.Seed);
        Assert.Equal(250, first.Replications);
        Assert.Equal(6.0, first.MeanBlockLength);
    }

    [Fact]
    public void TestMeans_EstimatesAndThreshold_AreThePlainMeansAndHansensRootTwoLogLogT()
    {
        // θ̂_k is the sample mean of d_k; Hansen (2005): the consistent p-value's threshold is √(2 ln ln T), for
        // T = 1,000 √(2 · ln 6.9078) = √(2 · 1.93264) ≈ 1.9660 (by hand).
        var d = SnoopingData.Differences(new Random(9), 1000, 2, rules: 3, mean: 0.1, rho: 0.2);
        var result = DataSnooping.TestMeans(d, new DataSnoopingOptions(4, seed: 1, replications: 100));
        for (var k = 0; k < 3; k++)
        {
            Approx.Relative(d[k].Average(), result.Estimates[k], 1e-12);
            Approx.Relative(Math.Sqrt(1000) * d[k].Average() / result.StandardDeviations[k], result.TStatistics[k]!.Value, 1e-12);
        }

        Approx.Absolute(1.9660, result.Spa.Threshold, 1e-4);
        Assert.Equal(3, result.Rules);
        Assert.Equal(SnoopingMeasure.MeanDifference, result.Measure);
    }

    [Fact]
    public void TestMeans_RuleIdenticalToTheBenchmark_TakesNoPartInTheStudentizedStatistics()
    {
        // A threshold so low that the rule sells every day is the benchmark itself: d ≡ 0 has no variance to studentize
        // by, so it has no t-statistic, and it cannot be named by StepM.
        var d = SnoopingData.Differences(new Random(2), 300, 2, rules: 3, mean: 0.0, rho: 0.3);
        d[1] = new double[300];
        var result = DataSnooping.TestMeans(d, new DataSnoopingOptions(5, seed: 4, replications: 200));
        Assert.Null(result.TStatistics[1]);
        Assert.Equal(0.0, result.StandardDeviations[1]);
        Assert.DoesNotContain(1, result.StepM.Rejected);

        var none = DataSnooping.TestMeans([new double[300], SnoopingData.Filled(300, 0.1)], new DataSnoopingOptions(5, seed: 4, replications: 200));
        Assert.Equal(1.0, none.RealityCheckPValue);
        Assert.Equal(1.0, none.Spa.Consistent);
        Assert.Empty(none.StepM.Rejected);
    }

    [Fact]
    public void TestSharpeRatios_Estimates_AreSharpeRatioDifferencesAndScaleFree()
    {
        // Sharpe ratio = mean / sample standard deviation (Sharpe 1994, per period, from memory): rescaling a rule's
        // P&L path by a positive factor (a bigger position) changes neither its Sharpe ratio nor any p-value.
        var paths = SnoopingData.Differences(new Random(6), 600, 2, rules: 5, mean: 0.05, rho: 0.5);
        var options = new DataSnoopingOptions(8, seed: 13, replications: 300);
        var draws = DataSnooping.Draw(600, options);
        var result = DataSnooping.TestSharpeRatios(paths[..4], paths[4], draws, 0.05);
        for (var k = 0; k < 4; k++)
        {
            Approx.Relative(Sharpe(paths[k]) - Sharpe(paths[4]), result.Estimates[k], 1e-10);
        }

        var scaled = paths[..4].Select((p, k) => p.Select(v => v * (k + 2.5)).ToArray()).ToArray();
        var rescaled = DataSnooping.TestSharpeRatios(scaled, paths[4].Select(v => v * 0.1).ToArray(), draws, 0.05);
        for (var k = 0; k < 4; k++)
        {
            Approx.Relative(result.Estimates[k], rescaled.Estimates[k], 1e-9);
            Approx.Relative(result.StandardDeviations[k], rescaled.StandardDeviations[k], 1e-9);
        }

        Assert.Equal(result.RealityCheckPValue, rescaled.RealityCheckPValue);
        Assert.Equal(result.Spa.Consistent, rescaled.Spa.Consistent);
        Assert.Equal(SnoopingMeasure.SharpeDifference, result.Measure);
    }

    [Fact]
    public void TestSharpeRatios_BootstrapDeviations_MatchADirectRecomputationOnTheSharedDraws()
    {
        // Sullivan, Timmermann & White (1999) resample the rule and the benchmark jointly: each replication recomputes
        // both Sharpe ratios on the same resampled dates. Recomputed here from the expanded date indices of the draws
        // that the mean test also uses: ω̂² = (T/B) Σ_b (f*_b − f)², f = SR(rule) − SR(benchmark).
        const int Days = 400;
        var paths = SnoopingData.Differences(new Random(3), Days, 2, rules: 2, mean: 0.02, rho: 0.5);
        var draws = DataSnooping.Draw(Days, new DataSnoopingOptions(5, seed: 8, replications: 200));
        var sharpe = DataSnooping.TestSharpeRatios([paths[0]], paths[1], draws, 0.05);
        var f = Sharpe(paths[0]) - Sharpe(paths[1]);
        var indices = new int[Days];
        var x = new double[Days];
        var y = new double[Days];
        var sum = 0.0;
        for (var b = 0; b < draws.Replications; b++)
        {
            draws.CopyIndices(b, indices);
            for (var t = 0; t < Days; t++)
            {
                x[t] = paths[0][indices[t]];
                y[t] = paths[1][indices[t]];
            }

            sum += Math.Pow(Sharpe(x) - Sharpe(y) - f, 2);
        }

        Approx.Relative(Math.Sqrt(Days * sum / draws.Replications), sharpe.StandardDeviations[0], 1e-9);
        Assert.Equal(draws.Seed, sharpe.Seed);
    }

    private static double Sharpe(double[] x)
    {
        var mean = x.Average();
        var variance = x.Sum(v => (v - mean) * (v - mean)) / (x.Length - 1);
        return mean / Math.Sqrt(variance);
    }
}
