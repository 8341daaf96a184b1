namespace VolCast.Core.Garch;

/// <summary>
/// Unconstrained BFGS with an Armijo backtracking line search: small, allocation-light and deterministic, for the
/// handful of parameters of a GARCH likelihood. Constraints are handled by the caller's reparameterization.
/// </summary>
internal static class BfgsMinimizer
{
    /// <summary>Evaluates the objective at a point and writes its gradient.</summary>
    public delegate double Objective(ReadOnlySpan<double> point, Span<double> gradient);

    /// <summary>The message of a search ended by its stop test.</summary>
    public const string StoppedMessage = "The search was stopped by the caller's test.";

    private const double Armijo = 1e-4;
    private const int MaxBacktracks = 40;

    /// <summary>Minimizes <paramref name="objective"/> from <paramref name="start"/>.</summary>
    /// <param name="objective">The function and its gradient.</param>
    /// <param name="start">The starting point (not modified).</param>
    /// <param name="inverseHessian">A starting inverse-Hessian approximation (row-major), or null for a scaled identity.</param>
    /// <param name="gradientTolerance">Converged when every gradient component is below this in absolute value.</param>
    /// <param name="maxIterations">The most accepted steps to take.</param>
    /// <param name="maxStep">The largest change allowed in any coordinate in one step.</param>
    /// <param name="stop">Called with each accepted point; true ends the search there (not converged), or null.</param>
    public static BfgsResult Minimize(
        Objective objective,
        ReadOnlySpan<double> start,
        double[]? inverseHessian,
        double gradientTolerance,
        int maxIterations,
        double maxStep,
        Func<double[], bool>? stop = null)
    {
        var n = start.Length;
        var x = start.ToArray();
        var g = new double[n];
        var fx = objective(x, g);
        if (!double.IsFinite(fx))
        {
            return new BfgsResult(x, fx, g, Identity(n), 0, false, "The objective is not finite at the starting point.");
        }

        var h = inverseHessian is { } warm && warm.Length == n * n ? (double[])warm.Clone() : Identity(n);
        var scaleOnFirstStep = inverseHessian is null;
        var direction = new double[n];
        var xNew = new double[n];
        var gNew = new double[n];
        var s = new double[n];
        var yv = new double[n];
        var hy = new double[n];
        var freshIdentity = inverseHessian is null;

        for (var iteration = 0; iteration < maxIterations; iteration++)
        {
            if (MaxAbs(g) < gradientTolerance)
            {
                return new BfgsResult(x, fx, g, h, iteration, true, "The gradient test was met.");
            }

            var slope = DescentDirection(ref h, g, direction, ref freshIdentity);
            var (accepted, fNew) = LineSearch(objective, x, fx, direction, slope, maxStep, xNew, gNew);
            if (!accepted)
            {
                if (!freshIdentity)
                {
                    h = Identity(n);
                    freshIdentity = true;
                    continue;
                }

                return Stalled(x, fx, g, h, iteration, gradientTolerance);
            }

            if (TryUpdate(h, x, xNew, g, gNew, s, yv, hy, ref scaleOnFirstStep))
            {
                freshIdentity = false;
            }

            (x, xNew) = (xNew, x);
            (g, gNew) = (gNew, g);
            fx = fNew;
            if (stop is not null && MaxAbs(g) >= gradientTolerance && stop(x))
            {
                return new BfgsResult(x, fx, g, h, iteration + 1, false, StoppedMessage);
            }
        }

        var converged = MaxAbs(g) < gradientTolerance;
        return new BfgsResult(x, fx, g, h, maxIterations, converged,
            converged ? "The gradient test was met." : "The iteration limit was reached before the gradient test was met.");
    }

    /// <summary>Writes −H·g into <paramref name="direction"/> and returns its slope; falls back to steepest descent when H lost positive definiteness.</summary>
    private static double DescentDirection(ref double[] h, double[] g, double[] direction, ref bool freshIdentity)
    {
        MultiplyNegated(h, g, direction);
        var slope = Dot(direction, g);
        if (!(slope < 0))
        {
            // The approximation lost positive definiteness: fall back to steepest descent.
            h = Identity(g.Length);
            freshIdentity = true;
            MultiplyNegated(h, g, direction);
            slope = Dot(direction, g);
        }

        return slope;
    }

