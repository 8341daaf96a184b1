using VolCast.Core.Cone;

namespace VolCast.Core.Tests.Cone;

public sealed class HodgesTompkinsTests
{
    [Theory]
    // docs/methods.md#volatility-cone, m values [D] for (T, h), to the 6 decimals printed there.
    [InlineData(252, 21, 1.096242)]
    [InlineData(504, 21, 1.044673)]
    [InlineData(100, 20, 1.293063)]
    public void VarianceFactor_ReferenceValues_Match(int returns, int horizon, double expected)
    {
        Assert.Equal(expected, HodgesTompkins.VarianceFactor(returns, horizon), 6);
    }

    [Theory]
    // At h = 1 the factor reduces to n / (n − 1) (docs/methods.md#volatility-cone [D]).
    [InlineData(2)]
    [InlineData(252)]
    [InlineData(5000)]
    public void VarianceFactor_HorizonOne_IsBesselsCorrection(int returns)
    {
        Assert.Equal(returns / (returns - 1.0), HodgesTompkins.VarianceFactor(returns, 1), 12);
    }

    [Theory]
    // docs/methods.md#volatility-cone [D]: for i.i.d. unit-variance returns, E[divisor-n variance of the n overlapping h-sums] = h / m.
    // The expectation is worked out here exactly from the covariances Cov(S_i, S_j) = max(0, h − |i − j|),
    // independently of the closed form: E = (1/n)ΣVar(S_i) − Var(mean S) = h − (1/n²)Σ_ij max(0, h − |i − j|).
    [InlineData(252, 21)]
    [InlineData(100, 20)]
    [InlineData(60, 7)]
    public void VarianceFactor_MatchesExactExpectationOfOverlappingSums(int returns, int horizon)
    {
        var n = returns - horizon + 1;
        var covarianceSum = 0.0;
        for (var i = 0; i < n; i++)
        {
            for (var j = 0; j < n; j++)
            {
                covarianceSum += Math.Max(0, horizon - Math.Abs(i - j));
            }
        }

        var expected = horizon - (covarianceSum / ((double)n * n));

        Assert.Equal(expected, horizon / HodgesTompkins.VarianceFactor(returns, horizon), 10);
    }

    [Fact]
    public void VarianceFactor_FewerThanTwoWindows_Throws()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => HodgesTompkins.VarianceFactor(21, 21));
        Assert.Contains("at least 2 windows", ex.Message, StringComparison.Ordinal);
    }
}
