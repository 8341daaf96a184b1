using FsCheck.Xunit;
using VolCast.Core.Calibration;
using VolCast.Core.Options;

namespace VolCast.Core.Tests.Calibration;

public sealed class ProbabilityCalibrationTests
{
    [Fact]
    public void Decompose_ForecastsEqualWithinBins_ThreeTermsSumToBrier()
    {
        // Murphy (1973) [C2]: Brier = REL − RES + UNC exactly when the forecasts within each bin are equal.
        for (var seed = 1; seed <= 50; seed++)
        {
            var random = new Random(seed);
            var n = 200 + random.Next(300);
            var p = new double[n];
            var o = new bool[n];
            for (var i = 0; i < n; i++)
            {
                // Forecasts only at bin centres 0.05, 0.15, …, 0.95.
                p[i] = (random.Next(10) + 0.5) / 10;
                o[i] = random.NextDouble() < Math.Clamp(p[i] + (0.2 * (random.NextDouble() - 0.5)), 0, 1);
            }

            var d = ProbabilityCalibration.Decompose(p, o, 10);

            Assert.Equal(NaiveBrier(p, o), d.Brier, 12);
            Assert.Equal(0, d.WithinBinVariance, 12);
            Assert.Equal(0, d.WithinBinCovariance, 12);
            Assert.Equal(d.Brier, d.Reliability - d.Resolution + d.Uncertainty, 12);
        }
    }

    [Fact]
    public void Decompose_AnyForecasts_IdentityHoldsWithWithinBinTerms()
    {
        // Generalized decomposition (Stephenson, Coelho & Jolliffe 2008, from memory; derived here in the XML docs of
        // BrierDecomposition [D]): Brier = REL − RES + UNC + WBV − WBC for any forecasts.
        for (var seed = 1; seed <= 50; seed++)
        {
            var random = new Random(1000 + seed);
            var n = 50 + random.Next(500);
            var p = new double[n];
            var o = new bool[n];
            for (var i = 0; i < n; i++)
            {
                p[i] = random.NextDouble();
                o[i] = random.NextDouble() < p[i] * p[i];
            }

            var d = ProbabilityCalibration.Decompose(p, o, 10);

            Assert.Equal(NaiveBrier(p, o), d.Brier, 12);
            Assert.Equal(d.Brier, d.Reliability - d.Resolution + d.Uncertainty + d.WithinBinVariance - d.WithinBinCovariance, 12);
            Assert.True(d.WithinBinVariance > 0);
        }
    }

    [Property(MaxTest = 300)]
    public bool Decompose_AnyForecastsAndBins_IdentityHolds(FsCheck.NonEmptyArray<FsCheck.NonNegativeInt> raw, FsCheck.PositiveInt bins)
    {
        // Same identity as above (Murphy 1973 with the within-bin terms [D]) for arbitrary inputs: forecasts k/1000
        // clamped to [0, 1] (so 0, 1 and bin edges occur), outcome = forecast parity, 1 to 50 bins.
        var values = raw.Get;
        var p = new double[values.Length];
        var o = new bool[values.Length];
        for (var i = 0; i < values.Length; i++)
        {
            p[i] = Math.Min(values[i].Get, 1000) / 1000.0;
            o[i] = values[i].Get % 2 == 1;
        }

        var d = ProbabilityCalibration.Decompose(p, o, 1 + (bins.Get % 50));
        var sum = d.Reliability - d.Resolution + d.Uncertainty + d.WithinBinVariance - d.WithinBinCovariance;
        return Math.Abs(d.Brier - sum) <= 1e-12 && Math.Abs(d.Brier - NaiveBrier(p, o)) <= 1e-12 && d.Reliability >= 0 && d.Resolution >= 0;
    }

    [Fact]
    public void Decompose_HandWorkedExample_MatchesEachTerm()
    {
        // Worked by hand [D]: four forecasts, two bins of width 0.5.
        // Bin 0: f = 0.2, 0.2 with o = 0, 1 → f̄ = 0.2, ō = 0.5. Bin 1: f = 0.8, 0.8 with o = 1, 1 → f̄ = 0.8, ō = 1.
        // ō = 0.75. Brier = (0.04 + 0.64 + 0.04 + 0.04)/4 = 0.19.
        // REL = (2·0.09 + 2·0.04)/4 = 0.065; RES = (2·0.0625 + 2·0.0625)/4 = 0.0625; UNC = 0.75·0.25 = 0.1875.
        // 0.065 − 0.0625 + 0.1875 = 0.19.
        var d = ProbabilityCalibration.Decompose([0.2, 0.2, 0.8, 0.8], [false, true, true, true], 2);

        Assert.Equal(0.19, d.Brier, 14);
        Assert.Equal(0.065, d.Reliability, 14);
        Assert.Equal(0.0625, d.Resolution, 14);
        Assert.Equal(0.1875, d.Uncertainty, 14);
    }

