using VolCast.Core.Data;
using VolCast.Core.Estimators;
using Xunit.Abstractions;

namespace VolCast.Core.Tests.Estimators;

/// <summary>
/// Known-truth Monte Carlo: seeded geometric Brownian motion with zero drift in log price and a known daily
/// volatility, sampled 390 times a day (one point a minute over a 6.5-hour session), OHLC bars built from the path.
/// </summary>
/// <remarks>
/// Discrete sampling of the range. A path seen only at 390 points misses the excursions between them, so the
/// sampled high is below the true high by about β σ √Δt on average, β = −ζ(1/2)/√(2π) ≈ 0.5826 (the continuity
/// correction of Broadie, Glasserman and Kou 1997 [M]; the downward bias itself: docs/methods.md#parkinson [C2]); the same
/// holds for the low. For Parkinson, E[R²] then drops from 4 ln 2 σ² by about 2·E[R]·2βσ√Δt with
/// E[R] = 2√(2/π) σ, a relative bias of β√Δt·2√(2/π)/ln 2 ≈ 6.8% at Δt = 1/390 day [D]: far more than the
/// tolerance of the unbiasedness tests. The known-truth tests therefore take the high and low of the continuous
/// path (<see cref="Some.GbmBars"/> with continuous extremes draws each step's Brownian-bridge maximum and minimum
/// from their exact law), where every estimator is unbiased; a separate test measures the discrete-sampling bias
/// on the same path and checks it against the first-order prediction.
/// </remarks>
public sealed partial class RollingVolatilityTests(ITestOutputHelper output)
{
    private const double TrueDailyVolatility = 0.01;
    private const double TrueDailyVariance = TrueDailyVolatility * TrueDailyVolatility;
    private const int StepsPerDay = 390;
    private const int SimulatedDays = 30_000;
    private const int SimulationSeed = 2024;

    private const double OvernightVolatility = 0.006;

    private static readonly Lazy<PriceHistory> ContinuousPath = new(() =>
        Some.GbmBars(SimulationSeed, SimulatedDays, TrueDailyVolatility, StepsPerDay, continuousExtremes: true));

    private static readonly Lazy<EstimatorTerms> PathWithGaps = new(() => EstimatorTerms.From(
        Some.GbmBars(seed: 77, days: 8_000, TrueDailyVolatility, StepsPerDay, OvernightVolatility, continuousExtremes: true)));

    [Theory]
    [MemberData(nameof(AllEstimators))]
    public void RollingDailyVariance_GbmWithKnownVolatility_MeanOverWindowsIsTrueVariance(Estimator estimator)
    {
        // Non-overlapping 21-day windows are independent, so their spread gives the standard error of the mean.
        const int window = 21;
        var variance = EstimatorTerms.From(ContinuousPath.Value).RollingDailyVariance(estimator, window);
        var (mean, standardError) = MeanOfEvery(variance, window);
        output.WriteLine(FormattableString.Invariant($"{estimator}: mean / σ² = {mean / TrueDailyVariance:F4}, standard error {standardError / TrueDailyVariance:F4}"));

        // Each estimator is unbiased for σ² under zero drift, continuous trading and no opening jump
        // (docs/methods.md#parkinson to #yang-zhang [C]); the tolerance is 4 standard errors of a mean of ~1,400 windows.
        Assert.InRange(mean, TrueDailyVariance - (4 * standardError), TrueDailyVariance + (4 * standardError));
        Assert.True(standardError < 0.012 * TrueDailyVariance, $"standard error {standardError} is too large for a meaningful test");
    }

    [Theory]
    // Without an opening jump every estimator measures σ² of the trading session; with overnight gaps of
    // volatility σ_o, close-to-close and Yang-Zhang measure σ² + σ_o² and the range estimators σ² only
    // (docs/methods.md#garman-klass to #yang-zhang: Garman-Klass and Rogers-Satchell ignore opening jumps, Yang-Zhang handles them [C]).
    [InlineData(Estimator.CloseToClose, true)]
    [InlineData(Estimator.YangZhang, true)]
    [InlineData(Estimator.Parkinson, false)]
    [InlineData(Estimator.GarmanKlass, false)]
    [InlineData(Estimator.RogersSatchell, false)]
    public void RollingDailyVariance_GbmWithOvernightGaps_OnlyCloseToCloseAndYangZhangSeeTheGap(Estimator estimator, bool includesGap)
    {
        const int window = 21;
        var (mean, standardError) = MeanOfEvery(PathWithGaps.Value.RollingDailyVariance(estimator, window), window);

        output.WriteLine(FormattableString.Invariant($"{estimator}: mean {mean:E4} ± {standardError:E2}"));
        var expected = TrueDailyVariance + (includesGap ? OvernightVolatility * OvernightVolatility : 0.0);

        Assert.InRange(mean, expected - (4 * standardError), expected + (4 * standardError));
    }

    [Theory]
    // Parkinson: efficiency 2 / (9ζ(3)/(4 ln 2)² − 1) = 4.91 (docs/methods.md#parkinson [D]; Kunitomo 1992 "about 4.91" [C]).
    [InlineData(Estimator.Parkinson, 4.91)]
    // Garman-Klass: ≈ 7.4 relative to (C − O)² (docs/methods.md#garman-klass [C: Meilijson 2011]).
    [InlineData(Estimator.GarmanKlass, 7.4)]
    public void BarVariance_GbmWithKnownVolatility_EfficiencyAgainstCloseToCloseNearPublishedValue(Estimator estimator, double published)
    {
        // Efficiency = Var(r²) / Var(daily term), one-day estimators, r = ln(C/C₋₁) = ln(C/O) here (no gaps).
        // Its standard error comes from 20 batches of 1,500 days; the tolerance is 4 of them plus the rounding of
        // the published figure.
        var (efficiency, standardError) = Efficiency(ContinuousPath.Value, estimator, batches: 20);
        output.WriteLine(FormattableString.Invariant($"{estimator}: efficiency {efficiency:F3} ± {standardError:F3}"));

        Assert.InRange(efficiency, published - (4 * standardError) - 0.05, published + (4 * standardError) + 0.05);
        Assert.True(standardError < 0.04 * published, $"standard error {standardError} is too large for a meaningful test");
    }

