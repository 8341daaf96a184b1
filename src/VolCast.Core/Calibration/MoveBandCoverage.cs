using System.Collections.Immutable;
using VolCast.Core.Options;

namespace VolCast.Core.Calibration;

/// <summary>
/// Backtests the forecast move bands (±1σ, ±2σ) a volatility forecast implies: the standardized move
/// z = ln(S_{t+h}/S_t) / (σ_F √(h_t/A)), the shares of |z| ≤ 1 and |z| ≤ 2 against 68.27% and 95.45%, the Kupiec and
/// Christoffersen tests on non-overlapping dates, and the tails.
/// </summary>
/// <remarks>
/// z carries no drift correction: over the horizons used (days to months) the lognormal drift −σ²τ/2 moves z by
/// −σ√τ/2, a few hundredths, against ranges of ±1 and ±2. See <see cref="CoverageLevelResult"/> for how the
/// non-overlapping dates are taken.
/// </remarks>
public static class MoveBandCoverage
{
    private static readonly double[] Bounds = [1.0, 2.0];

    /// <summary>Scores one forecaster's ranges.</summary>
    /// <param name="outcomes">The closes at t and t + h.</param>
    /// <param name="forecaster">The forecaster's volatility per date, aligned with <paramref name="outcomes"/>.</param>
    /// <param name="options">Annualization and the minimum sample for the tests; the defaults when null.</param>
    /// <returns>The coverage result; the tests come back as not enough data (with the count needed) when the sample is short.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">The series are not aligned, or an option is invalid.</exception>
    public static CoverageResult Evaluate(HorizonOutcomes outcomes, ForecasterVolatility forecaster, CalibrationOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(outcomes);
        ArgumentNullException.ThrowIfNull(forecaster);
        options ??= new CalibrationOptions();
        options.Validate();
        outcomes.CheckAligned(forecaster);

        var h = outcomes.HorizonDays;
        var windows = outcomes.WindowArray;
        var annualization = options.AnnualizationFactor;
        var start = outcomes.StartArray;
        var end = outcomes.EndArray;
        var sigmas = forecaster.Values;
        var n = sigmas.Length;
        var z = new double?[n];
        var missing = ImmutableArray.CreateBuilder<int>();
        int count = 0, within1 = 0, within2 = 0, above3 = 0;
        double sumSquares = 0, maxAbs = 0;
        for (var t = 0; t < n; t++)
        {
            if (sigmas[t] is not { } sigma)
            {
                missing.Add(t);
                continue;
            }

            var value = Math.Log(end[t] / start[t]) / (sigma * Math.Sqrt(windows[t] / annualization));
            z[t] = value;
            var a = Math.Abs(value);
            count++;
            sumSquares += value * value;
            maxAbs = Math.Max(maxAbs, a);
            within1 += a <= 1 ? 1 : 0;
            within2 += a <= 2 ? 1 : 0;
            above3 += a > 3 ? 1 : 0;
        }

        var levels = ImmutableArray.CreateBuilder<CoverageLevelResult>(Bounds.Length);
        foreach (var bound in Bounds)
        {
            var within = bound == 1.0 ? within1 : within2;
            levels.Add(TestLevel(z, windows, bound, count == 0 ? null : (double)within / count, options.MinimumNonOverlappingSamples));
        }

        return new CoverageResult(
            forecaster.Spec,
            h,
            count,
            missing.Count,
            missing.ToImmutable(),
            count == 0 ? null : Math.Sqrt(sumSquares / count),
            count == 0 ? null : maxAbs,
            count == 0 ? null : (double)above3 / count,
            levels.MoveToImmutable(),
            ImmutableArray.Create(z));
    }

    /// <summary>The coverage under a calibrated forecast of the range |z| ≤ bound, 2N(bound) − 1.</summary>
    /// <param name="bound">The bound on |z|, above zero.</param>
    /// <returns>The nominal coverage: 0.682689… for 1, 0.954499… for 2.</returns>
    public static double NominalCoverage(double bound) => 2 * StandardNormal.Cdf(bound) - 1;

    private static CoverageLevelResult TestLevel(double?[] z, int[] windows, double bound, double? shareWithin, int minimum)
    {
        var nominal = NominalCoverage(bound);

        // From the first date, each next sampled date is the one where the last sampled window ends (t + h_t): the
        // windows do not overlap. With a fixed horizon that is every h-th date.
        int sampled = 0, failures = 0, n00 = 0, n01 = 0, n10 = 0, n11 = 0;
        bool? previous = null;
        for (var t = 0; t < z.Length; t += windows[t])
        {
            if (z[t] is not { } value)
            {
                previous = null;
                continue;
            }

            var failed = Math.Abs(value) > bound;
            sampled++;
            failures += failed ? 1 : 0;
            if (previous is { } was)
            {
                if (was)
                {
                    if (failed)
                    {
                        n11++;
                    }
                    else
                    {
                        n10++;
                    }
                }
                else if (failed)
                {
                    n01++;
                }
                else
                {
                    n00++;
                }
            }

            previous = failed;
        }

        if (sampled < minimum)
        {
            return new CoverageLevelResult(bound, nominal, shareWithin, CoverageTestStatus.NotEnoughData, sampled, minimum, failures, null, null, null);
        }

        var kupiec = CoverageLikelihoodRatio.Kupiec(sampled, failures, 1 - nominal);
        var independence = CoverageLikelihoodRatio.Independence(new HitTransitions(n00, n01, n10, n11));
        var conditional = CoverageLikelihoodRatio.ConditionalCoverage(kupiec, independence);
        return new CoverageLevelResult(bound, nominal, shareWithin, CoverageTestStatus.Computed, sampled, minimum, failures, kupiec, independence, conditional);
    }
}
