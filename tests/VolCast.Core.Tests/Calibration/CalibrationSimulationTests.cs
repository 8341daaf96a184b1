using VolCast.Core.Calibration;
using Xunit.Abstractions;

namespace VolCast.Core.Tests.Calibration;

/// <summary>Known truth by simulation (seeded; common practice, no source) for the probability calibration.</summary>
public sealed class CalibrationSimulationTests(ITestOutputHelper output)
{
    private const int Days = 5000;
    private const int Horizon = 21;
    private const double TrueVolatility = 0.20;

    [Fact]
    public void Evaluate_ExactVolatility_PredictedProbabilityInsideTheIntervalInMostSeeds()
    {
        // GBM with zero price drift and σ = 20%; N(d2) with r = q = 0 and σ = 20% is then the true probability.
        var inside = new int[CalibrationOptions.DefaultMoneyness.Length];
        for (var seed = 1; seed <= 100; seed++)
        {
            var outcomes = CalibrationData.Outcomes(CalibrationData.Closes(seed, Days, TrueVolatility), Horizon);
            var result = ProbabilityCalibration.Evaluate(outcomes, CalibrationData.Constant("exact", outcomes.Count, TrueVolatility));
            for (var j = 0; j < inside.Length; j++)
            {
                var bin = result.Strikes[j].Bins.Single(b => b.Count > 0);
                inside[j] += bin.MeanPredicted >= bin.IntervalLower && bin.MeanPredicted <= bin.IntervalUpper ? 1 : 0;
            }
        }

        output.WriteLine($"predicted inside the n/h Wilson interval, per strike, of 100 seeds: {string.Join(", ", inside)}");

        // With n_eff = n / h a 95% interval should hold the truth in about 95 of 100 seeds; ask for 85.
        Assert.All(inside, count => Assert.True(count >= 85, $"inside in {string.Join(",", inside)} of 100 seeds"));
    }

    [Fact]
    public void Evaluate_SeventyPercentOfTrueVolatility_CurveIsFlatterThanTheDiagonal()
    {
        // σ_F = 0.7 σ makes the predicted distribution of S_{t+h} too narrow, so probabilities are too extreme:
        // strikes below the close (m < 1) are predicted to finish above it too often (p too near 1, observed lower),
        // strikes above the close (m > 1) too rarely (p too near 0, observed higher). The reliability curve therefore
        // lies above the diagonal where p < 1/2 and below it where p > 1/2: flatter than the diagonal, "overconfident".
        // At m = 1 both give p ≈ 1/2 (d2 = −σ√τ/2), so that strike says nothing and is skipped.
        var outcomes = CalibrationData.Outcomes(CalibrationData.Closes(2024, Days, TrueVolatility), Horizon);
        var low = ProbabilityCalibration.Evaluate(outcomes, CalibrationData.Constant("low", outcomes.Count, 0.7 * TrueVolatility));
        var exact = ProbabilityCalibration.Evaluate(outcomes, CalibrationData.Constant("exact", outcomes.Count, TrueVolatility));

        foreach (var strike in low.Strikes.Where(s => s.Moneyness != 1.0))
        {
            var bin = strike.Bins.Single(b => b.Count > 0);
            if (strike.Moneyness < 1)
            {
                Assert.True(bin.MeanPredicted > 0.5 && bin.ObservedFrequency < bin.MeanPredicted, $"m = {strike.Moneyness}: predicted {bin.MeanPredicted}, observed {bin.ObservedFrequency}");
            }
            else
            {
                Assert.True(bin.MeanPredicted < 0.5 && bin.ObservedFrequency > bin.MeanPredicted, $"m = {strike.Moneyness}: predicted {bin.MeanPredicted}, observed {bin.ObservedFrequency}");
            }

            // The outer strikes miss by more than the interval allows.
            if (Math.Abs(strike.Moneyness - 1) > 0.09)
            {
                Assert.False(bin.MeanPredicted >= bin.IntervalLower && bin.MeanPredicted <= bin.IntervalUpper, $"m = {strike.Moneyness}");
            }
        }

        // Worse reliability and Brier at every off-the-money strike than the exact forecaster on the same path.
        for (var j = 0; j < low.Strikes.Length; j++)
        {
            if (low.Strikes[j].Moneyness == 1.0)
            {
                continue;
            }

            Assert.True(low.Strikes[j].Decomposition.Reliability > exact.Strikes[j].Decomposition.Reliability);
            Assert.True(low.Strikes[j].Decomposition.Brier > exact.Strikes[j].Decomposition.Brier);
        }
    }
}
