namespace VolCast.Core.Trading.Snooping;

/// <summary>
/// The automatic mean block length of the stationary bootstrap: Politis &amp; White (2004), "Automatic block-length
/// selection for the dependent bootstrap", Econometric Reviews 23(1), with the correction of Patton, Politis &amp;
/// White (2009), Econometric Reviews 28(4).
/// </summary>
/// <remarks>
/// <para>
/// b̂ = (2·Ĝ² / D̂)^{1/3} · T^{1/3} with Ĝ = Σ_{|k|≤M} λ(k/M)·|k|·R̂(k) and D̂ = 2·ĝ(0)², ĝ(0) = Σ_{|k|≤M} λ(k/M)·R̂(k)
/// (the 2009 correction: the paper's D̂ for the stationary bootstrap was wrong by a factor), λ the flat-top kernel
/// (1 on |s| ≤ ½, 2(1 − |s|) on ½ &lt; |s| ≤ 1, 0 beyond) and R̂ the sample autocovariances (mean removed, divisor T).
/// </para>
/// <para>
/// M = 2·m̂, m̂ the first lag that starts a run of K_T = max(5, ⌈√log₁₀ T⌉) autocorrelations all below
/// 2·√(log₁₀ T / T) in absolute value, searched up to ⌈√T⌉ + K_T lags (if there is no such run, the last significant
/// lag); b̂ is capped at ⌈min(3√T, T/3)⌉. These are the choices of Patton's published code and of the R package np's
/// <c>b.star</c>.
/// </para>
/// </remarks>
internal static class AutomaticBlockLength
{
    /// <summary>The Politis-White mean block length of one series, at least 1.</summary>
    /// <param name="series">The series, at least 4 values, all finite.</param>
    /// <returns>The estimated optimal mean block length of the stationary bootstrap, in dates.</returns>
    /// <exception cref="ArgumentException">Fewer than 4 values.</exception>
    public static double Of(ReadOnlySpan<double> series)
    {
        var n = series.Length;
        if (n < 4)
        {
            throw new ArgumentException($"The automatic block length needs at least 4 dates, was {n}.", nameof(series));
        }

        var kn = Math.Max(5, (int)Math.Ceiling(Math.Sqrt(Math.Log10(n))));
        var maxLag = Math.Min(n - 1, (int)Math.Ceiling(Math.Sqrt(n)) + kn);
        var cap = Math.Ceiling(Math.Min(3 * Math.Sqrt(n), n / 3.0));
        var critical = 2 * Math.Sqrt(Math.Log10(n) / n);

        var mean = 0.0;
        var constant = true;
        for (var t = 0; t < n; t++)
        {
            mean += series[t];
            constant &= series[t] == series[0];
        }

        if (constant)
        {
            // No variance, so no dependence to keep (a rule that never trades has a constant difference).
            return 1.0;
        }

        mean /= n;
        var centred = new double[n];
        for (var t = 0; t < n; t++)
        {
            centred[t] = series[t] - mean;
        }

        var cov = new double[maxLag + 1];
        for (var k = 0; k <= maxLag; k++)
        {
            var s = 0.0;
            for (var t = k; t < n; t++)
            {
                s += centred[t] * centred[t - k];
            }

            cov[k] = s / n;
        }

        if (cov[0] <= 0)
        {
            return 1.0;
        }

        // m̂: the first lag that starts a run of kn insignificant autocorrelations.
        var mHat = -1;
        for (var start = 1; start + kn - 1 <= maxLag && mHat < 0; start++)
        {
            var quiet = true;
            for (var k = start; k < start + kn && quiet; k++)
            {
                quiet = Math.Abs(cov[k] / cov[0]) < critical;
            }

            mHat = quiet ? start : -1;
        }

        if (mHat < 0)
        {
            mHat = 0;
            for (var k = maxLag; k >= 1; k--)
            {
                if (Math.Abs(cov[k] / cov[0]) > critical)
                {
                    mHat = k;
                    break;
                }
            }
        }

        var m = Math.Min(2 * mHat, maxLag);
        if (m == 0)
        {
            return 1.0;
        }

        double g = 0, g0 = cov[0];
        for (var k = 1; k <= m; k++)
        {
            var s = Math.Abs((double)k / m);
            var weight = s <= 0.5 ? 1.0 : 2.0 * (1.0 - s);
            g += 2 * weight * k * cov[k];
            g0 += 2 * weight * cov[k];
        }

        var d = 2 * g0 * g0;
        if (!(d > 0) || g == 0)
        {
            return 1.0;
        }

        var b = Math.Pow(2 * g * g / d, 1.0 / 3.0) * Math.Pow(n, 1.0 / 3.0);
        return Math.Clamp(b, 1.0, Math.Max(1.0, cap));
    }

    /// <summary>The mean over rules of each rule's Politis-White block length, floored at <paramref name="floor"/>.</summary>
    /// <param name="rows">K rows of T values (the daily P&amp;L differences of the rules searched).</param>
    /// <param name="floor">Smallest block length returned (the horizon of the trades), at least 1.</param>
    /// <returns>The mean block length for the shared resamples of every rule.</returns>
    /// <exception cref="ArgumentException">No rule, rows of different lengths, fewer than 4 dates or a value that is not finite.</exception>
    public static double Of(double[][] rows, double floor)
    {
        var days = SnoopingGuard.Rectangular(rows, nameof(rows));
        SnoopingGuard.MeanBlockLength(floor, nameof(floor));
        var sum = 0.0;
        for (var k = 0; k < rows.Length; k++)
        {
            sum += Of(rows[k].AsSpan(0, days));
        }

        // The mean over rules, not the largest: one rule's noisy estimate would otherwise set every rule's blocks
        // (common practice, no source).
        return Math.Max(floor, Math.Min(sum / rows.Length, days));
    }
}
