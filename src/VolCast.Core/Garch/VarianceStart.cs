namespace VolCast.Core.Garch;

/// <summary>How the variance recursion is started at the first return of a fit window.</summary>
/// <remarks>
/// With m = (1/n) Σ (rₜ − μ)², the mean of the squared residuals over the window at the μ being tried
/// (docs/methods.md#garch).
/// </remarks>
public enum VarianceStart
{
    /// <summary>
    /// σ²₀ = ε²₀ = m, so σ²₁ = ω + (α + β + γ/2)·m: the day before the window is given the window's mean squared
    /// residual as both its variance and its squared shock. The start of the Fiorentini, Calzolari and Panattoni (1996)
    /// GARCH benchmark and of R's fGarch; the default.
    /// </summary>
    Backcast,

    /// <summary>σ²₁ = m: the first day's variance is the window's mean squared residual (the start used before the benchmark's became the default).</summary>
    SampleVariance,

    /// <summary>σ²₁ = a given value (<see cref="GarchFitOptions.FixedStartVariance"/>), the same for every parameter set; to reproduce a fit whose start is known only as a number.</summary>
    Fixed,
}
