namespace VolCast.Core.Garch;

/// <summary>How the variance recursion is started at the first return of a fit window.</summary>
internal enum VarianceStart
{
    /// <summary>σ²₁ = (1/n) Σ ε²ₜ over the window (the mean of squared residuals at the current μ). The default.</summary>
    SampleVariance,

    /// <summary>σ²₁ = ω + φ · (1/n) Σ ε²ₜ, as if the day before the window had σ² = ε² = the sample variance; used to reproduce a reference package's start.</summary>
    Backcast,

    /// <summary>σ²₁ = a given value, the same for every parameter set; used to reproduce a reference fit whose start is known only as a number.</summary>
    Fixed,
}
