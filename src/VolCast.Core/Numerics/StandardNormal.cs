namespace VolCast.Core.Numerics;

/// <summary>Fixed quantiles of the standard normal distribution used across the project.</summary>
public static class StandardNormal
{
    /// <summary>
    /// z = Φ⁻¹(0.975) = 1.959963984540054, the two-sided 95% quantile (Abramowitz and Stegun 1964, Handbook of
    /// Mathematical Functions, Table 26.5, which gives 1.959963985; the full double is R's <c>qnorm(0.975)</c>).
    /// The one 95% constant of the project: coverage intervals, reliability intervals and the report's reference lines.
    /// </summary>
    public const double Z95 = 1.959963984540054;
}
