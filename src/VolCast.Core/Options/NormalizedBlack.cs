namespace VolCast.Core.Options;

/// <summary>
/// The Black formula in normalized form, and the root finder the implied-volatility solver runs on it.
/// </summary>
/// <remarks>
/// With x = ln(F/K) and total standard deviation s = σ√T, the undiscounted out-of-the-money option value
/// divided by √(FK) is b(x, s) = e^{x/2} N(x/s + s/2) − e^{−x/2} N(x/s − s/2) for x ≤ 0 (a call with K ≥ F),
/// and an out-of-the-money put at x &gt; 0 has the same value as that call at −x. So every option reduces to
/// one increasing function of s on (0, ∞) with values in (0, e^{x/2}) and ∂b/∂s = φ(x/s) e^{−s²/8}.
/// b is convex in s below s_c = √(2|x|) and concave above it. Below s_c the solver runs Newton on ln b
/// (ln b is concave there, and the far wings are exponentially flat in b itself); above s_c it runs Newton
/// on b. Every evaluation tightens a bracket [lo, hi] around the root; a Newton step that leaves the
/// bracket is replaced by bisection (or doubling while hi is still unbounded).
/// </remarks>
internal static class NormalizedBlack
{
    /// <summary>The largest number of price evaluations in one solve.</summary>
    public const int MaxEvaluations = 100;

    /// <summary>The relative size of the last Newton step at which s counts as pinned down.</summary>
    private const double RelativeTolerance = 1e-14;

    /// <summary>The relative size of a Halley step below which the step is taken as the last one.</summary>
    private const double HalleyFinalStep = 1e-7;

    private const double InverseSqrtTwoPi = 0.398942280401432677939946059934;
    private const double LogSqrtTwoPi = 0.918938533204672741780329736406;

    /// <summary>b(x, s) for x ≤ 0 and s &gt; 0; <paramref name="expHalfX"/> is e^{x/2}.</summary>
    public static double Value(double x, double s, double expHalfX)
    {
        var h = x / s;
        var t = 0.5 * s;
        return (expHalfX * StandardNormal.Cdf(h + t)) - (StandardNormal.Cdf(h - t) / expHalfX);
    }

    /// <summary>∂b/∂s = φ(x/s) e^{−s²/8}.</summary>
    public static double Vega(double x, double s)
    {
        var h = x / s;
        var t = 0.5 * s;
        return InverseSqrtTwoPi * Math.Exp(-0.5 * ((h * h) + (t * t)));
    }

    /// <summary>Finds s with b(x, s) = <paramref name="beta"/>.</summary>
    /// <param name="x">−|ln(F/K)|, at or below zero.</param>
    /// <param name="beta">The normalized out-of-the-money value, strictly inside (0, e^{x/2}).</param>
    /// <param name="evaluations">The number of evaluations of b used.</param>
    /// <returns>The total standard deviation s, or null when the iteration limit was reached.</returns>
    public static double? Solve(double x, double beta, out int evaluations)
    {
        var expHalfX = Math.Exp(0.5 * x);
        evaluations = 0;
        var (lowerRegion, lo, hi, s, logBeta) = Start(x, beta, expHalfX);
        while (evaluations < MaxEvaluations)
        {
            var b = Value(x, s, expHalfX);
            evaluations++;
            var vega = Vega(x, s);

            // ∂²b/∂s² = ∂b/∂s · (x²/s³ − s/4), so a Halley step costs no extra transcendental call.
            var curvature = (x * x / (s * s * s)) - (0.25 * s);
            double f, slope, bend;
            if (lowerRegion)
            {
                if (b <= 0)
                {
                    // b underflowed: the root lies above s.
                    lo = s;
                    s = 0.5 * (lo + hi);
                    continue;
                }

                f = Math.Log(b) - logBeta;
                slope = vega / b;
                bend = curvature - slope;
            }
            else
            {
                f = b - beta;
                slope = vega;
                bend = curvature;
            }

            if (f == 0)
            {
                return s;
            }

            if (f < 0)
            {
                lo = s;
            }
            else
            {
                hi = s;
            }

            // bend is f''/f'. Halley's step is the Newton step divided by 1 + (Newton step · bend)/2; the plain
            // Newton step is taken when that factor is not safely positive.
            var newton = -f / slope;
            var factor = 1.0 + (0.5 * newton * bend);
            var halley = factor > 0.5;
            var next = s + (halley ? newton / factor : newton);
            if (!(next > lo && next < hi))
            {
                next = double.IsPositiveInfinity(hi) ? 2.0 * s : 0.5 * (lo + hi);
            }

            // Halley converges cubically: once its step is below 1e-7 of s, the error left after it is far below
            // RelativeTolerance and one more evaluation would not change s.
            var step = Math.Abs(next - s);
            if ((halley && step <= HalleyFinalStep * next) || step <= RelativeTolerance * next || hi - lo <= RelativeTolerance * hi)
            {
                return next;
            }

            s = next;
        }

        return null;
    }