    [Fact]
    public void BarVariance_GbmWithKnownVolatility_RogersSatchellEfficiencyBetweenParkinsonAndGarmanKlass()
    {
        // Rogers-Satchell's efficiency is about 6 at zero drift (docs/methods.md#rogers-satchell [M]): below Garman-Klass and
        // above Parkinson; the ordering is what is checked.
        var (parkinson, _) = Efficiency(ContinuousPath.Value, Estimator.Parkinson, batches: 20);
        var (rogersSatchell, standardError) = Efficiency(ContinuousPath.Value, Estimator.RogersSatchell, batches: 20);
        var (garmanKlass, _) = Efficiency(ContinuousPath.Value, Estimator.GarmanKlass, batches: 20);
        output.WriteLine(FormattableString.Invariant($"Rogers-Satchell efficiency {rogersSatchell:F3} ± {standardError:F3}"));

        Assert.InRange(rogersSatchell, 6.0 - (4 * standardError) - 0.5, 6.0 + (4 * standardError) + 0.5);
        Assert.True(parkinson < rogersSatchell && rogersSatchell < garmanKlass, $"Parkinson {parkinson}, Rogers-Satchell {rogersSatchell}, Garman-Klass {garmanKlass}");
    }

    [Fact]
    public void RollingDailyVariance_RangeSampledAtGridPointsOnly_ParkinsonBiasedDownByContinuityCorrection()
    {
        // Same seed, so the same sampled path as the first 10,000 days of the continuous one; only the high and
        // low differ (grid points versus continuous path).
        const int days = 10_000;
        var sampled = Some.GbmBars(SimulationSeed, days, TrueDailyVolatility, StepsPerDay, continuousExtremes: false);
        var continuous = ContinuousPath.Value;
        double sampledSum = 0, continuousSum = 0;
        for (var t = 0; t < days; t++)
        {
            sampledSum += BarVariance.Parkinson(sampled.High[t], sampled.Low[t]);
            continuousSum += BarVariance.Parkinson(continuous.High[t], continuous.Low[t]);
        }

        var ratio = sampledSum / continuousSum;
        output.WriteLine(FormattableString.Invariant($"sampled / continuous Parkinson = {ratio:F5}"));

        // First-order prediction (see the class remarks): 1 − β√Δt·2√(2/π)/ln 2 with β = 0.5826 [M], Δt = 1/390.
        // The next term is of order (2β√Δt)² ≈ 0.004 and positive; the paired ratio's own noise is far smaller.
        var predicted = 1 - (0.5826 * Math.Sqrt(1.0 / StepsPerDay) * 2 * Math.Sqrt(2 / Math.PI) / Math.Log(2));
        Assert.InRange(ratio, predicted - 0.004, predicted + 0.008);
        Assert.Equal(continuous.Close[days - 1], sampled.Close[days - 1]);
    }

    private static (double Mean, double StandardError) MeanOfEvery(double[] values, int stride)
    {
        double sum = 0, sumOfSquares = 0;
        var count = 0;
        for (var i = 0; i < values.Length; i += stride)
        {
            sum += values[i];
            sumOfSquares += values[i] * values[i];
            count++;
        }

        var mean = sum / count;
        var variance = (sumOfSquares - (sum * mean)) / (count - 1);
        return (mean, Math.Sqrt(variance / count));
    }

    private static (double Efficiency, double StandardError) Efficiency(PriceHistory prices, Estimator estimator, int batches)
    {
        var days = prices.Count - 1;
        var squaredReturn = new double[days];
        var term = new double[days];
        for (var t = 1; t <= days; t++)
        {
            double o = prices.Open[t], h = prices.High[t], l = prices.Low[t], c = prices.Close[t];
            var r = Math.Log(c / prices.Close[t - 1]);
            squaredReturn[t - 1] = r * r;
            term[t - 1] = estimator switch
            {
                Estimator.Parkinson => BarVariance.Parkinson(h, l),
                Estimator.GarmanKlass => BarVariance.GarmanKlass(o, h, l, c),
                _ => BarVariance.RogersSatchell(o, h, l, c),
            };
        }

        var overall = SampleVariance(squaredReturn, 0, days) / SampleVariance(term, 0, days);
        var size = days / batches;
        double sum = 0, sumOfSquares = 0;
        for (var b = 0; b < batches; b++)
        {
            var e = SampleVariance(squaredReturn, b * size, size) / SampleVariance(term, b * size, size);
            sum += e;
            sumOfSquares += e * e;
        }

        var batchVariance = (sumOfSquares - (sum * sum / batches)) / (batches - 1);
        return (overall, Math.Sqrt(batchVariance / batches));
    }

    private static double SampleVariance(double[] x, int start, int length)
    {
        double mean = 0;
        for (var i = start; i < start + length; i++)
        {
            mean += x[i];
        }

        mean /= length;
        double sum = 0;
        for (var i = start; i < start + length; i++)
        {
            sum += (x[i] - mean) * (x[i] - mean);
        }

        return sum / (length - 1);
    }
}
