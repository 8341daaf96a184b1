using System.Globalization;

namespace VolCast.Core.Garch;

/// <summary>Parameters of a GARCH(1,1) or GJR-GARCH(1,1) model in units of decimal daily log returns.</summary>
/// <remarks>
/// Mean equation rₜ = μ + εₜ; variance equation σ²ₜ = ω + (α + γ·1[εₜ₋₁ &lt; 0]) ε²ₜ₋₁ + β σ²ₜ₋₁, with γ = 0
/// for plain GARCH. Persistence is α + β + γ/2 (a Gaussian shock is negative half the time).
/// Constraints (checked here): ω &gt; 0, α ≥ 0, β ≥ 0, γ ≥ 0, all finite. γ ≥ 0 (rather than only α + γ ≥ 0) is the
/// usual leverage restriction and is what the fitter's parameterization enforces. Stationarity (persistence &lt; 1)
/// is not required to construct parameters; see <see cref="IsStationary"/>.
/// </remarks>
public sealed record GarchParameters
{
    /// <summary>Creates a parameter set.</summary>
    /// <param name="mu">Constant mean μ of the daily log return (0 for a zero-mean model).</param>
    /// <param name="omega">Variance intercept ω, above zero.</param>
    /// <param name="alpha">ARCH weight α, at least zero.</param>
    /// <param name="beta">GARCH weight β, at least zero.</param>
    /// <param name="gamma">Leverage weight γ on negative shocks (0 for plain GARCH), at least zero.</param>
    /// <exception cref="ArgumentOutOfRangeException">A value is not finite or breaks its sign constraint.</exception>
    public GarchParameters(double mu, double omega, double alpha, double beta, double gamma = 0)
    {
        Preconditions.Finite(mu);
        Check(omega > 0 && double.IsFinite(omega), omega, nameof(omega), "a finite number above zero");
        Check(alpha >= 0 && double.IsFinite(alpha), alpha, nameof(alpha), "a finite number at least zero");
        Check(beta >= 0 && double.IsFinite(beta), beta, nameof(beta), "a finite number at least zero");
        Check(gamma >= 0 && double.IsFinite(gamma), gamma, nameof(gamma), "a finite number at least zero");
        Mu = mu;
        Omega = omega;
        Alpha = alpha;
        Beta = beta;
        Gamma = gamma;
    }

    /// <summary>Gets the constant mean μ of the daily log return.</summary>
    public double Mu { get; }

    /// <summary>Gets the variance intercept ω (daily variance units).</summary>
    public double Omega { get; }

    /// <summary>Gets the ARCH weight α.</summary>
    public double Alpha { get; }

    /// <summary>Gets the GARCH weight β.</summary>
    public double Beta { get; }

    /// <summary>Gets the leverage weight γ (0 for plain GARCH).</summary>
    public double Gamma { get; }

    /// <summary>Gets the persistence φ = α + β + γ/2, the decay factor of k-step variance forecasts.</summary>
    public double Persistence => Alpha + Beta + (0.5 * Gamma);

    /// <summary>Gets a value indicating whether the persistence is below one, so a long-run variance exists.</summary>
    public bool IsStationary => Persistence < 1;

    /// <summary>Gets the long-run daily variance V_L = ω / (1 − φ), or null when the model is not stationary.</summary>
    public double? LongRunVariance => IsStationary ? Omega / (1 - Persistence) : null;

    /// <summary>Gets the half-life in trading days of a variance shock, ln 0.5 / ln φ, or null when φ is not in (0, 1).</summary>
    public double? HalfLifeDays => Persistence > 0 && Persistence < 1 ? Math.Log(0.5) / Math.Log(Persistence) : null;

    /// <summary>Returns the conditional variance of the next day given today's variance and residual.</summary>
    /// <param name="variance">σ²ₜ, today's conditional variance.</param>
    /// <param name="residual">εₜ = rₜ − μ, today's residual.</param>
    /// <returns>σ²ₜ₊₁ = ω + (α + γ·1[εₜ &lt; 0]) ε²ₜ + β σ²ₜ.</returns>
    public double NextVariance(double variance, double residual)
    {
        var arch = residual < 0 ? Alpha + Gamma : Alpha;
        return Omega + (arch * residual * residual) + (Beta * variance);
    }

    private static void Check(bool ok, double value, string name, string expected)
    {
        if (!ok)
        {
            throw new ArgumentOutOfRangeException(name, value,
                string.Create(CultureInfo.InvariantCulture, $"{name} must be {expected}, was {value}."));
        }
    }
}
