namespace VolCast.Core.Cone;

/// <summary>The percentiles of annualized volatility drawn at one horizon of a volatility cone (decimals, 0.20 = 20%).</summary>
/// <param name="Min">The smallest window's volatility.</param>
/// <param name="P10">The 10th percentile.</param>
/// <param name="P25">The 25th percentile.</param>
/// <param name="Median">The 50th percentile.</param>
/// <param name="P75">The 75th percentile.</param>
/// <param name="P90">The 90th percentile.</param>
/// <param name="Max">The largest window's volatility.</param>
/// <remarks>Percentiles follow R's type 7 definition (linear interpolation between order statistics).</remarks>
public sealed record ConePercentiles(double Min, double P10, double P25, double Median, double P75, double P90, double Max)
{
    /// <summary>The probability levels in the order of <see cref="ToArray"/>: 0, 0.10, 0.25, 0.50, 0.75, 0.90, 1.</summary>
    public static IReadOnlyList<double> Levels { get; } = [0.0, 0.10, 0.25, 0.50, 0.75, 0.90, 1.0];

    /// <summary>The labels of the levels, in the same order: min, p10, p25, median, p75, p90, max.</summary>
    public static IReadOnlyList<string> Labels { get; } = ["min", "p10", "p25", "median", "p75", "p90", "max"];

    /// <summary>The seven values in the order of <see cref="Levels"/>.</summary>
    /// <returns>A new array: min, p10, p25, median, p75, p90, max.</returns>
    public double[] ToArray() => [Min, P10, P25, Median, P75, P90, Max];

    /// <summary>Every value multiplied by <paramref name="factor"/>.</summary>
    /// <param name="factor">The multiplier.</param>
    /// <returns>The scaled percentiles.</returns>
    public ConePercentiles Scale(double factor) =>
        new(Min * factor, P10 * factor, P25 * factor, Median * factor, P75 * factor, P90 * factor, Max * factor);
}
