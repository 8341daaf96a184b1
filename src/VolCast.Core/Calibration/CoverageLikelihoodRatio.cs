using MathNet.Numerics;

namespace VolCast.Core.Calibration;

/// <summary>
/// Kupiec's (1995) proportion-of-failures test and Christoffersen's (1998) independence and conditional-coverage
/// tests of an interval forecast's failure sequence.
/// </summary>
/// <remarks>
/// <para>With n observations, x failures, failure probability p = 1 − coverage and π̂ = x/n:</para>
/// <para>LR_pof = −2 [(n − x) ln(1 − p) + x ln p − (n − x) ln(1 − π̂) − x ln π̂], χ²(1).</para>
/// <para>
/// With transition counts n_ij, π01 = n01/(n00 + n01), π11 = n11/(n10 + n11), π = (n01 + n11)/Σn_ij:
/// LR_ind = −2 [(n00 + n10) ln(1 − π) + (n01 + n11) ln π − n00 ln(1 − π01) − n01 ln π01 − n10 ln(1 − π11) −
/// n11 ln π11], χ²(1).
/// </para>
/// <para>
/// LR_cc = LR_pof + LR_ind, χ²(2): the usual way of writing Christoffersen's joint test, with LR_pof on all n
/// observations and LR_ind on the n − 1 transitions (the first observation's state is taken as given).
/// </para>
/// <para>0 · ln 0 is taken as 0 throughout, so all-failure, no-failure and no-transition-from-failure samples give
/// finite statistics. Statistics below zero by rounding are set to 0.</para>
/// </remarks>
internal static class CoverageLikelihoodRatio
{
    /// <summary>Kupiec's proportion-of-failures test.</summary>
    /// <param name="count">n, at least 1.</param>
    /// <param name="failures">x, 0 to n.</param>
    /// <param name="failureProbability">p = 1 − coverage level, strictly between 0 and 1.</param>
    /// <returns>LR_pof with 1 degree of freedom.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A count or the probability is out of range.</exception>
    public static LikelihoodRatioTest Kupiec(int count, int failures, double failureProbability)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(count, 1);
        ArgumentOutOfRangeException.ThrowIfNegative(failures);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(failures, count);
        Preconditions.Fraction(failureProbability);
        double n = count, x = failures;
        var observed = x / n;
        var restricted = XLogY(n - x, 1 - failureProbability) + XLogY(x, failureProbability);
        var unrestricted = XLogY(n - x, 1 - observed) + XLogY(x, observed);
        return ChiSquare(-2 * (restricted - unrestricted), 1);
    }

    /// <summary>Counts the first-order transitions of a failure sequence (true = failure).</summary>
    /// <param name="failures">The sequence in time order.</param>
    /// <returns>The four transition counts.</returns>
    public static HitTransitions Transitions(ReadOnlySpan<bool> failures)
    {
        int n00 = 0, n01 = 0, n10 = 0, n11 = 0;
        for (var i = 1; i < failures.Length; i++)
        {
            if (failures[i - 1])
            {
                if (failures[i])
                {
                    n11++;
                }
                else
                {
                    n10++;
                }
            }
            else if (failures[i])
            {
                n01++;
            }
            else
            {
                n00++;
            }
        }

        return new HitTransitions(n00, n01, n10, n11);
    }

    /// <summary>Christoffersen's independence test against a first-order Markov alternative.</summary>
    /// <param name="transitions">The transition counts.</param>
    /// <returns>LR_ind with 1 degree of freedom (0 when there are no transitions).</returns>
    public static LikelihoodRatioTest Independence(HitTransitions transitions)
    {
        double n00 = transitions.N00, n01 = transitions.N01, n10 = transitions.N10, n11 = transitions.N11;
        var total = n00 + n01 + n10 + n11;
        if (total == 0)
        {
            return ChiSquare(0, 1);
        }

        var pi = (n01 + n11) / total;
        var pi01 = n00 + n01 > 0 ? n01 / (n00 + n01) : 0;
        var pi11 = n10 + n11 > 0 ? n11 / (n10 + n11) : 0;
        var restricted = XLogY(n00 + n10, 1 - pi) + XLogY(n01 + n11, pi);
        var unrestricted = XLogY(n00, 1 - pi01) + XLogY(n01, pi01) + XLogY(n10, 1 - pi11) + XLogY(n11, pi11);
        return ChiSquare(-2 * (restricted - unrestricted), 1);
    }

    /// <summary>Christoffersen's independence test on a failure sequence (true = failure).</summary>
    /// <param name="failures">The sequence in time order.</param>
    /// <returns>LR_ind with 1 degree of freedom.</returns>
    public static LikelihoodRatioTest Independence(ReadOnlySpan<bool> failures) => Independence(Transitions(failures));

    /// <summary>Christoffersen's conditional-coverage test, LR_cc = LR_pof + LR_ind.</summary>
    /// <param name="kupiec">The proportion-of-failures test.</param>
    /// <param name="independence">The independence test.</param>
    /// <returns>LR_cc with 2 degrees of freedom.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    public static LikelihoodRatioTest ConditionalCoverage(LikelihoodRatioTest kupiec, LikelihoodRatioTest independence)
    {
        ArgumentNullException.ThrowIfNull(kupiec);
        ArgumentNullException.ThrowIfNull(independence);
        return ChiSquare(kupiec.Statistic + independence.Statistic, 2);
    }

    private static double XLogY(double x, double y) => x == 0 ? 0 : x * Math.Log(y);

    private static LikelihoodRatioTest ChiSquare(double statistic, int df)
    {
        var lr = Math.Max(0, statistic);
        return new LikelihoodRatioTest(lr, df, SpecialFunctions.GammaUpperRegularized(df / 2.0, lr / 2.0));
    }
}
