namespace VolCast.Core.Cone;

/// <summary>
/// Sample quantiles by the type 7 rule of Hyndman and Fan (1996, "Sample quantiles in statistical packages", The
/// American Statistician 50(4)), the default of R's <c>quantile</c>: linear interpolation between order statistics.
/// The one quantile rule of the project (the cone's percentiles and the report's bands).
/// </summary>
public static class Quantile
{
    /// <summary>
    /// The type 7 quantile of an ascending sample: with g = (n − 1)p and j = ⌊g⌋, x[j] + (g − j)(x[j+1] − x[j]) (zero-based).
    /// </summary>
    /// <param name="sorted">The sample, sorted ascending; not empty.</param>
    /// <param name="probability">p in [0, 1].</param>
    /// <returns>The p-quantile.</returns>
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