    /// <summary>
    /// The region of the root (below s_c, where Newton runs on ln b, or above it), the bracket that region gives and
    /// the first iterate, moved into the bracket when the guesses fall outside it.
    /// </summary>
    private static (bool LowerRegion, double Lo, double Hi, double S, double LogBeta) Start(double x, double beta, double expHalfX)
    {
        var sc = Math.Sqrt(-2.0 * x);
        var lowerRegion = false;
        double lo, hi, s;
        double bc = 0, vegaC = 0;
        if (sc > 0)
        {
            // At s_c the first argument x/s + s/2 is exactly 0, so b(s_c) = e^{x/2}/2 − e^{−x/2} N(−s_c).
            bc = (0.5 * expHalfX) - (StandardNormal.Cdf(-sc) / expHalfX);
            vegaC = Vega(x, sc);
            lowerRegion = beta < bc;
        }

        var logBeta = 0.0;
        if (lowerRegion)
        {
            lo = 0;
            hi = sc;
            logBeta = Math.Log(beta);

            // One Halley step on ln b from s_c, where b'' = 0 so the step is the Newton step divided by
            // 1 + g/2 (g = ln b_c − ln β); the wing asymptote is better far out. Take the larger.
            var g = Math.Log(bc) - logBeta;
            var fromInflection = sc - (g * bc / vegaC / (1.0 + (0.5 * g)));
            s = Math.Max(LowerGuess(x, logBeta, sc), fromInflection);
        }
        else
        {
            lo = sc;
            hi = double.PositiveInfinity;

            // Above s_c b is concave, so its tangent at s_c lands at or below the root.
            var tangent = sc > 0 ? sc + ((beta - bc) / vegaC) : 0;
            s = Math.Max(UpperGuess(beta, expHalfX), Math.Max(tangent, sc));
        }

        if (!(s > 0 && s >= lo && s <= hi))
        {
            s = double.IsPositiveInfinity(hi) ? Math.Max(2.0 * lo, 1.0) : 0.5 * (lo + hi);
        }

        return (lowerRegion, lo, hi, s, logBeta);
    }

    /// <summary>A start below s_c from the wing asymptote b ≈ φ(x/s) s³/x², solved for s by two fixed-point passes.</summary>
    private static double LowerGuess(double x, double logBeta, double sc)
    {
        var s = 0.5 * sc;
        var logX2 = Math.Log(x * x);
        for (var i = 0; i < 2; i++)
        {
            var r = -logBeta - LogSqrtTwoPi + (3.0 * Math.Log(s)) - logX2;
            if (!(r > 0))
            {
                return 0;
            }

            s = -x / Math.Sqrt(2.0 * r);
        }

        return s > 0 && s < sc ? s : 0;
    }

    /// <summary>A start above s_c from the large-s asymptote e^{x/2} − b ≈ (e^{x/2} + e^{−x/2}) N(−s/2), exact at x = 0.</summary>
    private static double UpperGuess(double beta, double expHalfX)
    {
        var tail = (expHalfX - beta) / (expHalfX + (1.0 / expHalfX));
        return tail > 0 && tail < 0.5 ? -2.0 * StandardNormal.InverseCdf(tail) : 0;
    }
}
