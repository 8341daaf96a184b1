using VolCast.Core.Trading.Snooping;
using Xunit.Abstractions;

namespace VolCast.Core.Tests.Trading.Snooping;

public class DataSnoopingSizeAndPowerTests(ITestOutputHelper output)
{
    private const int Seeds = 200;
    private const double Level = 0.05;

    // Monte Carlo error of a rejection rate at the 5% level over 200 seeds: √(0.05 · 0.95 / 200) ≈ 0.0154. A test holds
    // its size when its rate is at most the level plus three such standard errors. Three, not two: the studentized
    // tests (SPA, StepM) divide by a bootstrap ω̂ that is itself estimated and not re-estimated inside each replication
    // (Hansen 2005's construction), which leaves a small finite-sample excess; measured here over 400 seeds at
    // T = 2,000: 5–8% (RC 4–7%).
    private static readonly double Allowed = Level + (3 * Math.Sqrt(Level * (1 - Level) / Seeds));
    private const int Days = 1000;

    // The simulated series are MA(1) (Span = 2 days); the mean block length is five times that span. With L equal to
    // the span of an MA(h − 1) series the stationary bootstrap's variance of the mean falls short of the long-run
    // variance (the weights (1 − 1/L)^i of Politis & Romano 1994 shrink the autocovariances: about 72% of it at h = L = 5),
    // and every test over-rejects; that is a property of the bootstrap, not of the tests, so the size checks use a
    // block long enough for the dependence.
    private const int Span = 2;
    private const double Block = 10;

    [Fact]
    public void TestMeans_NoRuleHasAnEdge_RejectionRatesAtMostTheLevel()
    {
        // White (2000) and Hansen (2005): under the least favourable null (every rule's mean difference exactly 0) the
        // Reality Check and the SPA p-values are asymptotically of size α; Romano & Wolf (2005): StepM holds the
        // familywise error rate at α, so it names no rule in at most α of the samples.
        var rates = Rates(seed => SnoopingData.Differences(new Random(seed + 9000), Days, Span, rules: 10, mean: 0.0, rho: 0.5));
        output.WriteLine($"all at zero: RC {rates.Reality:F3}, RC studentized {rates.Studentized:F3}, SPA_c {rates.Consistent:F3}, SPA_l {rates.Lower:F3}, StepM any {rates.StepM:F3}");
        Assert.True(rates.Reality <= Allowed, $"Reality Check rejected {rates.Reality:P1}, more than {Allowed:P1}");
        Assert.True(rates.Consistent <= Allowed, $"SPA_c rejected {rates.Consistent:P1}, more than {Allowed:P1}");
        Assert.True(rates.StepM <= Allowed, $"StepM named a rule in {rates.StepM:P1}, more than {Allowed:P1}");
        // Hansen (2005): at the boundary SPA_c is not conservative: near α (here at least half of it).
        Assert.True(rates.Consistent >= Level / 2, $"SPA_c rejected only {rates.Consistent:P1} at the boundary");
    }

    [Fact]
    public void TestMeans_OverlappingHorizonPnl_AutomaticBlockHoldsTheSizeBand()
    {
        // The default of the run: on MA(4) differences (overlapping 5-day P&L, ten rules, none with an edge, T = 2,500)
        // the Politis & White (2004; Patton, Politis & White 2009) automatic mean block length, floored at h, keeps the
        // Reality Check, SPA_c and StepM within level + 3 standard errors (9.6% over 200 seeds). Measured over these 200
        // seeds: RC 6.0%, SPA_c 6.0%, StepM 6.0%; with L = h the same seeds give 7.5%, 10.5%, 10.5%, outside the band
        // for SPA_c and StepM (BlockLengthSimulationTests, docs/methods.md#data-snooping-reality-check-spa-stepm).
        const int h = 5;
        int reality = 0, consistent = 0, stepM = 0;
        for (var seed = 0; seed < Seeds; seed++)
        {
            var d = SnoopingData.Differences(new Random(seed + 9000), 2500, h, rules: 10, mean: 0.0, rho: 0.5);
            var result = DataSnooping.TestMeans(d, new DataSnoopingOptions(AutomaticBlockLength.Of(d, h), seed, replications: 400));
            reality += result.RealityCheckPValue <= Level ? 1 : 0;
            consistent += result.Spa.Consistent <= Level ? 1 : 0;
            stepM += result.StepM.Rejected.Length > 0 ? 1 : 0;
        }

        output.WriteLine($"automatic block, h = 5: RC {reality / (double)Seeds:F3}, SPA_c {consistent / (double)Seeds:F3}, StepM {stepM / (double)Seeds:F3}");
        Assert.True(reality / (double)Seeds <= Allowed, $"Reality Check rejected {reality / (double)Seeds:P1}, more than {Allowed:P1}");
        Assert.True(consistent / (double)Seeds <= Allowed, $"SPA_c rejected {consistent / (double)Seeds:P1}, more than {Allowed:P1}");
        Assert.True(stepM / (double)Seeds <= Allowed, $"StepM named a rule in {stepM / (double)Seeds:P1}, more than {Allowed:P1}");
        // Not conservative to the point of uselessness: at least half the level (Hansen 2005, SPA_c at the boundary).
        Assert.True(consistent / (double)Seeds >= Level / 2, $"SPA_c rejected only {consistent / (double)Seeds:P1} at the boundary");
    }

