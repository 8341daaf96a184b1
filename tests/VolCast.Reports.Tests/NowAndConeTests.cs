using VolCast.Core.Backtest;
using VolCast.Core.Cone;
using VolCast.Core.Data;
using VolCast.Core.Demo;
using VolCast.Core.Now;

namespace VolCast.Reports.Tests;

/// <summary>
/// The Now section's cone percentile and the cone chart read the same closes: every close up to the last forecast date
/// and none after, also when the run ends before the price file does. Invented demo data (3 years), not reference data.
/// </summary>
public sealed class NowAndConeTests
{
    private static readonly DemoScenario Scenario = new DemoScenarioGenerator(5, years: 3).Generate();

    [Fact]
    public void ConeChart_RunEndingBeforeThePrices_UsesTheClosesUpToTheLastForecastDateOnly()
    {
        var prices = Scenario.Index;
        var k = prices.Count - 100;
        var settings = new BacktestSettings { Forecasters = ["ewma:0.94"], Sweep = false, McsReplications = 50, End = prices.Dates[k] };
        var result = Backtester.Run(prices, Scenario.Implied, settings);
        Assert.Equal(prices.Dates[k], result.Dates[^1]);

        var cone = ReportWriter.Cone(result, prices);
        var expected = VolatilityCone.Compute(Returns.LogReturns(prices.Close[..(k + 1)]), VolatilityCone.DefaultHorizons, 252);
        var now = NowReading.From(result, prices);

        Assert.Equal(expected.ReturnCount, cone.ReturnCount);
        Assert.Equal(expected.Horizons.Select(h => h.Latest), cone.Horizons.Select(h => h.Latest));
        Assert.Equal(expected.Horizons.Select(h => h.Adjusted.Median), cone.Horizons.Select(h => h.Adjusted.Median));
        var atHorizon = cone.Horizons.Single(h => h.HorizonDays == 21);

        // Both are √(252/21 · Σ r²) over the 21 returns ending on the last date (Burghardt and Lane 1990), summed in a
        // different order, so equal to rounding.
        Assert.Equal(atHorizon.Latest, now.RealizedLastWindow!.Value, atHorizon.Latest * 1e-12);
        Assert.Equal(k - 21 + 1, now.ConeWindows);
    }
}
