using VolCast.Core.Scoring;

namespace VolCast.Core.Tests.Scoring;

public class HacRegressionTests
{
    // R fixture (Fixtures/Scoring/make-fixture.R): lm(rv2 ~ f2) and sandwich 3.0.2
    // NeweyWest(fit, lag = L, prewhite = FALSE, adjust = FALSE) on R 4.2.2. Agreement asked: 1e-10 relative.
    private const double Tolerance = 1e-10;

    [Theory]
    [InlineData(4, "hac_covariance")]        // lag h − 1 for the fixture's 5-day overlapping targets.
    [InlineData(0, "hac_covariance_lag0")]   // lag 0: White's HC0.
    [InlineData(12, "hac_covariance_lag12")] // a lag longer than the overlap.
    public void Fit_MincerZarnowitzDesign_MatchesRSandwich(int lag, string property)
    {
        var fixture = ScoringFixture.Shared;
        var (y, x) = Design(fixture);
        var fit = HacRegression.Fit(y, x, 2, lag);
        var mz = fixture.Reference.GetProperty("mincer_zarnowitz");

        var beta = ScoringFixture.Numbers(mz.GetProperty("coefficients"));
        var covariance = ScoringFixture.Numbers(mz.GetProperty(property));
        for (var i = 0; i < 2; i++)
        {
            Approx.Relative(beta[i], fit.Coefficients[i], Tolerance);
        }

        for (var i = 0; i < 4; i++)
        {
            // R's vcov is column-major; symmetric, so the order is the same.
            Approx.Relative(covariance[i], fit.Covariance[i], Tolerance);
        }

        Approx.Relative(mz.GetProperty("r_squared").GetDouble(), fit.RSquared, Tolerance);
        Assert.Equal(lag, fit.Lag);
        Assert.Equal(fixture.Realized.Length - 2, fit.ResidualDegreesOfFreedom);
    }

    [Fact]
    public void Fit_ExactLine_RecoversCoefficients()
    {
        // y = 1 + 2x plus a small alternating residual orthogonal to [1, x] (common practice, no source: OLS recovers
        // the line when the residual is orthogonal to the regressors).
        double[] xs = [1, 2, 3, 4];
        double[] noise = [0.1, -0.1, -0.1, 0.1]; // sums to 0 and Σ x·noise = 0.1 − 0.2 − 0.3 + 0.4 = 0
        var y = xs.Select((v, i) => 1 + (2 * v) + noise[i]).ToArray();
        var design = xs.SelectMany(v => new[] { 1.0, v }).ToArray();
        var fit = HacRegression.Fit(y, design, 2, 1);
        Approx.Absolute(1.0, fit.Coefficients[0], 1e-12);
        Approx.Absolute(2.0, fit.Coefficients[1], 1e-12);
    }

    [Fact]
    public void Fit_ConstantRegressor_ThrowsCollinear()
    {
        var design = new double[] { 1, 0.2, 1, 0.2, 1, 0.2, 1, 0.2 };
        var ex = Assert.Throws<ArgumentException>(() => HacRegression.Fit([1, 2, 3, 4], design, 2, 1));
        Assert.Contains("collinear", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Fit_DesignSizeMismatch_Throws()
    {
        Assert.Throws<ArgumentException>(() => HacRegression.Fit([1, 2, 3], [1, 1, 1, 1, 1], 2, 0));
    }

    [Fact]
    public void Wald_RepeatedColumn_Throws()
    {
        var (y, x) = Design(ScoringFixture.Shared);
        var fit = HacRegression.Fit(y, x, 2, 4);
        Assert.Throws<ArgumentException>(() => fit.Wald([1, 1], [0.0, 1.0]));
    }

    [Fact]
    public void Wald_SingleRestriction_IsTSquared()
    {
        // With one restriction the Wald statistic is the squared t statistic (common practice, no source).
        var (y, x) = Design(ScoringFixture.Shared);
        var fit = HacRegression.Fit(y, x, 2, 4);
        var wald = fit.Wald([1], [1.0]);
        Approx.Relative(Math.Pow(fit.TStatistic(1, 1.0), 2), wald.Statistic, 1e-12);
        Assert.Equal(1, wald.DegreesOfFreedom);
    }

    internal static (double[] Y, double[] Design) Design(ScoringFixture fixture)
    {
        var y = fixture.Realized.Select(v => v * v).ToArray();
        var x = fixture.Forecast.SelectMany(v => new[] { 1.0, v * v }).ToArray();
        return (y, x);
    }
}
