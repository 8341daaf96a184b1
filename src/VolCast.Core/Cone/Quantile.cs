namespace VolCast.Core.Cone;

/// <summary>Sample quantiles by R's type 7 rule, the default of R's <c>quantile</c>.</summary>
internal static class Quantile
{
    /// <summary>
    /// The type 7 quantile of an ascending sample: with g = (n − 1)p and j = ⌊g⌋, x[j] + (g − j)(x[j+1] − x[j]) (zero-based).
    /// </summary>
    public static double Type7(ReadOnlySpan<double> sorted, double probability)
    {
        var g = (sorted.Length - 1) * probability;
        var j = (int)Math.Floor(g);
        if (j >= sorted.Length - 1)
        {
            return sorted[^1];
        }

        var fraction = g - j;
        return sorted[j] + (fraction * (sorted[j + 1] - sorted[j]));
    }
}
