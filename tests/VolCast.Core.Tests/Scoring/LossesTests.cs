using FsCheck.Xunit;
using VolCast.Core.Scoring;

namespace VolCast.Core.Tests.Scoring;

public class LossesTests
{
    // docs/methods.md#losses check [D]: proxy variance 0.0004, forecast variance 0.0002 → form A 0.3068528,
    // form B −6.5171932, MSE 4.0e−8. Our inputs are volatilities, so √0.0004 and √0.0002. Tolerance: the 7 decimals printed.
    private static readonly double RealizedVol = Math.Sqrt(0.0004);
    private static readonly double ForecastVol = Math.Sqrt(0.0002);

    [Fact]
    public void Qlike_ReferenceSheetCheck_MatchesFormA()
    {
        // Our normalized QLIKE is form A of docs/methods.md#losses [D].
        Approx.Absolute(0.3068528, Losses.Qlike(RealizedVol, ForecastVol), 5e-8);
    }

    [Fact]
    public void QlikeUnnormalized_ReferenceSheetCheck_MatchesFormB()
    {
        // docs/methods.md#losses form B, ln h + σ̂²/h [D].
        Approx.Absolute(-6.5171932, Losses.QlikeUnnormalized(RealizedVol, ForecastVol), 5e-8);
    }

    [Fact]
    public void SquaredErrorVariance_ReferenceSheetCheck_Matches()
    {
        // docs/methods.md#losses MSE = 4.0e−8 [D].
        Approx.Relative(4.0e-8, Losses.SquaredErrorVariance(RealizedVol, ForecastVol), 1e-12);
    }

    [Fact]
    public void Qlike_ForecastEqualsRealized_IsZero()
    {
        // Form A is 0 at h = σ̂² (docs/methods.md#losses [C2]).
        Assert.Equal(0.0, Losses.Qlike(0.23, 0.23));
    }

    [Property]
    public bool Qlike_AnyPositivePair_IsNotNegative(FsCheck.PositiveInt a, FsCheck.PositiveInt b)
    {
        // Form A is ≥ 0 (docs/methods.md#losses [C2]); x − ln x − 1 ≥ 0 for x > 0.
        return Losses.Qlike(a.Get / 1000.0, b.Get / 1000.0) >= 0;
    }

    [Property]
    public bool QlikeForms_Differential_IsTheSame(FsCheck.PositiveInt r, FsCheck.PositiveInt f1, FsCheck.PositiveInt f2)
    {
        // Forms A and B differ by a term free of the forecast, so differentials agree (docs/methods.md#losses [D]).
        double rv = r.Get / 1000.0, a = f1.Get / 1000.0, b = f2.Get / 1000.0;
        var normalized = Losses.Qlike(rv, a) - Losses.Qlike(rv, b);
        var unnormalized = Losses.QlikeUnnormalized(rv, a) - Losses.QlikeUnnormalized(rv, b);
        return Math.Abs(normalized - unnormalized) <= 1e-9 * (1 + Math.Abs(normalized));
    }

    [Fact]
    public void Summarize_TwoObservations_MatchesHandComputation()
    {
        // Hand evaluation of the definitions (common practice, no source): RV = [0.20, 0.10], F = [0.25, 0.10].
        // bias = 0.05/2; MAE = 0.05/2; RMSE = √(0.0025/2); MSE var = (0.0625 − 0.04)²/2; QLIKE = (0.64 − ln 0.64 − 1)/2.
        var s = Losses.Summarize([0.20, 0.10], [0.25, 0.10]);
        Assert.Equal(2, s.Count);
        Approx.Relative(0.025, s.Bias, 1e-12);
        Approx.Relative(0.025, s.MaeVolatility, 1e-12);
        Approx.Relative(0.03535533905932737, s.RmseVolatility, 1e-12);
        Approx.Relative(0.000253125, s.MseVariance, 1e-12);
        Approx.Relative(0.04314355131420977, s.Qlike, 1e-12);
    }

    [Fact]
    public void Summarize_UnderForecast_HasNegativeBias()
    {
        // Convention: bias is mean F − RV, so forecasting too low is negative.
        Assert.True(Losses.Summarize([0.30, 0.20], [0.20, 0.15]).Bias < 0);
    }

    [Theory]
    [InlineData(LossFunction.SquaredErrorVariance)]
    [InlineData(LossFunction.Qlike)]
    [InlineData(LossFunction.QlikeUnnormalized)]
    [InlineData(LossFunction.AbsoluteErrorVolatility)]
    [InlineData(LossFunction.SquaredErrorVolatility)]
    public void Compute_EachLoss_AgreesWithItsDefinition(LossFunction loss)
    {
        // Each row: the span form must give the definition's value at every observation (definitions in docs/methods.md#losses).
        double[] rv = [0.18, 0.22, 0.30];
        double[] f = [0.20, 0.20, 0.25];
        var values = Losses.Compute(loss, rv, f);
        for (var t = 0; t < rv.Length; t++)
        {
            double x = rv[t] * rv[t] / (f[t] * f[t]), e = f[t] - rv[t];
            var expected = loss switch
            {
                LossFunction.SquaredErrorVariance => Math.Pow((f[t] * f[t]) - (rv[t] * rv[t]), 2),
                LossFunction.Qlike => x - Math.Log(x) - 1,
                LossFunction.QlikeUnnormalized => Math.Log(f[t] * f[t]) + x,
                LossFunction.AbsoluteErrorVolatility => Math.Abs(e),
                _ => e * e,
            };
            Approx.Relative(expected, values[t], 1e-12);
        }
    }

    [Fact]
    public void Compute_ZeroForecast_ThrowsNamingIndexAndValue()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => Losses.Compute(LossFunction.SquaredErrorVariance, [0.2, 0.2], [0.2, 0.0]));
        Assert.Contains("forecast[1]", ex.Message, StringComparison.Ordinal);
        Assert.Contains("was 0", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Compute_NegativeRealized_Throws()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => Losses.Compute(LossFunction.SquaredErrorVariance, [-0.1], [0.2]));
        Assert.Contains("realized[0]", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Compute_ZeroRealizedWithQlike_ThrowsButOtherLossesAccept()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => Losses.Compute(LossFunction.Qlike, [0.0], [0.2]));
        Assert.Equal(Math.Log(0.04), Losses.Compute(LossFunction.QlikeUnnormalized, [0.0], [0.2])[0], 15);
        Assert.Equal(0.0016, Losses.Compute(LossFunction.SquaredErrorVariance, [0.0], [0.2])[0], 15);
    }

    [Fact]
    public void Compute_NaNForecast_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => Losses.Compute(LossFunction.AbsoluteErrorVolatility, [0.2], [double.NaN]));
    }

    [Fact]
    public void Compute_LengthsDiffer_Throws()
    {
        var ex = Assert.Throws<ArgumentException>(() => Losses.Compute(LossFunction.Qlike, [0.2, 0.3], [0.2]));
        Assert.Contains("same length (2), was 1", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Summarize_Empty_Throws()
    {
        Assert.Throws<ArgumentException>(() => Losses.Summarize([], []));
    }
}
