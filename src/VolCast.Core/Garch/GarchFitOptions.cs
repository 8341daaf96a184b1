namespace VolCast.Core.Garch;

/// <summary>What to fit and how: the variance equation, the mean, and the optimizer's limits.</summary>
/// <remarks>
/// Defaults: plain GARCH(1,1), constant mean estimated, annualization 252 days, the recursion started by backcasting
/// (σ²₀ = ε²₀ = the mean squared residual), at most 200 quasi-Newton steps, converged when every gradient component of
/// the average negative log-likelihood in the optimizer's unconstrained coordinates is below 1e-8 (tight enough to
/// reproduce the published GARCH benchmark to six significant digits; walk-forward refits use 1e-6), standard errors
/// computed.
/// </remarks>
public sealed record GarchFitOptions
{
    /// <summary>Gets the variance equation.</summary>
    public GarchVariant Variant { get; init; } = GarchVariant.Garch;

    /// <summary>Gets a value indicating whether a constant mean μ is estimated (true) or fixed at zero (false).</summary>
    public bool IncludeMean { get; init; } = true;

    /// <summary>Gets the trading days per year used for the long-run annualized volatility.</summary>
    public double AnnualizationFactor { get; init; } = 252;

    /// <summary>Gets the largest number of quasi-Newton steps.</summary>
    public int MaxIterations { get; init; } = 200;

    /// <summary>Gets the gradient tolerance of the convergence test.</summary>
    public double GradientTolerance { get; init; } = 1e-8;

    /// <summary>Gets a value indicating whether Hessian and sandwich standard errors are computed (walk-forward refits skip them).</summary>
    public bool ComputeStandardErrors { get; init; } = true;

    /// <summary>Gets how the variance recursion starts: <see cref="VarianceStart.Backcast"/> (the GARCH benchmark's start) by default.</summary>
    public VarianceStart Start { get; init; } = VarianceStart.Backcast;

    /// <summary>Gets σ²₁ in the units of the returns when <see cref="Start"/> is <see cref="VarianceStart.Fixed"/>.</summary>
    public double FixedStartVariance { get; init; }

    /// <summary>Gets a value indicating whether the first return is left out of the likelihood sum (conditioning on it).</summary>
    internal bool ConditionOnFirstReturn { get; init; }
}
