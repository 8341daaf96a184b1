using System.Globalization;

namespace VolCast.Core.Scoring;

/// <summary>
/// Corrections for testing many hypotheses at once (for example one Diebold-Mariano test per name of a universe).
/// </summary>
internal static class FalseDiscoveryRate
{
    /// <summary>
    /// Benjamini-Hochberg (1995) adjusted p-values: rejecting every hypothesis whose adjusted p-value is at most q
    /// controls the false discovery rate at q for independent (or positively dependent) tests.
    /// </summary>
    /// <remarks>
    /// With the p-values sorted ascending, p_(1) ≤ … ≤ p_(m), the adjusted value of p_(i) is
    /// min over j ≥ i of min(1, m · p_(j) / j), returned in the order of the input. Ties keep their input order
    /// (the adjusted values of tied p-values are equal anyway). Same convention as R's
    /// <c>p.adjust(p, method = "BH")</c> on a vector without missing values.
    /// </remarks>
    /// <param name="pValues">The p-values, each in [0, 1].</param>
    /// <returns>The adjusted p-values, aligned with <paramref name="pValues"/>; empty for empty input.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A p-value is NaN or outside [0, 1].</exception>
    public static double[] BenjaminiHochberg(ReadOnlySpan<double> pValues)
    {
        var m = pValues.Length;
        for (var i = 0; i < m; i++)
        {
            var p = pValues[i];
            if (!(p >= 0 && p <= 1))
            {
                throw new ArgumentOutOfRangeException(
                    nameof(pValues),
                    string.Create(CultureInfo.InvariantCulture, $"every p-value must be between 0 and 1 (p-value {i} was {p})."));
            }
        }

        var order = new int[m];
        var sorted = new double[m];
        for (var i = 0; i < m; i++)
        {
            order[i] = i;
            sorted[i] = pValues[i];
        }

        // A stable sort so that ties keep their input order; the adjusted values are the same either way.
        Array.Sort(sorted, order);
        StableTies(sorted, order);
        var adjusted = new double[m];
        var running = 1.0;
        for (var rank = m; rank >= 1; rank--)
        {
            var value = Math.Min(1.0, m * sorted[rank - 1] / rank);
            running = Math.Min(running, value);
            adjusted[order[rank - 1]] = running;
        }

        return adjusted;
    }

    /// <summary>Benjamini-Hochberg adjusted p-values of a list; see <see cref="BenjaminiHochberg(ReadOnlySpan{double})"/>.</summary>
    /// <param name="pValues">The p-values, each in [0, 1].</param>
    /// <returns>The adjusted p-values, aligned with the input.</returns>
    /// <exception cref="ArgumentNullException"><paramref name="pValues"/> is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A p-value is NaN or outside [0, 1].</exception>
    public static double[] BenjaminiHochberg(IReadOnlyList<double> pValues)
    {
        ArgumentNullException.ThrowIfNull(pValues);
        var copy = new double[pValues.Count];
        for (var i = 0; i < copy.Length; i++)
        {
            copy[i] = pValues[i];
        }

        return BenjaminiHochberg(copy.AsSpan());
    }

    private static void StableTies(double[] sorted, int[] order)
    {
        var start = 0;
        while (start < sorted.Length)
        {
            var end = start + 1;
            while (end < sorted.Length && sorted[end] == sorted[start])
            {
                end++;
            }

            if (end - start > 1)
            {
                Array.Sort(order, start, end - start);
            }

            start = end;
        }
    }
}
