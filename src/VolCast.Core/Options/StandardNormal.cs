using MathNet.Numerics;

namespace VolCast.Core.Options;

/// <summary>
/// The standard normal density and distribution function at full double precision, including the far tails.
/// </summary>
/// <remarks>
/// N(x) = erfc(−x/√2)/2 through MathNet's complementary error function, which keeps its relative accuracy
/// for large |x|: N(−30) ≈ 4.9e-198 is returned with about 15 correct digits, where 1 − N(30) would be 0.
/// Deep out-of-the-money prices depend on that.
/// </remarks>
internal static class StandardNormal
{
    private const double InverseSqrtTwoPi = 0.398942280401432677939946059934;
    private const double InverseSqrtTwo = 0.707106781186547524400844362105;

    /// <summary>The standard normal distribution function N(x).</summary>
    public static double Cdf(double x) => 0.5 * SpecialFunctions.Erfc(-x * InverseSqrtTwo);

    /// <summary>The standard normal density φ(x).</summary>
    public static double Pdf(double x) => InverseSqrtTwoPi * Math.Exp(-0.5 * x * x);

    /// <summary>The inverse of N, for p in (0, 1).</summary>
    public static double InverseCdf(double p) => -Constants.Sqrt2 * SpecialFunctions.ErfcInv(2.0 * p);
}
