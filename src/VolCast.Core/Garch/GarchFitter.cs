using System.Globalization;
using VolCast.Core.Numerics;

namespace VolCast.Core.Garch;

/// <summary>Maximum-likelihood fits of GARCH(1,1) and GJR-GARCH(1,1) with a Gaussian quasi-likelihood.</summary>
/// <remarks>
/// <para>Scaling: returns are divided by their sample standard deviation s before fitting, and μ, ω are mapped back
/// (μ = s·μ̃, ω = s²·ω̃; α, β, γ are unit-free), so a fit converges the same way on decimal or percent returns.</para>
/// <para>Constraints by smooth reparameterization, so that an unconstrained BFGS with analytic gradients can be used:
/// ω̃ = exp(θ_ω); persistence φ = logistic(θ_φ) ∈ (0, 1); for GARCH α = φ·s, β = φ·(1 − s) with
/// s = logistic(θ_a); for GJR (α, γ/2, β) = φ·softmax(θ_a, θ_g, 0). This keeps ω &gt; 0, α, β, γ ≥ 0 and
/// α + β + γ/2 &lt; 1 at every trial point. A maximum on a constraint is approached as an unconstrained coordinate
/// runs off towards infinity; such an end is reported in <see cref="GarchFit.ParametersOnBound"/>.</para>
/// <para>Start of the variance recursion (<see cref="GarchFitOptions.Start"/>): by default backcast, σ²₀ = ε²₀ = m with
/// m = (1/n) Σ (rₜ − μ)² at the μ being tried, so σ²₁ = ω + (α + β + γ/2)·m, as in the Fiorentini, Calzolari and
/// Panattoni (1996) benchmark; σ²₁ = m is the alternative. The likelihood sums over all n returns.</para>
/// </remarks>
public static class GarchFitter
{
    /// <summary>The fewest returns a fit accepts.</summary>
    public const int MinimumReturns = 100;

    // An estimate within these of a constraint is reported as on it: in the logistic coordinates the gradient fades
    // as a weight approaches zero, so the optimizer stops near, not at, the bound.
    private const double WeightBoundTolerance = 1e-4;
    private const double PersistenceBoundTolerance = 1e-5;
    private const double MaxStep = 3;

    /// <summary>Fits a model to daily log returns from a cold start.</summary>
    /// <param name="returns">Daily log returns (decimal or percent; parameters come back in the same units).</param>
    /// <param name="options">What to fit; null for the defaults (GARCH(1,1) with mean).</param>
    /// <returns>The fit and its diagnostics.</returns>
    /// <exception cref="ArgumentException">Fewer than <see cref="MinimumReturns"/> returns, a return that is not finite,
    /// or returns with zero variance (constant prices).</exception>
    public static GarchFit Fit(ReadOnlySpan<double> returns, GarchFitOptions? options = null) =>
        Fit(returns, options ?? new GarchFitOptions(), null, null);

