using VolCast.Core.Scoring;

namespace VolCast.Core.Tests.Scoring;

public class EncompassingRegressionTests
{
    [Fact]
    public void Fit_RFixture_MatchesSandwichAndCoeftest()
    {
        // R fixture (Fixtures/Scoring/make-fixture.R): lm(rv2 ~ iv2 + f2), sandwich 3.0.2 NeweyWest(lag = 4,
        // prewhite = FALSE, adjust = FALSE), lmtest 0.9.40 coeftest (t with T − 3 df); 1e-10 relative.
        var fixture = ScoringFixture.Shared;
        var enc = fixture.Reference.GetProperty("encompassing");
        var result = EncompassingRegression.Fit(fixture.Realized, fixture.Implied, fixture.Forecast, horizonDays: 5);

        var beta = ScoringFixture.Numbers(enc.GetProperty("coefficients"));
        var covariance = ScoringFixture.Numbers(enc.GetProperty("hac_covariance"));
        var t = ScoringFixture.Numbers(enc.GetProperty("t"));
        var p = ScoringFixture.Numbers(enc.GetProperty("p"));
        Approx.Relative(beta[0], result.Intercept, 1e-10);
        Approx.Relative(beta[1], result.ImpliedSlope, 1e-10);
        Approx.Relative(beta[2], result.ForecastSlope, 1e-10);
        for (var i = 0; i < 9; i++)
        {
            Approx.Relative(covariance[i], result.Regression.Covariance[i], 1e-10);
        }

        Approx.Relative(t[1], result.ImpliedT, 1e-10);
        Approx.Relative(t[2], result.ForecastT, 1e-10);
        Approx.Relative(p[1], result.ImpliedPValue, 1e-10);
        Approx.Relative(p[2], result.ForecastPValue, 1e-10);
        Approx.Relative(enc.GetProperty("r_squared").GetDouble(), result.RSquared, 1e-10);
    }

    [Fact]
    public void Fit_ForecastEqualToImplied_ThrowsCollinear()
    {
        double[] rv = [0.1, 0.2, 0.3, 0.25, 0.15];
        double[] iv = [0.12, 0.22, 0.28, 0.2, 0.18];
        Assert.Throws<ArgumentException>(() => EncompassingRegression.Fit(rv, iv, iv, 1));
    }

    [Fact]
    public void Fit_LengthsDiffer_Throws()
    {
        Assert.Throws<ArgumentException>(() => EncompassingRegression.Fit([0.1, 0.2, 0.3, 0.2], [0.1, 0.2, 0.3], [0.1, 0.2, 0.3, 0.2], 1));
    }
}
