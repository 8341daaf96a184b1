using VolCast.Core.Calibration;
using Xunit.Abstractions;

namespace VolCast.Core.Tests.Calibration;

public sealed class MoveBandCoverageTests(ITestOutputHelper output)
{
    private const int Days = 5000;
    private const int Horizon = 21;
    private const double TrueVolatility = 0.20;

    [Fact]
    public void Evaluate_HandWorkedMoves_GiveTheStandardizedMoveAndShares()
    {
        // h = 1, A = 252, σ = 0.2521 → σ√(1/252) ≈ 0.015881 [D]. Moves: ln(101/100) = 0.00995 → z = 0.6266;
        // ln(96/100) = −0.04082 → z = −2.5705; ln(100/100) = 0 → z = 0.
        var sd = 0.2521 * Math.Sqrt(1 / 252.0);
        var outcomes = new HorizonOutcomes(1, [100, 100, 100], [101, 96, 100]);

        var result = MoveBandCoverage.Evaluate(outcomes, CalibrationData.Constant("x", 3, 0.2521), new CalibrationOptions { MinimumNonOverlappingSamples = 2 });

        Assert.Equal(Math.Log(1.01) / sd, result.Z[0]!.Value, 12);
        Assert.Equal(Math.Log(0.96) / sd, result.Z[1]!.Value, 12);
        Assert.Equal(0, result.Z[2]!.Value, 12);
        Assert.Equal(2.0 / 3, result.Levels[0].ShareWithin!.Value, 12);
        Assert.Equal(2.0 / 3, result.Levels[1].ShareWithin!.Value, 12);
        Assert.Equal(Math.Abs(Math.Log(0.96)) / sd, result.MaxAbsZ!.Value, 12);
        Assert.Equal(0, result.ShareAboveThree!.Value);
        // Nominal coverage 2N(1) − 1 = 0.682689492137086 and 2N(2) − 1 = 0.954499736103642 [C2: standard normal tables].
        Assert.Equal(0.682689492137086, result.Levels[0].NominalCoverage, 12);
        Assert.Equal(0.954499736103642, result.Levels[1].NominalCoverage, 12);
    }

    [Fact]
    public void Evaluate_TooFewNonOverlappingDates_ReturnsNotEnoughDataWithTheCountNeeded()
    {
        // 300 dates at h = 21 give 15 non-overlapping dates (0, 21, …, 294), below the default 20.
        var outcomes = CalibrationData.Outcomes(CalibrationData.Closes(5, 300 + Horizon, TrueVolatility), Horizon);

        var result = MoveBandCoverage.Evaluate(outcomes, CalibrationData.Constant("short", outcomes.Count, TrueVolatility));

        Assert.All(result.Levels, level =>
        {
            Assert.Equal(CoverageTestStatus.NotEnoughData, level.Status);
            Assert.Equal(15, level.NonOverlappingCount);
            Assert.Equal(20, level.SamplesNeeded);
            Assert.Null(level.Kupiec);
            Assert.Null(level.Independence);
            Assert.Null(level.ConditionalCoverage);
            Assert.NotNull(level.ShareWithin);
        });
        Assert.Contains("could not be tested: 15 non-overlapping dates, 20 needed", CoverageVerdict.Describe(result), StringComparison.Ordinal);
    }

