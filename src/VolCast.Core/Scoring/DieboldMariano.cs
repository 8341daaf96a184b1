using System.Buffers;
using System.Globalization;

namespace VolCast.Core.Scoring;

/// <summary>
/// The Diebold-Mariano (1995) test of equal predictive accuracy with the Harvey-Leybourne-Newbold (1997)
/// correction (docs/methods.md#diebold-mariano).
/// </summary>
/// <remarks>
/// <para>
/// On d_t = L1_t − L2_t: DM = d̄ / √(V̂/T) with V̂ = γ̂_0 + 2 Σ_{j=1..L} w_j γ̂_j (autocovariances with the mean
/// removed and divisor T), L = h − 1 by default; DM* = DM · √[(T + 1 − 2h + h(h − 1)/T)/T]; the p-value is
/// two-sided from Student's t with T − 1 degrees of freedom.
/// </para>
/// <para>
/// The default window is rectangular (w_j = 1 for j ≤ h − 1), as in Diebold and Mariano (1995) and in R's
/// forecast::dm.test (<c>varestimator = "acf"</c>): the autocovariances of a loss differential on overlapping h-day
/// targets are those of an MA(h − 1), which this window counts in full. In small samples its estimate can be zero or
/// negative; then the Bartlett estimate at the same lag (w_j = 1 − j/(L+1), never negative) is used instead and
/// <see cref="DieboldMarianoResult.WindowUsed"/> says so (forecast::dm.test instead falls back to h = 1). Bartlett
/// weights can be asked for; at lag h − 1 they under-weight those autocovariances, so the test rejects more often
/// than its nominal size.
/// </para>
/// <para>Sign convention: a negative statistic means the first forecaster's loss is lower.</para>
/// </remarks>
internal static class DieboldMariano
{
    /// <summary>Tests equal accuracy on a loss differential with lag h − 1.</summary>
    /// <param name="lossDifferential">d_t = L1_t − L2_t, finite, at least 2 observations.</param>
    /// <param name="horizonDays">The forecast horizon h in trading days, at least 1.</param>
    /// <param name="window">The lag window; rectangular by default.</param>
    /// <returns>The statistic (negative: the first forecaster's loss is lower) and p-value.</returns>
    /// <exception cref="ArgumentException">Too few observations for the horizon.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A value is not finite, or the horizon is below 1.</exception>
    public static DieboldMarianoResult Test(ReadOnlySpan<double> lossDifferential, int horizonDays, LongRunVarianceWindow window = LongRunVarianceWindow.Rectangular)
    {
        Preconditions.AtLeast(horizonDays, 1, "trading day");
        return TestWithLag(lossDifferential, horizonDays, horizonDays - 1, window);
    }

    /// <summary>Tests equal accuracy of two aligned loss series with lag h − 1, on d_t = L1_t − L2_t.</summary>
    /// <param name="firstLoss">Losses of the first forecaster, L1_t.</param>
    /// <param name="secondLoss">Losses of the second forecaster, L2_t, aligned with the first.</param>
    /// <param name="horizonDays">The forecast horizon h in trading days, at least 1.</param>
    /// <param name="window">The lag window; rectangular by default.</param>
    /// <returns>The statistic (negative: the first forecaster's loss is lower) and p-value.</returns>
    /// <exception cref="ArgumentException">The lengths differ, or too few observations for the horizon.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A value is not finite, or the horizon is below 1.</exception>
    public static DieboldMarianoResult Test(ReadOnlySpan<double> firstLoss, ReadOnlySpan<double> secondLoss, int horizonDays, LongRunVarianceWindow window = LongRunVarianceWindow.Rectangular)
    {
        Preconditions.SameLength(secondLoss.Length, firstLoss.Length, nameof(firstLoss), nameof(secondLoss));
        var n = firstLoss.Length;
        var d = ArrayPool<double>.Shared.Rent(Math.Max(n, 1));
        try
        {
            for (var t = 0; t < n; t++)
            {
                d[t] = firstLoss[t] - secondLoss[t];
            }

            return Test(d.AsSpan(0, n), horizonDays, window);
        }
        finally
        {
            ArrayPool<double>.Shared.Return(d);
        }
    }

    /// <summary>Tests equal accuracy on a loss differential with an explicit autocovariance lag.</summary>
    /// <param name="lossDifferential">d_t = L1_t − L2_t, finite, at least 2 observations.</param>
    /// <param name="horizonDays">The forecast horizon h in trading days (for the HLN factor), at least 1.</param>
    /// <param name="lag">The autocovariance lag L, 0 to T − 1.</param>
    /// <param name="window">The lag window.</param>
    /// <returns>The statistic (negative: the first forecaster's loss is lower) and p-value.</returns>
    /// <exception cref="ArgumentException">Too few observations for the horizon.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A value is not finite, or the horizon or lag is out of range.</exception>
    public static DieboldMarianoResult TestWithLag(ReadOnlySpan<double> lossDifferential, int horizonDays, int lag, LongRunVarianceWindow window)
    {
        Preconditions.AtLeast(horizonDays, 1, "trading day");
        var n = lossDifferential.Length;
        Preconditions.CountAtLeast(n, 2, "for a Diebold-Mariano test", nameof(lossDifferential));
        Preconditions.Between(lag, 0, n - 1, "the number of observations minus one");
        var factor = HlnFactor(n, horizonDays);
        var mean = NeweyWest.Mean(lossDifferential, nameof(lossDifferential));
        var variance = NeweyWest.LongRunVariance(lossDifferential, lag, window);
        var used = window;
        if (!(variance > 0) && window == LongRunVarianceWindow.Rectangular)
        {
            used = LongRunVarianceWindow.Bartlett;
            variance = NeweyWest.LongRunVariance(lossDifferential, lag, used);
        }

        // Relative to the scale of d, a long-run variance at rounding level means a constant differential.
        if (!(variance > 1e-28 * mean * mean))
        {
            return new DieboldMarianoResult(n, horizonDays, lag, mean, variance, window, used, factor, null, null, null);
        }

        var dm = mean / Math.Sqrt(variance / n);
        var corrected = dm * factor;
        var p = HacRegressionResult.TwoSidedStudentT(corrected, n - 1);
        return new DieboldMarianoResult(n, horizonDays, lag, mean, variance, window, used, factor, dm, corrected, p);
    }

    /// <summary>Gets the Harvey-Leybourne-Newbold factor √[(T + 1 − 2h + h(h − 1)/T)/T].</summary>
    /// <param name="count">Number of observations T, at least 1.</param>
    /// <param name="horizonDays">The forecast horizon h, at least 1.</param>
    /// <returns>The factor that multiplies the DM statistic.</returns>
    /// <exception cref="ArgumentException">T is too small for h (the bracket is not positive).</exception>
    /// <exception cref="ArgumentOutOfRangeException">An argument is below 1.</exception>
    public static double HlnFactor(int count, int horizonDays)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(count, 1);
        Preconditions.AtLeast(horizonDays, 1, "trading day");
        double t = count, h = horizonDays;
        var bracket = (t + 1.0 - (2.0 * h) + (h * (h - 1.0) / t)) / t;
        if (!(bracket > 0))
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"{count} observations are too few for a {horizonDays}-day horizon: the Harvey-Leybourne-Newbold correction needs T + 1 - 2h + h(h-1)/T > 0 (about T >= 2h - 1)."), nameof(count));
        }

        return Math.Sqrt(bracket);
    }
}
