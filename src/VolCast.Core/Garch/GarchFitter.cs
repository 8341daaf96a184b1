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
/// runs off towards infinity; such an end is reported in <see cref="GarchFit.ParametersOnBound"/>. That approach is
/// slow (the gradient fades along the tail), so walk-forward GJR refits from an estimate on γ = 0 or α = 0 fit those
/// faces directly with the weight exactly zero and test the Kuhn-Tucker condition there (docs/methods.md, GARCH).</para>
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

    // A weight below this during an ascent has reached its face (the tolerance under which a fit reports it on the bound).
    private const double FaceReached = WeightBoundTolerance;

    // Stop the ascent when either α or γ reaches its face.
    private const int AnyWeight = -1;

    /// <summary>Fits a model to daily log returns from a cold start.</summary>
    /// <param name="returns">Daily log returns (decimal or percent; parameters come back in the same units).</param>
    /// <param name="options">What to fit; null for the defaults (GARCH(1,1) with mean).</param>
    /// <returns>The fit and its diagnostics.</returns>
    /// <exception cref="ArgumentException">Fewer than <see cref="MinimumReturns"/> returns, a return that is not finite,
    /// or returns with zero variance (constant prices).</exception>
    public static GarchFit Fit(ReadOnlySpan<double> returns, GarchFitOptions? options = null) =>
        Fit(returns, options ?? new GarchFitOptions(), null, null, null, null, out _);

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
        return Fit(returns, options, start, null, null, null, out _);
    }

    /// <summary>
    /// Fits starting from a previous fit's parameters and optimizer state (a walk-forward refit). A GJR estimate that
    /// ended with γ or α on zero is refitted on the faces γ = 0 and α = 0, each warm-started from its own previous
    /// solution, and a face solution is kept only where the Kuhn-Tucker condition holds; otherwise, and after an
    /// interior estimate, the refit is warm-started from the previous estimate, and when that ends on a constraint or
    /// does not converge the window is also fitted from the cold start; the fit with the higher likelihood is returned
    /// (a converged one before one that did not converge).
    /// </summary>
    /// <remarks>
    /// <para>The GJR likelihood often has two local maxima on short windows, one with γ = 0 and one with α = 0; which
    /// one is higher changes as the window rolls. A chain of warm starts alone stays in whichever it first met, and on
    /// the α = 0 side drifts to β → 1 with α, γ → 0, where the variance no longer reacts to returns.</para>
    /// <para>Faces (an active-set treatment of the weight constraints, Nocedal and Wright 2006, ch. 16): on the face
    /// γ = 0 the GJR likelihood is the GARCH(1,1) likelihood (Glosten, Jagannathan and Runkle 1993), on α = 0 it has
    /// γ and β free; each face is fitted in its own two-weight logistic coordinates, where the held weight is exactly
    /// zero instead of the end of a coordinate running to −∞ with a fading gradient, and the fit keeps its
    /// inverse-Hessian approximation for the next refit. A face solution is a maximum of the whole model only when the
    /// Kuhn-Tucker condition holds there: the log-likelihood's derivative in the held weight (natural coordinates,
    /// per return) is ≤ 0, so that moving into the interior does not raise it (Kuhn and Tucker 1951). A face that fails
    /// it is left by a fit of the whole model started on it; that ascent ends in an interior maximum (a candidate), or
    /// reaches the other face, whose own solution then stands for it. The candidates' likelihoods are compared, so the
    /// higher of the two face maxima wins as the window rolls without a cold fit; when no face passes and no interior
    /// maximum is found, the refit falls back to the warm and cold fits above.</para>
    /// </remarks>
    internal static GarchFit Fit(ReadOnlySpan<double> returns, GarchFitOptions options, GarchFit previous)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(previous);

        var sameShape = previous.Variant == options.Variant && previous.IncludeMean == options.IncludeMean;
        GarchFit? gammaFace = null, alphaFace = null;
        if (sameShape && options.Variant == GarchVariant.GjrGarch && OnWeightFace(previous))
        {
            var (chosen, g, a) = FitOnFaces(returns, options, previous);
            if (chosen is not null)
            {
                return chosen;
            }

            (gammaFace, alphaFace) = (g, a);
        }

        // The optimizer state is only reused from an interior estimate: on a constraint its curvature along the
        // coordinate that ran off is meaningless once the start is moved back inside.
        var reuse = sameShape && previous.ParametersOnBound.Count == 0;
        var warm = Fit(returns, options, previous.Parameters, reuse ? previous.InverseHessian : null, null, null, out _);
        GarchFit best;
        if (warm.Converged && warm.ParametersOnBound.Count == 0)
        {
            best = warm;
        }
        else
        {
            var cold = Fit(returns, options, null, null, null, null, out _);
            best = warm.Converged != cold.Converged
                ? (warm.Converged ? warm : cold)
                : (cold.LogLikelihood > warm.LogLikelihood ? cold : warm);
        }

        return gammaFace is null ? best : best with { GammaFace = gammaFace, AlphaFace = alphaFace };
    }

    private static bool OnWeightFace(GarchFit fit)
    {
        foreach (var name in fit.ParametersOnBound)
        {
            if (name is "alpha" or "gamma")
            {
                return true;
            }
        }

        return false;
    }

    // Fits the faces γ = 0 and α = 0 and returns the best fit that is a maximum of the whole model (null when none is
    // found), with both face fits for the next refit's warm starts.
    private static (GarchFit? Chosen, GarchFit GammaFace, GarchFit AlphaFace) FitOnFaces(ReadOnlySpan<double> returns, GarchFitOptions options, GarchFit previous)
    {
        var gamma = FitFace(returns, options, previous.GammaFace?.Parameters ?? previous.Parameters, previous.GammaFace, GarchLikelihood.Gamma, out var gammaSlope);
        var alpha = FitFace(returns, options, previous.AlphaFace?.Parameters ?? previous.Parameters, previous.AlphaFace, GarchLikelihood.Alpha, out var alphaSlope);
        GarchFit? best = null;

        // Each face can itself have two maxima (β near 1, or well inside), and a warm chain can hold the lower one; the
        // cold start finds the other. It is the cold fit of the fallback below, except that the ascent stops where a
        // weight reaches its face (below the bound tolerance, where the fit would report it on the constraint) and goes
        // on on that face in its exact coordinates (an active-set step) instead of crawling along the vanishing tail.
        var ascent = Fit(returns, options, null, null, null, AnyWeight, out _);
        if (ascent.Message == BfgsMinimizer.StoppedMessage)
        {
            var held = ascent.Parameters.Alpha < ascent.Parameters.Gamma ? GarchLikelihood.Alpha : GarchLikelihood.Gamma;
            var landed = FitFace(returns, options, ascent.Parameters, held == GarchLikelihood.Gamma ? gamma : alpha, held, out var landedSlope);
            if (held == GarchLikelihood.Gamma && Better(landed, gamma))
            {
                (gamma, gammaSlope) = (landed, landedSlope);
            }
            else if (held == GarchLikelihood.Alpha && Better(landed, alpha))
            {
                (alpha, alphaSlope) = (landed, landedSlope);
            }
        }
        else if (ascent.Converged && !OnWeightFace(ascent))
        {
            best = ascent;
        }
        else
        {
            return (null, gamma, alpha);
        }

        // Keeps a candidate that is a maximum of the whole model when its likelihood is the highest so far.
        void Keep(GarchFit candidate)
        {
            if (best is null || candidate.LogLikelihood > best.LogLikelihood)
            {
                best = candidate;
            }
        }

        var gammaPasses = gamma.Converged && gammaSlope <= options.GradientTolerance;
        var alphaPasses = alpha.Converged && alphaSlope <= options.GradientTolerance;
        if (gammaPasses)
        {
            Keep(gamma);
        }

        if (alphaPasses)
        {
            Keep(alpha);
        }

        // The previous estimate's face, when it fails the Kuhn-Tucker test, is left into the interior, as a warm fit
        // from the previous estimate would leave it (the other face is only tracked: failing, it is no maximum). The
        // search stops when the other weight reaches its own face: from there the ascent continues on that face,
        // whose solution is already known.
        foreach (var (face, passes, other, otherFit, otherPasses, was) in new[]
        {
            (gamma, gammaPasses, GarchLikelihood.Alpha, alpha, alphaPasses, "gamma"),
            (alpha, alphaPasses, GarchLikelihood.Gamma, gamma, gammaPasses, "alpha"),
        })
        {
            if (passes || !face.Converged || !previous.ParametersOnBound.Contains(was))
            {
                continue;
            }

            var inside = Fit(returns, options, face.Parameters, null, null, other, out _);
            if (inside.Converged && !OnWeightFace(inside))
            {
                Keep(inside);
            }
            else if (!(inside.Message == BfgsMinimizer.StoppedMessage && otherPasses && inside.LogLikelihood <= otherFit.LogLikelihood))
            {
                return (null, gamma, alpha);
            }
        }

        return (best is null ? null : best with { GammaFace = gamma, AlphaFace = alpha }, gamma, alpha);
    }

    // Whether a converged fit with the higher likelihood (or any converged fit against one that did not converge).
    private static bool Better(GarchFit candidate, GarchFit incumbent) =>
        candidate.Converged != incumbent.Converged ? candidate.Converged : candidate.LogLikelihood > incumbent.LogLikelihood;

    // One face, started from the given parameters with the held weight dropped, with the previous refit's inverse
    // Hessian on that face when its solution had no other weight on a constraint.
    private static GarchFit FitFace(ReadOnlySpan<double> returns, GarchFitOptions options, GarchParameters? start, GarchFit? previousFace, int zeroWeight, out double slope)
    {
        var inverseHessian = previousFace is { ParametersOnBound.Count: 1 } ? previousFace.InverseHessian : null;
        return Fit(returns, options, start, inverseHessian, zeroWeight, null, out slope);
    }

    // The fit itself. zeroWeight (GJR only) holds γ or α at exactly zero (a face) and writes the mean log-likelihood's
    // derivative in it to faceSlope (natural coordinates); stopBelow ends the search once that weight falls under
    // FaceReached (the ascent has reached its face).
    private static GarchFit Fit(
        ReadOnlySpan<double> returns, GarchFitOptions options, GarchParameters? start, double[]? inverseHessian, int? zeroWeight, int? stopBelow, out double faceSlope)
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
        var map = new GarchParameterMap(options.Variant, options.IncludeMean, zeroWeight);
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

        Func<double[], bool>? stop = null;
        if (stopBelow is int watched)
        {
            // A weight below FaceReached joins the active set only when the likelihood still pushes it down there
            // (its derivative in natural coordinates ≤ 0, the sign of a Kuhn-Tucker multiplier); an ascent that dips
            // towards a face and would come back is left to go on.
            var trial = new double[GarchLikelihood.Count];
            var trialGradient = new double[GarchLikelihood.Count];
            stop = point =>
            {
                map.ToNatural(point, trial);
                var weight = watched != AnyWeight ? watched
                    : trial[GarchLikelihood.Alpha] < trial[GarchLikelihood.Gamma] ? GarchLikelihood.Alpha : GarchLikelihood.Gamma;
                if (!(trial[weight] < FaceReached))
                {
                    return false;
                }

                likelihood.Evaluate(trial, trialGradient);
                return trialGradient[weight] >= 0;
            };
        }

        var result = BfgsMinimizer.Minimize(Objective, theta, inverseHessian, options.GradientTolerance, options.MaxIterations, MaxStep, stop);
        map.ToNatural(result.Point, q);
        faceSlope = 0;
        if (zeroWeight is int held)
        {
            likelihood.Evaluate(q, gq);
            faceSlope = -gq[held] / counted;
        }

        var logLikelihood = -(result.Value * counted) - (counted * Math.Log(scale));
        var omega = Math.Max(q[GarchLikelihood.Omega] * scale * scale, double.Epsilon);
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