    [Fact]
    public void TestMeans_PoorRulesAmongNullRules_RealityCheckConservativeAndSpaNearTheLevel()
    {
        // Hansen (2005): poor rules (mean well below the benchmark) make the Reality Check conservative, while SPA_c
        // drops them from the null distribution and stays near α. Five rules at 0, fifteen at −0.3 with twice the noise.
        var means = new double[20];
        var scales = new double[20];
        for (var k = 0; k < 20; k++)
        {
            means[k] = k < 5 ? 0.0 : -0.3;
            scales[k] = k < 5 ? 1.0 : 2.0;
        }

        var rates = Rates(seed => SnoopingData.Differences(new Random(seed + 1000), Days, Span, means, scales, rho: 0.3));
        output.WriteLine($"with poor rules: RC {rates.Reality:F3}, RC studentized {rates.Studentized:F3}, SPA_c {rates.Consistent:F3}, SPA_l {rates.Lower:F3}, StepM any {rates.StepM:F3}");
        Assert.True(rates.Reality <= Allowed, $"Reality Check rejected {rates.Reality:P1}, more than {Allowed:P1}");
        Assert.True(rates.Consistent <= Allowed, $"SPA_c rejected {rates.Consistent:P1}, more than {Allowed:P1}");
        Assert.True(rates.StepM <= Allowed, $"StepM named a rule in {rates.StepM:P1}, more than {Allowed:P1}");
        Assert.True(rates.Reality < rates.Consistent, $"the Reality Check ({rates.Reality:P1}) should reject less often than SPA_c ({rates.Consistent:P1}) with poor rules present");
    }

    [Fact]
    public void TestSharpeRatios_NoRuleHasAHigherSharpe_RejectionRatesAtMostTheLevel()
    {
        // Sullivan, Timmermann & White (1999): the Reality Check applied to Sharpe ratios; under the null every rule's
        // path has the benchmark's Sharpe ratio (same mean 0.05 and unit scale, correlated with it).
        var count = new int[3];
        for (var seed = 0; seed < Seeds; seed++)
        {
            var random = new Random(seed + 5000);
            var paths = SnoopingData.Differences(random, Days, Span, rules: 11, mean: 0.05, rho: 0.5);
            var benchmark = paths[10];
            var rules = paths[..10];
            var result = DataSnooping.TestSharpeRatios(rules, benchmark, new DataSnoopingOptions(Block, seed, replications: 400));
            count[0] += result.RealityCheckPValue <= Level ? 1 : 0;
            count[1] += result.Spa.Consistent <= Level ? 1 : 0;
            count[2] += result.StepM.Rejected.Length > 0 ? 1 : 0;
        }

        var reality = count[0] / (double)Seeds;
        var consistent = count[1] / (double)Seeds;
        var stepM = count[2] / (double)Seeds;
        output.WriteLine($"Sharpe: RC {reality:F3}, SPA_c {consistent:F3}, StepM any {stepM:F3}");
        Assert.True(reality <= Allowed, $"Reality Check on Sharpe ratios rejected {reality:P1}, more than {Allowed:P1}");
        Assert.True(consistent <= Allowed, $"SPA_c on Sharpe ratios rejected {consistent:P1}, more than {Allowed:P1}");
        Assert.True(stepM <= Allowed, $"StepM on Sharpe ratios named a rule in {stepM:P1}, more than {Allowed:P1}");
    }

