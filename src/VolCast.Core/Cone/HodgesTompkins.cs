using System.Globalization;

namespace VolCast.Core.Cone;

/// <summary>
/// The Hodges and Tompkins (2002) correction for variance estimated from overlapping windows.
/// </summary>
/// <remarks>
/// With T daily returns and h-day windows there are n = T − h + 1 overlapping windows. For i.i.d. returns the
/// divisor-n variance of the n overlapping h-day sums has expectation hσ²/m with
/// m = 1 / (1 − h/n + (h² − 1)/(3n²)), so multiplying a divisor-n variance by m removes the downward bias.
/// At h = 1 the factor reduces to n/(n − 1), the usual small-sample correction.
/// </remarks>
internal static class HodgesTompkins
{
    /// <summary>The variance multiplier m for <paramref name="returnCount"/> daily returns and <paramref name="horizonDays"/>-day windows.</summary>
    /// <param name="returnCount">T, the number of daily returns in the sample.</param>
    /// <param name="horizonDays">h, the window length in trading days.</param>
    /// <returns>m, which multiplies a divisor-n variance (n = T − h + 1); always above 1 for n ≥ 2.</returns>
    /// <exception cref="ArgumentOutOfRangeException">
    /// <paramref name="horizonDays"/> is below 1, or there are fewer than two windows (T − h + 1 &lt; 2).
    /// </exception>
    public static double VarianceFactor(int returnCount, int horizonDays)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(horizonDays, 1);
        var n = (double)returnCount - horizonDays + 1;
        if (n < 2)
        {
            throw new ArgumentOutOfRangeException(nameof(returnCount), returnCount, string.Create(CultureInfo.InvariantCulture,
                $"{returnCount} returns give {n} windows of {horizonDays} days; the overlapping-window factor needs at least 2 windows."));
        }

        double h = horizonDays;
        return 1.0 / (1.0 - (h / n) + (((h * h) - 1.0) / (3.0 * n * n)));
    }
}