    /// <summary>Armijo backtracking from the capped full step; the trial point and its gradient are left in <paramref name="xNew"/> and <paramref name="gNew"/>.</summary>
    private static (bool Accepted, double FNew) LineSearch(
        Objective objective, double[] x, double fx, double[] direction, double slope, double maxStep, double[] xNew, double[] gNew)
    {
        var n = x.Length;
        var biggest = MaxAbs(direction);
        var step = biggest > maxStep ? maxStep / biggest : 1.0;
        double fNew = double.NaN;
        for (var k = 0; k < MaxBacktracks; k++)
        {
            for (var i = 0; i < n; i++)
            {
                xNew[i] = x[i] + (step * direction[i]);
            }

            fNew = objective(xNew, gNew);
            if (double.IsFinite(fNew) && fNew <= fx + (Armijo * step * slope))
            {
                return (true, fNew);
            }

            step *= 0.5;
        }

        return (false, fNew);
    }

    private static BfgsResult Stalled(double[] x, double fx, double[] g, double[] h, int iteration, double gradientTolerance)
    {
        var small = MaxAbs(g) < 1e3 * gradientTolerance;
        return new BfgsResult(x, fx, g, h, iteration, small,
            small ? "No further decrease was possible at working precision; the gradient is near zero."
                  : "The line search found no decrease.");
    }

    /// <summary>
    /// The BFGS update of H from the step s = x⁺ − x and y = g⁺ − g, skipped unless the curvature sᵀy is positive; on the
    /// first update from a default start, the identity is first scaled by sᵀy/yᵀy.
    /// </summary>
    private static bool TryUpdate(double[] h, double[] x, double[] xNew, double[] g, double[] gNew, double[] s, double[] yv, double[] hy, ref bool scaleOnFirstStep)
    {
        var n = x.Length;
        double sy = 0, yy = 0;
        for (var i = 0; i < n; i++)
        {
            s[i] = xNew[i] - x[i];
            yv[i] = gNew[i] - g[i];
            sy += s[i] * yv[i];
            yy += yv[i] * yv[i];
        }

        if (!(sy > 1e-300 && yy > 0))
        {
            return false;
        }

        if (scaleOnFirstStep)
        {
            var scale = sy / yy;
            for (var i = 0; i < n; i++)
            {
                h[(i * n) + i] = scale;
            }

            scaleOnFirstStep = false;
        }

        Update(h, s, yv, hy, sy);
        return true;
    }

    private static void Update(double[] h, double[] s, double[] y, double[] hy, double sy)
    {
        // H⁺ = H + ((sᵀy + yᵀHy)/(sᵀy)²) ssᵀ − (Hy sᵀ + s yᵀH)/(sᵀy), H symmetric.
        var n = s.Length;
        double yhy = 0;
        for (var i = 0; i < n; i++)
        {
            double acc = 0;
            for (var j = 0; j < n; j++)
            {
                acc += h[(i * n) + j] * y[j];
            }

            hy[i] = acc;
            yhy += y[i] * acc;
        }

        var a = (sy + yhy) / (sy * sy);
        for (var i = 0; i < n; i++)
        {
            for (var j = 0; j < n; j++)
            {
                h[(i * n) + j] += (a * s[i] * s[j]) - (((hy[i] * s[j]) + (s[i] * hy[j])) / sy);
            }
        }
    }

    private static double[] Identity(int n)
    {
        var h = new double[n * n];
        for (var i = 0; i < n; i++)
        {
            h[(i * n) + i] = 1;
        }

        return h;
    }

    private static void MultiplyNegated(double[] h, double[] g, double[] result)
    {
        var n = g.Length;
        for (var i = 0; i < n; i++)
        {
            double acc = 0;
            for (var j = 0; j < n; j++)
            {
                acc += h[(i * n) + j] * g[j];
            }

            result[i] = -acc;
        }
    }

    private static double Dot(double[] a, double[] b)
    {
        double acc = 0;
        for (var i = 0; i < a.Length; i++)
        {
            acc += a[i] * b[i];
        }

        return acc;
    }

    private static double MaxAbs(double[] a)
    {
        double m = 0;
        for (var i = 0; i < a.Length; i++)
        {
            m = Math.Max(m, Math.Abs(a[i]));
        }

        return m;
    }
}
