using VolCast.Core.Garch;

namespace VolCast.Core.Tests.Garch;

public sealed class GarchParametersTests
{
    [Fact]
    public void Persistence_Gjr_CountsHalfOfGamma()
    {
        // Glosten, Jagannathan & Runkle (1993) with symmetric shocks: E[1(ε<0)] = ½, so φ = α + β + γ/2 [M, common practice].
        var p = new GarchParameters(0, 2e-6, 0.03, 0.88, 0.1);
        Assert.Equal(0.96, p.Persistence, 15);
        Assert.Equal(2e-6 / 0.04, p.LongRunVariance!.Value, 15);
        Assert.Equal(Math.Log(0.5) / Math.Log(0.96), p.HalfLifeDays!.Value, 12);
    }

    [Fact]
    public void NextVariance_NegativeShock_AddsGamma()
    {
        var p = new GarchParameters(0, 1e-6, 0.05, 0.9, 0.1);
        // Positive shock: 1e-6 + 0.05·0.0004 + 0.9·0.0001 = 0.000111; negative: + 0.1·0.0004 = 0.000151.
        Assert.Equal(0.000111, p.NextVariance(0.0001, 0.02), 15);
        Assert.Equal(0.000151, p.NextVariance(0.0001, -0.02), 15);
    }

    [Fact]
    public void LongRunVariance_NotStationary_IsNull()
    {
        var p = new GarchParameters(0, 1e-6, 0.1, 0.9);
        Assert.False(p.IsStationary);
        Assert.Null(p.LongRunVariance);
        Assert.Null(p.HalfLifeDays);
    }

    [Theory]
    // ω must be above zero.
    [InlineData(0.0, 0.1, 0.8, 0.0, "omega")]
    // α, β, γ at least zero.
    [InlineData(1e-6, -0.01, 0.8, 0.0, "alpha")]
    [InlineData(1e-6, 0.1, -0.1, 0.0, "beta")]
    [InlineData(1e-6, 0.1, 0.8, -0.05, "gamma")]
    // NaN fails.
    [InlineData(double.NaN, 0.1, 0.8, 0.0, "omega")]
    public void Constructor_BrokenConstraint_ThrowsNamingIt(double omega, double alpha, double beta, double gamma, string name)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new GarchParameters(0, omega, alpha, beta, gamma));
        Assert.Equal(name, ex.ParamName);
        Assert.Contains("was", ex.Message, StringComparison.Ordinal);
    }
}