    [Fact]
    public void TestMeans_OneRuleWithAnEdge_IsRejectedAndStepMNamesIt()
    {
        // White (2000), Hansen (2005), Romano & Wolf (2005): a rule whose mean difference is 0.25 standard deviations
        // a day over 1,000 days (t ≈ 5.6 after the MA(1) dependence) among 19 rules without an edge is found.
        var means = new double[20];
        means[7] = 0.25;
        var d = SnoopingData.Differences(new Random(31), 1000, Span, means, SnoopingData.Filled(20, 1.0), rho: 0.5);
        var result = DataSnooping.TestMeans(d, new DataSnoopingOptions(Block, seed: 1));
        output.WriteLine($"RC {result.RealityCheckPValue}, SPA_c {result.Spa.Consistent}, StepM [{string.Join(",", result.StepM.Rejected)}]");
        Assert.Equal(7, result.BestRule);
        Assert.True(result.RealityCheckPValue < Level);
        Assert.True(result.Spa.Consistent < Level);
        Assert.Equal([7], result.StepM.Rejected.ToArray());
    }

    [Fact]
    public void TestMeans_TwoRulesWithEdges_StepMNamesBoth()
    {
        // Romano & Wolf (2005): the step-down names every false null it can; two rules with edges of 0.3 and 0.2
        // standard deviations a day over 1,500 days among 30 rules.
        var means = new double[30];
        means[3] = 0.3;
        means[21] = 0.2;
        var d = SnoopingData.Differences(new Random(8), 1500, Span, means, SnoopingData.Filled(30, 1.0), rho: 0.5);
        var result = DataSnooping.TestMeans(d, new DataSnoopingOptions(Block, seed: 2));
        output.WriteLine($"StepM [{string.Join(",", result.StepM.Rejected)}] at steps [{string.Join(",", result.StepM.RejectedAtStep)}], critical [{string.Join(",", result.StepM.CriticalValues)}]");
        Assert.Equal([3, 21], result.StepM.Rejected.ToArray());
        // The critical values can only fall as rules leave the maximum (step-down).
        for (var s = 1; s < result.StepM.CriticalValues.Length; s++)
        {
            Assert.True(result.StepM.CriticalValues[s] <= result.StepM.CriticalValues[s - 1]);
        }
    }

    [Fact]
    public void TestSharpeRatios_RuleWithAHigherSharpe_IsRejected()
    {
        // Sullivan, Timmermann & White (1999): a rule with Sharpe 0.25 a day against a benchmark with 0.05 over 1,000
        // days is found among 9 rules at the benchmark's Sharpe.
        var paths = SnoopingData.Differences(new Random(12), 1000, Span, rules: 11, mean: 0.05, rho: 0.5);
        for (var t = 0; t < 1000; t++)
        {
            paths[4][t] += 0.2;
        }

        var result = DataSnooping.TestSharpeRatios(paths[..10], paths[10], new DataSnoopingOptions(Block, seed: 3));
        Assert.Equal(4, result.BestRule);
        Assert.True(result.RealityCheckPValue < Level);
        Assert.True(result.Spa.Consistent < Level);
        Assert.Contains(4, result.StepM.Rejected);
    }

    // The data of seed s must come from another generator seed than the bootstrap of seed s (the options use s itself):
    // with the same seed the resampled dates would be drawn from the very uniforms that made the data.
    private static (double Reality, double Studentized, double Consistent, double Lower, double StepM) Rates(Func<int, double[][]> data)
    {
        int reality = 0, studentized = 0, consistent = 0, lower = 0, stepM = 0;
        for (var seed = 0; seed < Seeds; seed++)
        {
            var result = DataSnooping.TestMeans(data(seed), new DataSnoopingOptions(Block, seed, replications: 400));
            reality += result.RealityCheckPValue <= Level ? 1 : 0;
            studentized += result.StudentizedRealityCheckPValue <= Level ? 1 : 0;
            consistent += result.Spa.Consistent <= Level ? 1 : 0;
            lower += result.Spa.Lower <= Level ? 1 : 0;
            stepM += result.StepM.Rejected.Length > 0 ? 1 : 0;
        }

        double n = Seeds;
        return (reality / n, studentized / n, consistent / n, lower / n, stepM / n);
    }
}
