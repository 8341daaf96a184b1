using VolCast.Core.Calibration;
using VolCast.Core.Data;

namespace VolCast.Core.Tests.Calibration;

public sealed class OutcomeAlignmentTests
{
    private static PriceHistory Prices()
    {
        var dates = Enumerable.Range(0, 10).Select(i => new DateOnly(2024, 1, 1).AddDays(i)).ToArray();
        var closes = Enumerable.Range(0, 10).Select(i => 100.0 + i).ToArray();
        return PriceHistory.FromCloses(dates, closes);
    }

    [Fact]
    public void FromPrices_MixedWindows_KeepsClosedWindowsWithTheirCloses()
    {
        var prices = Prices();
        var forecastDates = prices.Dates[2..9].ToArray(); // closes 102 … 108 at price indices 2 … 8
        int?[] windows = [2, 2, null, 3, 3, 3, 1];

        var aligned = OutcomeAlignment.FromPrices(prices, forecastDates, windows);

        // Index 2 has no window; index 4 (price 6, h 3 → price 9) is kept; index 5 (price 7, h 3 → 10) is past the end;
        // index 6 (price 8, h 1 → 9) is kept.
        Assert.Equal([0, 1, 3, 4, 6], aligned.DateIndices.ToArray());
        Assert.Equal([102.0, 103.0, 105.0, 106.0, 108.0], aligned.Outcomes.StartClose.ToArray());
        Assert.Equal([104.0, 105.0, 108.0, 109.0, 109.0], aligned.Outcomes.EndClose.ToArray());
        Assert.Equal([2, 2, 3, 3, 1], aligned.Outcomes.WindowDays.ToArray());
        Assert.Equal(3, aligned.Outcomes.HorizonDays);

        var f = aligned.Select("ewma:0.94", [0.1, 0.2, 0.3, null, 0.5, 0.6, 0.7]);
        Assert.Equal([0.1, 0.2, null, 0.5, 0.7], f.AnnualizedVolatility.ToArray());
    }

    [Fact]
    public void FromPrices_DateNotInHistory_ThrowsNamingIt()
    {
        var e = Assert.Throws<ArgumentException>(() => OutcomeAlignment.FromPrices(Prices(), [new DateOnly(2023, 12, 31)], [1]));

        Assert.Contains("forecastDates[0] = 2023-12-31 is not a trading date", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Coverage_PerDateHorizon_ScalesEachMoveByItsOwnWindowAndSamplesWindowEnds()
    {
        // h_t = 1, 2, 4, 1, 1, 2: z_t = ln(S_{t+h}/S_t) / (σ √(h_t/252)) [D]; sampled dates 0 → 1 → 3 → 4 → 5.
        var start = Enumerable.Repeat(100.0, 6).ToArray();
        var end = new[] { 101.0, 99.0, 103.0, 100.0, 100.5, 98.0 };
        int[] windows = [1, 2, 4, 1, 1, 2];
        var outcomes = new HorizonOutcomes(windows, start, end);

        var result = MoveBandCoverage.Evaluate(outcomes, CalibrationData.Constant("x", 6, 0.2), new CalibrationOptions { MinimumNonOverlappingSamples = 2 });

        for (var t = 0; t < 6; t++)
        {
            Assert.Equal(Math.Log(end[t] / 100.0) / (0.2 * Math.Sqrt(windows[t] / 252.0)), result.Z[t]!.Value, 12);
        }

        Assert.Equal(5, result.Levels[0].NonOverlappingCount);
    }

    [Fact]
    public void Probability_PerDateHorizon_UsesEachDatesTau()
    {
        // Two dates with h = 1 and h = 4 against one date each with a fixed horizon: same per-date scores [D].
        var mixed = ProbabilityCalibration.Evaluate(new HorizonOutcomes([1, 4], [100.0, 100.0], [101.0, 97.0]), CalibrationData.Constant("x", 2, 0.2));
        var one = ProbabilityCalibration.Evaluate(new HorizonOutcomes(1, [100.0], [101.0]), CalibrationData.Constant("x", 1, 0.2));
        var four = ProbabilityCalibration.Evaluate(new HorizonOutcomes(4, [100.0], [97.0]), CalibrationData.Constant("x", 1, 0.2));

        for (var j = 0; j < 5; j++)
        {
            Assert.Equal((one.Strikes[j].Decomposition.Brier + four.Strikes[j].Decomposition.Brier) / 2, mixed.Strikes[j].Decomposition.Brier, 14);
        }
    }
}
