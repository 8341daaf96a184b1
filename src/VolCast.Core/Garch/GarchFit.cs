namespace VolCast.Core.Garch;

/// <summary>A fitted GARCH(1,1) or GJR-GARCH(1,1) model with its diagnostics, in units of decimal daily log returns.</summary>
/// <remarks>
/// <see cref="LogLikelihood"/> is the full Gaussian log-likelihood −½ Σ [ln 2π + ln σ²ₜ + ε²ₜ / σ²ₜ] of the returns
/// as given (not of the internally scaled ones), so it can be compared with other software's.
/// Standard errors come from the inverse of a numeric Hessian of the analytic gradient (<see cref="StandardErrors"/>)
/// and from the quasi-maximum-likelihood sandwich H⁻¹ J H⁻¹ with J the outer product of per-return scores
/// (<see cref="RobustStandardErrors"/>); both are null when not requested or when the Hessian is not positive definite.
/// </remarks>
public sealed record GarchFit
{
    /// <summary>Gets the variance equation that was fitted.</summary>
    public required GarchVariant Variant { get; init; }

    /// <summary>Gets a value indicating whether μ was estimated (false: fixed at zero).</summary>
    public required bool IncludeMean { get; init; }

    /// <summary>Gets the fitted parameters.</summary>
    public required GarchParameters Parameters { get; init; }

    /// <summary>Gets how the variance recursion was started.</summary>
    public VarianceStart Start { get; init; } = VarianceStart.Backcast;

    /// <summary>Gets the number of returns fitted.</summary>
    public required int ObservationCount { get; init; }

    /// <summary>Gets a value indicating whether the optimizer met its convergence test.</summary>
    public required bool Converged { get; init; }

    /// <summary>Gets the number of quasi-Newton steps taken.</summary>
    public required int Iterations { get; init; }

    /// <summary>Gets the maximized Gaussian log-likelihood, constants included.</summary>
    public required double LogLikelihood { get; init; }

    /// <summary>Gets the persistence α + β + γ/2.</summary>
    public double Persistence => Parameters.Persistence;

    /// <summary>Gets the half-life of a variance shock in trading days, or null when not stationary.</summary>
    public double? HalfLifeDays => Parameters.HalfLifeDays;

    /// <summary>Gets the long-run annualized volatility √(A · ω / (1 − φ)), or null when not stationary.</summary>
    public required double? LongRunVolatility { get; init; }

    /// <summary>Gets the conditional variance of the day after the last fitted return, σ²ₙ₊₁.</summary>
    public required double NextVariance { get; init; }

    /// <summary>Gets the Hessian-based standard errors, or null.</summary>
    public required GarchStandardErrors? StandardErrors { get; init; }

    /// <summary>Gets the robust (sandwich, quasi-maximum-likelihood) standard errors, or null.</summary>
    public required GarchStandardErrors? RobustStandardErrors { get; init; }

    /// <summary>Gets the names of constraints the estimate ended on (alpha, beta, gamma below 1e-4; persistence above 1 − 1e-5); empty when interior.</summary>
    public required IReadOnlyList<string> ParametersOnBound { get; init; }

    /// <summary>Gets the optimizer's reason for stopping.</summary>
    public required string Message { get; init; }

    /// <summary>Gets the optimizer state to warm-start the next fit from.</summary>
    internal double[]? InverseHessian { get; init; }

    /// <summary>Gets the walk-forward refit's solution on the face γ = 0 of GJR, to warm-start the next one from (or null).</summary>
    internal GarchFit? GammaFace { get; init; }

    /// <summary>Gets the walk-forward refit's solution on the face α = 0 of GJR, to warm-start the next one from (or null).</summary>
    internal GarchFit? AlphaFace { get; init; }
}