    [Fact]
    public void Evaluate_MissingDates_AreMarkedAndBreakTheTransitionChain()
    {
        // h = 1 so every date is sampled. Failures at |z| > 1 alternate with passes; a gap at index 2 must not join
        // indices 1 and 3 into a transition.
        var outcomes = new HorizonOutcomes(1, Enumerable.Repeat(100.0, 6).ToArray(), [100.0, 105.0, 100.0, 100.0, 105.0, 100.0]);
        var forecaster = new ForecasterVolatility("gappy", [0.2, 0.2, null, 0.2, 0.2, 0.2]);

        var result = MoveBandCoverage.Evaluate(outcomes, forecaster, new CalibrationOptions { MinimumNonOverlappingSamples = 2 });

        Assert.Equal(1, result.MissingCount);
        Assert.Equal([2], result.MissingDateIndices.ToArray());
        Assert.Null(result.Z[2]);
        var level = result.Levels[0];
        Assert.Equal(5, level.NonOverlappingCount);
        Assert.Equal(2, level.Failures);
        // Transitions kept: (0→1) and (3→4, 4→5): n00 = 0, n01 = 2, n10 = 1, n11 = 0 → 3 transitions, not 4.
        // Recompute LR_ind from those counts through the public helper.
        var expected = CoverageLikelihoodRatio.Independence(new HitTransitions(0, 2, 1, 0));
        Assert.Equal(expected.Statistic, level.Independence!.Statistic, 14);
    }

    [Fact]
    public void Evaluate_ExactVolatility_KupiecRarelyRejects()
    {
        // Known truth by simulation (common practice, no source): GBM closes with σ = 20%, a forecaster reporting 20%.
        // 5,000 days at h = 21 give 238 non-overlapping dates. At 5% the test should reject about 5% of seeds; we ask
        // that at least 85 of 100 seeds are not rejected at each level (measured: see the report).
        int keep1 = 0, keep2 = 0, keepCc1 = 0;
        for (var seed = 1; seed <= 100; seed++)
        {
            var outcomes = CalibrationData.Outcomes(CalibrationData.Closes(seed, Days, TrueVolatility), Horizon);
            var result = MoveBandCoverage.Evaluate(outcomes, CalibrationData.Constant("exact", outcomes.Count, TrueVolatility));
            keep1 += result.Levels[0].Kupiec!.PValue >= 0.05 ? 1 : 0;
            keep2 += result.Levels[1].Kupiec!.PValue >= 0.05 ? 1 : 0;
            keepCc1 += result.Levels[0].ConditionalCoverage!.PValue >= 0.05 ? 1 : 0;
            Assert.Equal(238, result.Levels[0].NonOverlappingCount);
        }

        output.WriteLine($"not rejected at 5%: |z| <= 1 Kupiec {keep1}/100, |z| <= 2 Kupiec {keep2}/100, |z| <= 1 conditional coverage {keepCc1}/100");
        Assert.True(keep1 >= 85, $"|z| ≤ 1: Kupiec not rejected in {keep1} of 100 seeds");
        Assert.True(keep2 >= 85, $"|z| ≤ 2: Kupiec not rejected in {keep2} of 100 seeds");
        Assert.True(keepCc1 >= 85, $"|z| ≤ 1: conditional coverage not rejected in {keepCc1} of 100 seeds");
    }

    [Fact]
    public void Evaluate_SeventyPercentOfTrueVolatility_IsRejectedAndTooNarrow()
    {
        // σ_F = 0.7 σ: z has standard deviation 1/0.7 = 1.43, so P(|z| ≤ 1) = 2N(0.7) − 1 = 0.516 against 0.683 [D].
        for (var seed = 1; seed <= 20; seed++)
        {
            var outcomes = CalibrationData.Outcomes(CalibrationData.Closes(seed, Days, TrueVolatility), Horizon);
            var result = MoveBandCoverage.Evaluate(outcomes, CalibrationData.Constant("low", outcomes.Count, 0.7 * TrueVolatility));

            Assert.All(result.Levels, level => Assert.True(level.Kupiec!.PValue < 0.05, $"seed {seed}, bound {level.Bound}: p = {level.Kupiec.PValue}"));
            Assert.True(result.Levels[0].ShareWithin < result.Levels[0].NominalCoverage);
            Assert.InRange(result.ZScale!.Value, 1.2, 1.7);
            Assert.StartsWith("move bands from low were too narrow by about", CoverageVerdict.Describe(result), StringComparison.Ordinal);
        }
    }
}
