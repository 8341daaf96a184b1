namespace VolCast.Core.Scoring;

/// <summary>
/// Newey-West heteroskedasticity- and autocorrelation-consistent (HAC) variances: the scalar long-run variance
/// of a series and the lag-length rules (docs/methods.md#newey-west).
/// </summary>
/// <remarks>
/// Autocovariances are γ̂_j = (1/T) Σ_{t=j+1..T} (x_t − x̄)(x_{t−j} − x̄): the mean is removed and the divisor is
/// T for every lag, with no small-sample adjustment and no prewhitening. The long-run variance is
/// γ̂_0 + 2 Σ_{j=1..L} w_j γ̂_j with Bartlett weights w_j = 1 − j/(L+1) or rectangular weights w_j = 1.
/// </remarks>
internal static class NeweyWest
{
    /// <summary>Gets the automatic lag L = floor(4 (T/100)^(2/9)) (docs/methods.md#newey-west).</summary>
    /// <param name="sampleSize">Number of observations T, at least 1.</param>
    /// <returns>The lag.</returns>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="sampleSize"/> is below 1.</exception>
    public static int AutomaticLag(int sampleSize)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(sampleSize, 1);
        return (int)Math.Floor(4.0 * Math.Pow(sampleSize / 100.0, 2.0 / 9.0));
    }

    /// <summary>
    /// Gets the lag for overlapping h-day targets: the larger of the automatic lag and h − 1, capped at T − 1.
    /// </summary>
    /// <param name="sampleSize">Number of observations T, at least 1.</param>
    /// <param name="horizonDays">Forecast horizon h in trading days, at least 1.</param>
    /// <returns>max(floor(4 (T/100)^(2/9)), h − 1), at most T − 1.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is below 1.</exception>
    public static int LagForHorizon(int sampleSize, int horizonDays)
    {
        Preconditions.AtLeast(horizonDays, 1, "trading day");
        return Math.Min(Math.Max(AutomaticLag(sampleSize), horizonDays - 1), sampleSize - 1);
    }

    /// <summary>Gets the weight of the autocovariance at lag <paramref name="j"/> for a window of length <paramref name="lag"/>.</summary>
    /// <param name="window">The lag window.</param>
    /// <param name="j">The lag, 1 to <paramref name="lag"/>.</param>
    /// <param name="lag">The truncation lag L.</param>
    /// <returns>1 − j/(L+1) for Bartlett, 1 for rectangular.</returns>
    public static double Weight(LongRunVarianceWindow window, int j, int lag) =>
        window == LongRunVarianceWindow.Bartlett ? 1.0 - (j / (lag + 1.0)) : 1.0;

    /// <summary>Gets the sample autocovariance γ̂_j of a series (mean removed, divisor T).</summary>
    /// <param name="series">The observations, finite.</param>
    /// <param name="j">The lag, 0 to T − 1.</param>
    /// <returns>γ̂_j.</returns>
    /// <exception cref="ArgumentException">The series is empty.</exception>
    /// <exception cref="ArgumentOutOfRangeException">The lag is out of range or a value is not finite.</exception>
    public static double Autocovariance(ReadOnlySpan<double> series, int j)
    {
        Preconditions.CountAtLeast(series.Length, 1, "to estimate an autocovariance", nameof(series));
        Preconditions.Between(j, 0, series.Length - 1, "the number of observations minus one");
        return AutocovarianceCore(series, Mean(series, nameof(series)), j);
    }

    /// <summary>
    /// Gets the long-run variance γ̂_0 + 2 Σ_{j=1..L} w_j γ̂_j of a series (so that the variance of its mean is
    /// this value divided by T).
    /// </summary>
    /// <param name="series">The observations, finite.</param>
    /// <param name="lag">The truncation lag L, 0 to T − 1.</param>
    /// <param name="window">The lag window; Bartlett by default.</param>
    /// <returns>The long-run variance; may be negative with the rectangular window.</returns>
    /// <exception cref="ArgumentException">The series is empty.</exception>
    /// <exception cref="ArgumentOutOfRangeException">The lag is out of range or a value is not finite.</exception>
    public static double LongRunVariance(ReadOnlySpan<double> series, int lag, LongRunVarianceWindow window = LongRunVarianceWindow.Bartlett)
    {
        Preconditions.CountAtLeast(series.Length, 1, "to estimate a long-run variance", nameof(series));
        Preconditions.Between(lag, 0, series.Length - 1, "the number of observations minus one");
        var mean = Mean(series, nameof(series));
        var sum = AutocovarianceCore(series, mean, 0);
        for (var j = 1; j <= lag; j++)
        {
            sum += 2.0 * Weight(window, j, lag) * AutocovarianceCore(series, mean, j);
        }

        return sum;
    }

    /// <summary>
    /// Computes the HAC "meat" S = Γ̂_0 + Σ_{j=1..L} w_j (Γ̂_j + Γ̂_j′) with Γ̂_j = (1/T) Σ_t g_t g_{t−j}′ and
    /// g_t = x_t e_t, for a row-major design (T × k) and residuals. No demeaning (the scores of OLS with an
    /// intercept have mean zero).
    /// </summary>
    internal static void Meat(ReadOnlySpan<double> design, ReadOnlySpan<double> residuals, int columns, int lag, Span<double> meat)
    {
        var n = residuals.Length;
        meat.Clear();
        // Scores g_t = x_t e_t, column-major so each Γ̂_j entry is one dot product of two contiguous runs.
        var scores = System.Buffers.ArrayPool<double>.Shared.Rent(n * columns);
        try
        {
            for (var t = 0; t < n; t++)
            {
                for (var a = 0; a < columns; a++)
                {
                    scores[(a * n) + t] = design[(t * columns) + a] * residuals[t];
                }
            }

            for (var j = 0; j <= lag; j++)
            {
                var w = j == 0 ? 0.5 : Weight(LongRunVarianceWindow.Bartlett, j, lag);
                for (var a = 0; a < columns; a++)
                {
                    var ga = scores.AsSpan((a * n) + j, n - j);
                    for (var b = 0; b < columns; b++)
                    {
                        // Γ̂_j[a, b] = Σ_t g_t[a] g_{t−j}[b], added to [a, b] and [b, a]: over all (a, b) that is w_j (Γ̂_j + Γ̂_j′)
                        // for j > 0, and Γ̂_0 once with w = 1/2 at j = 0 (Γ̂_0 is symmetric).
                        var gamma = Dot(ga, scores.AsSpan(b * n, n - j)) * w;
                        meat[(a * columns) + b] += gamma;
                        meat[(b * columns) + a] += gamma;
                    }
                }
            }
        }
        finally
        {
            System.Buffers.ArrayPool<double>.Shared.Return(scores);
        }

        for (var a = 0; a < meat.Length; a++)
        {
            meat[a] /= n;
        }
    }

    /// <summary>Dot product with four running sums: a fixed summation order, so the result is the same on every machine.</summary>
    internal static double Dot(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        double s0 = 0, s1 = 0, s2 = 0, s3 = 0;
        var i = 0;
        for (; i + 3 < x.Length; i += 4)
        {
            s0 += x[i] * y[i];
            s1 += x[i + 1] * y[i + 1];
            s2 += x[i + 2] * y[i + 2];
            s3 += x[i + 3] * y[i + 3];
        }

        for (; i < x.Length; i++)
        {
            s0 += x[i] * y[i];
        }

        return (s0 + s1) + (s2 + s3);
    }

    internal static double Mean(ReadOnlySpan<double> series, string paramName)
    {
        var sum = 0.0;
        for (var t = 0; t < series.Length; t++)
        {
            Preconditions.FiniteAt(series[t], t, paramName);
            sum += series[t];
        }

        return sum / series.Length;
    }

    internal static double AutocovarianceCore(ReadOnlySpan<double> series, double mean, int j)
    {
        var sum = 0.0;
        for (var t = j; t < series.Length; t++)
        {
            sum += (series[t] - mean) * (series[t - j] - mean);
        }

        return sum / series.Length;
    }
}
