using VolCast.Core.Numerics;

namespace VolCast.Core.Calibration;

/// <summary>
/// Wilson's (1927) score interval for a proportion, with an effective sample size that allows for overlapping
/// h-day windows.
/// </summary>
/// <remarks>
/// <para>
/// Interval: [p̂ + z²/(2n) ± z √(p̂(1 − p̂)/n + z²/(4n²))] / (1 + z²/n), with n the effective sample size.
/// </para>
/// <para>
/// Why n_eff = n / h: the outcome on date t depends on returns t+1 .. t+h, so outcomes on dates j apart share
/// h − j of their h returns. For the h-day return itself the correlation is exactly 1 − j/h; taking the same
/// triangle for the outcome indicator, the variance of a mean of many consecutive outcomes is inflated by
/// 1 + 2 Σ_{j=1}^{h−1} (1 − j/h) = h, which is the same as having n / h independent outcomes. This is on the cautious
/// side twice over: for the sign of a Gaussian sum the indicator's correlation is (2/π)·arcsin(ρ) ≤ ρ, and the dates
/// in one probability bin are usually not all consecutive. It needs no estimate from the data, which matters in thin
/// bins.
/// </para>
/// </remarks>
internal static class WilsonInterval
{
    /// <summary>The Wilson score interval of an observed proportion.</summary>
    /// <param name="proportion">p̂, in [0, 1].</param>
    /// <param name="effectiveCount">n (or n_eff), above zero; it need not be a whole number.</param>
    /// <param name="z">Standard-normal quantile, 1.96 for 95%.</param>
    /// <returns>The lower and upper ends, inside [0, 1].</returns>
    /// <exception cref="ArgumentOutOfRangeException">The proportion is outside [0, 1], or n or z is not above zero.</exception>
    public static (double Lower, double Upper) Compute(double proportion, double effectiveCount, double z = StandardNormal.Z95)
    {
        Preconditions.Probability(proportion);

        Preconditions.Positive(effectiveCount);
        Preconditions.Positive(z);
        var n = effectiveCount;
        var z2 = z * z;
        var denominator = 1 + (z2 / n);
        var centre = (proportion + (z2 / (2 * n))) / denominator;
        var half = z * Math.Sqrt((proportion * (1 - proportion) / n) + (z2 / (4 * n * n))) / denominator;
        return (Math.Max(0, centre - half), Math.Min(1, centre + half));
    }
}
