using VolCast.Core.Trading.Snooping;
using Xunit.Abstractions;

namespace VolCast.Core.Tests.Trading.Snooping;

/// <summary>
/// The size and power of the data-snooping tests at three mean block lengths (L = h, L = 2h, and the Politis-White
/// automatic length with a floor at h) on MA(h − 1) differences, the dependence of overlapping h-day P&amp;L. This is a
/// measurement, not a check: it takes minutes, so it is run by hand
/// (<c>dotnet test tests/VolCast.Core.Tests --filter BlockLengthSimulation --logger "console;verbosity=detailed"</c>
/// with the Skip removed); its figures are in docs/methods.md#data-snooping-reality-check-spa-stepm and chose the
/// default. The check that stays in every run is
/// <see cref="DataSnoopingSizeAndPowerTests.TestMeans_OverlappingHorizonPnl_AutomaticBlockHoldsTheSizeBand"/>.
/// </summary>
public class BlockLengthSimulationTests(ITestOutputHelper output)
{
    [Theory(Skip = "measurement of several minutes, run by hand; figures in docs/methods.md")]
    [InlineData(5, 1000)]
    [InlineData(5, 2500)]
    [InlineData(21, 2500)]
    [InlineData(21, 5000)]
    public void Measure(int horizon, int days)
    {
        const int seeds = 200;
        var names = new[] { "h", "2h", "automatic, at least h" };
        var size = new int[3, 3];
        var power = new int[3, 2];
        var automatic = 0.0;
        for (var seed = 0; seed < seeds; seed++)
        {
            // Ten rules, none with an edge (size); the same with rule 3 ahead by 0.08 standard deviations a day (power).
            var d = SnoopingData.Differences(new Random(seed + 9000), days, horizon, rules: 10, mean: 0.0, rho: 0.5);
            var means = new double[10];
            means[3] = 0.08;
            var e = SnoopingData.Differences(new Random(seed + 19000), days, horizon, means, SnoopingData.Filled(10, 1.0), rho: 0.5);
            var nullLength = AutomaticBlockLength.Of(d, horizon);
            automatic += nullLength;
            double[] onNull = [horizon, 2 * horizon, nullLength];
            double[] onEdge = [horizon, 2 * horizon, AutomaticBlockLength.Of(e, horizon)];
            for (var i = 0; i < 3; i++)
            {
                var r = DataSnooping.TestMeans(d, new DataSnoopingOptions(onNull[i], seed, replications: 400));
                size[i, 0] += r.RealityCheckPValue <= 0.05 ? 1 : 0;
                size[i, 1] += r.Spa.Consistent <= 0.05 ? 1 : 0;
                size[i, 2] += r.StepM.Rejected.Length > 0 ? 1 : 0;
                var p = DataSnooping.TestMeans(e, new DataSnoopingOptions(onEdge[i], seed, replications: 400));
                power[i, 0] += p.RealityCheckPValue <= 0.05 ? 1 : 0;
                power[i, 1] += p.Spa.Consistent <= 0.05 ? 1 : 0;
            }
        }

        double n = seeds;
        for (var i = 0; i < 3; i++)
        {
            output.WriteLine($"h = {horizon}, T = {days}, L = {names[i]}: size RC {size[i, 0] / n:F3}, SPA_c {size[i, 1] / n:F3}, StepM {size[i, 2] / n:F3}; power RC {power[i, 0] / n:F3}, SPA_c {power[i, 1] / n:F3}");
        }

        output.WriteLine($"mean automatic length under the null: {automatic / seeds:F1}");
        Assert.True(automatic >= horizon * seeds);
    }
}