    [Fact]
    public void Evaluate_SmallSample_EveryScoreMatchesANaiveRecomputation()
    {
        // Naive per-forecast recomputation in the test (common practice, no source), using N(d2) from Options.
        var closes = CalibrationData.Closes(7, 400, 0.25);
        var outcomes = CalibrationData.Outcomes(closes, 5);
        var forecaster = CalibrationData.Constant("flat", outcomes.Count, 0.22);
        var options = new CalibrationOptions { RiskFreeRate = 0.03, DividendYield = 0.01 };

        var result = ProbabilityCalibration.Evaluate(outcomes, forecaster, options);

        Assert.Equal(5, result.Strikes.Length);
        var tau = 5 / 252.0;
        for (var j = 0; j < options.Moneyness.Length; j++)
        {
            var m = options.Moneyness[j];
            double brier = 0, log = 0, hits = 0;
            for (var t = 0; t < outcomes.Count; t++)
            {
                var s = outcomes.StartClose[t];
                var p = StandardNormal.Cdf(AboveStrikeProbability.D2(s, m * s, 0.22, tau, 0.03, 0.01));
                var o = outcomes.EndClose[t] > m * s ? 1.0 : 0.0;
                brier += (p - o) * (p - o);
                log -= o == 1 ? Math.Log(p) : Math.Log(1 - p);
                hits += o;
            }

            var strike = result.Strikes[j];
            Assert.Equal(m, strike.Moneyness);
            Assert.Equal(brier / outcomes.Count, strike.Decomposition.Brier, 12);
            Assert.Equal(log / outcomes.Count, strike.LogScore, 10);
            Assert.Equal(hits / outcomes.Count, strike.ObservedFrequency, 12);
            Assert.Equal(outcomes.Count, strike.Bins.Sum(b => b.Count));
        }
    }

    [Fact]
    public void Evaluate_MissingDates_AreCountedAndListed()
    {
        var outcomes = CalibrationData.Outcomes(CalibrationData.Closes(3, 100, 0.2), 5);
        var values = new double?[outcomes.Count];
        for (var t = 0; t < values.Length; t++)
        {
            values[t] = t is 0 or 1 or 40 ? null : 0.2;
        }

        var result = ProbabilityCalibration.Evaluate(outcomes, new ForecasterVolatility("gappy", values));

        Assert.Equal(3, result.MissingCount);
        Assert.Equal([0, 1, 40], result.MissingDateIndices.ToArray());
        Assert.Equal(outcomes.Count - 3, result.Count);
        Assert.All(result.Strikes, s => Assert.Equal(outcomes.Count - 3, s.Decomposition.Count));
    }

    [Fact]
    public void Evaluate_NoForecastAtAll_ReturnsNoStrikesAndCountsEveryDate()
    {
        var outcomes = CalibrationData.Outcomes(CalibrationData.Closes(3, 50, 0.2), 5);

        var result = ProbabilityCalibration.Evaluate(outcomes, new ForecasterVolatility("empty", new double?[outcomes.Count]));

        Assert.Equal(0, result.Count);
        Assert.Equal(outcomes.Count, result.MissingCount);
        Assert.Empty(result.Strikes);
    }

    [Fact]
    public void Evaluate_CertainForecastThatMisses_LogScoreIsClippedAndFinite()
    {
        // Strike at twice the close with σ = 1% a year over one day: p = N(≈ −1100) = 0 to double precision. On the
        // first date the close finishes above the strike anyway (p = 0 missed), on the second it does not (1 − p = 1).
        var outcomes = new HorizonOutcomes(1, [100, 100], [300, 90]);
        var forecaster = new ForecasterVolatility("tiny", [0.01, 0.01]);
        var options = new CalibrationOptions { Moneyness = [2.0] };

        var strike = ProbabilityCalibration.Evaluate(outcomes, forecaster, options).Strikes[0];

        // Clip ε = 1e-12 [D]: the miss costs −ln(1e-12) = 27.631, the sure non-event −ln(1 − 1e-12) ≈ 1e-12; both were
        // clipped (0 up to ε, 1 down to 1 − ε); mean 13.8155.
        Assert.Equal(2, strike.ClippedCount);
        Assert.Equal(-Math.Log(1e-12) / 2, strike.LogScore, 6);
    }

    [Theory]
    [InlineData(0.0)] // zero is not a strike
    [InlineData(-0.95)] // negative
    [InlineData(double.NaN)] // not a number
    public void Evaluate_MoneynessNotPositive_ThrowsNamingTheValue(double bad)
    {
        var outcomes = new HorizonOutcomes(1, [100, 100], [101, 99]);
        var forecaster = new ForecasterVolatility("x", [0.2, 0.2]);
        var options = new CalibrationOptions { Moneyness = [1.0, bad] };

        var e = Assert.Throws<ArgumentOutOfRangeException>(() => ProbabilityCalibration.Evaluate(outcomes, forecaster, options));
        Assert.Contains("Moneyness[1]", e.Message, StringComparison.Ordinal);
        Assert.Contains("above zero", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Evaluate_NotAligned_ThrowsNamingBothLengths()
    {
        var outcomes = new HorizonOutcomes(1, [100, 100], [101, 99]);

        var e = Assert.Throws<ArgumentException>(() => ProbabilityCalibration.Evaluate(outcomes, new ForecasterVolatility("x", [0.2])));
        Assert.Contains("(2 dates), was 1", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void ForecasterVolatility_NaNValue_ThrowsAndSaysToUseNull()
    {
        var e = Assert.Throws<ArgumentOutOfRangeException>(() => new ForecasterVolatility("x", [0.2, double.NaN]));
        Assert.Contains("or null where the forecaster has no value", e.Message, StringComparison.Ordinal);
    }

    private static double NaiveBrier(double[] p, bool[] o)
    {
        double s = 0;
        for (var i = 0; i < p.Length; i++)
        {
            var e = p[i] - (o[i] ? 1 : 0);
            s += e * e;
        }

        return s / p.Length;
    }
}
