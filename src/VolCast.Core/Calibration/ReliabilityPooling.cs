using System.Collections.Immutable;

namespace VolCast.Core.Calibration;

/// <summary>Pools a forecaster's reliability bins over its strikes, the curve the reliability diagram draws.</summary>
/// <remarks>
/// The at-the-money probability N(d2) stays near 50% whatever the volatility, so its bins alone would show one point.
/// Pooled bin k holds every strike's forecasts in that bin: n = Σ n_k, the mean predicted probability and observed
/// frequency are n-weighted means, and Wilson's interval uses the summed n_eff = Σ n_k / h. Strikes of one date
/// usually fall in different bins, so pooling adds little dependence inside a bin. Empty bins are left out.
/// </remarks>
internal static class ReliabilityPooling
{
    /// <summary>Pools the bins of every strike.</summary>
    /// <param name="calibration">The forecaster's calibration; every strike has the same bins.</param>
    /// <param name="intervalZ">The normal quantile of the interval (1.96 for 95%).</param>
    /// <returns>The non-empty pooled bins in bin order; empty when the forecaster had no forecast.</returns>
    /// <exception cref="ArgumentNullException"><paramref name="calibration"/> is null.</exception>
    public static ImmutableArray<PooledReliabilityBin> Pool(ForecasterCalibration calibration, double intervalZ)
    {
        ArgumentNullException.ThrowIfNull(calibration);
        if (calibration.Strikes.IsDefaultOrEmpty)
        {
            return [];
        }

        var bins = calibration.Strikes[0].Bins.Length;
        var pooled = ImmutableArray.CreateBuilder<PooledReliabilityBin>(bins);
        for (var k = 0; k < bins; k++)
        {
            var n = 0;
            double effective = 0, sumPredicted = 0, sumObserved = 0;
            foreach (var strike in calibration.Strikes)
            {
                var bin = strike.Bins[k];
                if (bin.Count > 0 && bin.MeanPredicted is { } p && bin.ObservedFrequency is { } o)
                {
                    n += bin.Count;
                    effective += bin.EffectiveCount;
                    sumPredicted += bin.Count * p;
                    sumObserved += bin.Count * o;
                }
            }

            if (n == 0)
            {
                continue;
            }

            var frequency = Math.Clamp(sumObserved / n, 0, 1);
            var (lower, upper) = WilsonInterval.Compute(frequency, effective, intervalZ);
            pooled.Add(new PooledReliabilityBin(k, n, effective, sumPredicted / n, frequency, lower, upper));
        }

        return pooled.ToImmutable();
    }
}
