namespace VolCast.Core.Tests.Scoring;

/// <summary>Tolerance checks with the tolerance written at the call site.</summary>
internal static class Approx
{
    public static void Relative(double expected, double actual, double tolerance)
    {
        var scale = Math.Max(Math.Abs(expected), 1e-300);
        Assert.True(Math.Abs(actual - expected) <= tolerance * scale,
            FormattableString.Invariant($"expected {expected:R}, was {actual:R} (relative error {Math.Abs(actual - expected) / scale:E2}, allowed {tolerance:E0})"));
    }

    public static void Absolute(double expected, double actual, double tolerance)
    {
        Assert.True(Math.Abs(actual - expected) <= tolerance,
            FormattableString.Invariant($"expected {expected:R}, was {actual:R} (difference {Math.Abs(actual - expected):E2}, allowed {tolerance:E0})"));
    }
}