    /// <summary>Fits a model starting from given parameters (a warm start), for example the previous window's fit.</summary>
    /// <param name="returns">Daily log returns.</param>
    /// <param name="options">What to fit.</param>
    /// <param name="start">Parameters to start from, in the units of <paramref name="returns"/>.</param>
    /// <returns>The fit and its diagnostics.</returns>
    /// <exception cref="ArgumentException">As for <see cref="Fit(ReadOnlySpan{double}, GarchFitOptions?)"/>.</exception>
    public static GarchFit Fit(ReadOnlySpan<double> returns, GarchFitOptions options, GarchParameters start)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(start);
        return Fit(returns, options, start, null);
    }

    /// <summary>
    /// Fits starting from a previous fit's parameters and optimizer state (a walk-forward refit). When that estimate
    /// ends on a constraint or does not converge, the window is also fitted from the cold start and the fit with the
    /// higher likelihood is returned (a converged one before one that did not converge).
    /// </summary>
    /// <remarks>
    /// The GJR likelihood often has two local maxima on short windows, one with γ = 0 and one with α = 0; which one is
    /// higher changes as the window rolls. A chain of warm starts alone stays in whichever it first met, and on the
    /// α = 0 side drifts to β → 1 with α, γ → 0, where the variance no longer reacts to returns. Both local maxima lie
    /// on a constraint, so a warm estimate that is interior is kept without the extra fit.
    /// </remarks>
    internal static GarchFit Fit(ReadOnlySpan<double> returns, GarchFitOptions options, GarchFit previous)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(previous);

        // The optimizer state is only reused from an interior estimate: on a constraint its curvature along the
        // coordinate that ran off is meaningless once the start is moved back inside.
        var reuse = previous.Variant == options.Variant && previous.IncludeMean == options.IncludeMean && previous.ParametersOnBound.Count == 0;
        var warm = Fit(returns, options, previous.Parameters, reuse ? previous.InverseHessian : null);
        if (warm.Converged && warm.ParametersOnBound.Count == 0)
        {
            return warm;
        }

        var cold = Fit(returns, options, null, null);
        if (warm.Converged != cold.Converged)
        {
            return warm.Converged ? warm : cold;
        }

        return cold.LogLikelihood > warm.LogLikelihood ? cold : warm;
    }

    private static GarchFit Fit(ReadOnlySpan<double> returns, GarchFitOptions options, GarchParameters? start, double[]? inverseHessian)
    {
        ArgumentNullException.ThrowIfNull(options);
        var n = returns.Length;
        if (n < MinimumReturns)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"A GARCH fit needs at least {MinimumReturns} returns, was given {n}."), nameof(returns));
        }

        double sum = 0;
        for (var i = 0; i < n; i++)
        {
            if (!double.IsFinite(returns[i]))
            {
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"returns[{i}] must be finite, was {returns[i]}."), nameof(returns));
            }

            sum += returns[i];
        }

        var mean = sum / n;
        double ss = 0;
        for (var i = 0; i < n; i++)
        {
            var d = returns[i] - mean;
            ss += d * d;
        }

        var scale = Math.Sqrt(ss / n);
        if (!(scale > 0) || scale < 1e-12 * Math.Max(Math.Abs(mean), 1e-300))
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"The returns have zero variance over {n} days (constant prices, or a constant growth rate); a GARCH model cannot be fitted."), nameof(returns));
        }

        var y = new double[n];
        for (var i = 0; i < n; i++)
        {
            y[i] = returns[i] / scale;
        }

        var likelihood = new GarchLikelihood(y, n, options.Start, options.ConditionOnFirstReturn, options.FixedStartVariance / (scale * scale), options.Variant == GarchVariant.GjrGarch);
        var map = new GarchParameterMap(options.Variant, options.IncludeMean);
        var theta = start is null ? map.DefaultStart(mean / scale) : map.ToUnconstrained(start, scale);
        var counted = likelihood.CountedReturns;
        var q = new double[GarchLikelihood.Count];
        var gq = new double[GarchLikelihood.Count];

        double Objective(ReadOnlySpan<double> point, Span<double> gradient)
        {
            map.ToNatural(point, q);
            var value = likelihood.Evaluate(q, gq);
            map.ChainGradient(point, q, gq, gradient);
            for (var i = 0; i < gradient.Length; i++)
            {
                gradient[i] /= counted;
            }

            return value / counted;
        }

        var result = BfgsMinimizer.Minimize(Objective, theta, inverseHessian, options.GradientTolerance, options.MaxIterations, MaxStep);
        map.ToNatural(result.Point, q);
        var logLikelihood = -(result.Value * counted) - (counted * Math.Log(scale));
        var omega = Math.Max(q[GarchLikelihood.Omega], double.Epsilon) * scale * scale;
        var parameters = new GarchParameters(
            q[GarchLikelihood.Mu] * scale, omega, q[GarchLikelihood.Alpha], q[GarchLikelihood.Beta], q[GarchLikelihood.Gamma]);
        var nextVariance = likelihood.NextVariance(q) * scale * scale;

        GarchStandardErrors? hessianErrors = null, robustErrors = null;
        if (options.ComputeStandardErrors)
        {
            (hessianErrors, robustErrors) = StandardErrors(likelihood, map, q, scale);
        }

        return new GarchFit
        {
            Variant = options.Variant,
            IncludeMean = options.IncludeMean,
            Start = options.Start,
            Parameters = parameters,
            ObservationCount = n,
            Converged = result.Converged,
            Iterations = result.Iterations,
            LogLikelihood = logLikelihood,
            LongRunVolatility = parameters.LongRunVariance is double v ? Math.Sqrt(options.AnnualizationFactor * v) : null,
            NextVariance = nextVariance,
            StandardErrors = hessianErrors,
            RobustStandardErrors = robustErrors,
            ParametersOnBound = Bounds(options.Variant, q),
            Message = result.Message,
            InverseHessian = result.InverseHessian,
        };
    }

    private static List<string> Bounds(GarchVariant variant, double[] q)
    {
        var onBound = new List<string>();
        if (q[GarchLikelihood.Alpha] < WeightBoundTolerance)
        {
            onBound.Add("alpha");
        }

        if (q[GarchLikelihood.Beta] < WeightBoundTolerance)
        {
            onBound.Add("beta");
        }

        if (variant == GarchVariant.GjrGarch && q[GarchLikelihood.Gamma] < WeightBoundTolerance)
        {
            onBound.Add("gamma");
        }

        if (q[GarchLikelihood.Alpha] + q[GarchLikelihood.Beta] + (0.5 * q[GarchLikelihood.Gamma]) > 1 - PersistenceBoundTolerance)
        {
            onBound.Add("persistence");
        }

        return onBound;
    }

    private static (GarchStandardErrors? Hessian, GarchStandardErrors? Robust) StandardErrors(
        GarchLikelihood likelihood, GarchParameterMap map, double[] q, double scale)
    {
        var active = map.ActiveNatural;
        var k = active.Length;
        var hessian = new double[k, k];
        var plus = new double[GarchLikelihood.Count];
        var minus = new double[GarchLikelihood.Count];
        var point = new double[GarchLikelihood.Count];
        for (var c = 0; c < k; c++)
        {
            var j = active[c];
            var step = 1e-5 * Math.Max(Math.Abs(q[j]), 1e-2);
            q.CopyTo(point, 0);
            point[j] = q[j] + step;
            likelihood.Evaluate(point, plus);
            point[j] = q[j] - step;
            likelihood.Evaluate(point, minus);
            for (var r = 0; r < k; r++)
            {
                hessian[r, c] = (plus[active[r]] - minus[active[r]]) / (2 * step);
            }
        }

        for (var r = 0; r < k; r++)
        {
            for (var c = r + 1; c < k; c++)
            {
                var avg = 0.5 * (hessian[r, c] + hessian[c, r]);
                hessian[r, c] = avg;
                hessian[c, r] = avg;
            }
        }

        var inverse = SymmetricMatrix.TryInvert(hessian);
        if (inverse is null)
        {
            return (null, null);
        }

        var scores = new double[likelihood.CountedReturns, GarchLikelihood.Count];
        likelihood.Scores(q, scores);
        var opg = new double[k, k];
        for (var t = 0; t < likelihood.CountedReturns; t++)
        {
            for (var r = 0; r < k; r++)
            {
                var sr = scores[t, active[r]];
                for (var c = 0; c < k; c++)
                {
                    opg[r, c] += sr * scores[t, active[c]];
                }
            }
        }

        var robust = new double[k];
        for (var r = 0; r < k; r++)
        {
            double acc = 0;
            for (var a = 0; a < k; a++)
            {
                for (var b = 0; b < k; b++)
                {
                    acc += inverse[r, a] * opg[a, b] * inverse[b, r];
                }
            }

            robust[r] = acc;
        }

        var plain = new double[k];
        for (var r = 0; r < k; r++)
        {
            plain[r] = inverse[r, r];
        }

        return (ToErrors(map, active, plain, scale), ToErrors(map, active, robust, scale));
    }

    private static GarchStandardErrors? ToErrors(GarchParameterMap map, int[] active, double[] variances, double scale)
    {
        var se = new double?[GarchLikelihood.Count];
        for (var r = 0; r < active.Length; r++)
        {
            if (!(variances[r] >= 0) || !double.IsFinite(variances[r]))
            {
                return null;
            }

            var unit = active[r] switch
            {
                GarchLikelihood.Mu => scale,
                GarchLikelihood.Omega => scale * scale,
                _ => 1.0,
            };
            se[active[r]] = Math.Sqrt(variances[r]) * unit;
        }

        return new GarchStandardErrors(
            map.IncludeMean ? se[GarchLikelihood.Mu] : null,
            se[GarchLikelihood.Omega]!.Value,
            se[GarchLikelihood.Alpha]!.Value,
            se[GarchLikelihood.Beta]!.Value,
            map.Variant == GarchVariant.GjrGarch ? se[GarchLikelihood.Gamma] : null);
    }
}
