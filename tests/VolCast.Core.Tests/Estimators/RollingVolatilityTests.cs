using VolCast.Core.Data;
using VolCast.Core.Estimators;

namespace VolCast.Core.Tests.Estimators;

/// <summary>Rolling volatility: argument checks, agreement with the naive recomputation, and long-series drift.</summary>
public sealed partial class RollingVolatilityTests
{
    public static TheoryData<Estimator> AllEstimators => [Estimator.CloseToClose, Estimator.Parkinson, Estimator.GarmanKlass, Estimator.RogersSatchell, Estimator.YangZhang];

    public static TheoryData<Estimator> RangeEstimators => [Estimator.Parkinson, Estimator.GarmanKlass, Estimator.RogersSatchell, Estimator.YangZhang];

    [Theory]
    // Close-to-close and Yang-Zhang use the previous close: N + 1 rows; the range estimators use N bars.
    [InlineData(Estimator.CloseToClose, 21, 22)]
    [InlineData(Estimator.Parkinson, 21, 21)]
    [InlineData(Estimator.GarmanKlass, 21, 21)]
    [InlineData(Estimator.RogersSatchell, 21, 21)]
    [InlineData(Estimator.YangZhang, 21, 22)]
    [InlineData(Estimator.YangZhang, 2, 3)]
    public void BarsNeeded_EachEstimator_CountsPreviousCloseWhereUsed(Estimator estimator, int window, int expected)
    {
        Assert.Equal(expected, RollingVolatility.BarsNeeded(estimator, window));
    }

    [Theory]
    [MemberData(nameof(AllEstimators))]
    public void Compute_AnyEstimator_MatchesNaiveRecomputationOnEveryDate(Estimator estimator)
    {
        // Overnight gaps make Yang-Zhang's overnight part non-zero.
        var prices = Some.GbmBars(seed: 11, days: 400, overnightVolatility: 0.004);
        foreach (var window in new[] { 2, 3, 5, 21, 63, 252 })
        {
            var expected = NaiveEstimators.AnnualizedSeries(prices, estimator, window);

            var actual = RollingVolatility.Compute(prices, estimator, window);

            Assert.Equal(RollingVolatility.BarsNeeded(estimator, window) - 1, actual.FirstIndex);
            Assert.Equal(expected.Length, actual.Count);
            AssertClose(expected, actual.AnnualizedVolatility, 1e-12, $"{estimator} window {window}");
        }
    }

    [Fact]
    public void Compute_CloseToCloseZeroMean_MatchesNaiveRecomputationOnEveryDate()
    {
        var prices = Some.GbmBars(seed: 12, days: 300);
        foreach (var window in new[] { 2, 10, 21, 126 })
        {
            var expected = NaiveEstimators.AnnualizedSeries(prices, Estimator.CloseToClose, window, zeroMean: true);

            var actual = RollingVolatility.Compute(prices, Estimator.CloseToClose, window, zeroMean: true);

            AssertClose(expected, actual.AnnualizedVolatility, 1e-12, $"zero-mean window {window}");
        }
    }

    [Theory]
    [MemberData(nameof(AllEstimators))]
    public void Compute_TwentyFiveThousandBars_LastValueMatchesDirectRecomputation(Estimator estimator)
    {
        // A long series with a strong trend and a large price level: an add-and-subtract rolling sum would leave
        // tens of thousands of rounding errors behind; the last window must still match a fresh computation.
        const int days = 25_000;
        var prices = Some.GbmBars(seed: 25, days: days, dailyVolatility: 0.02, stepsPerDay: 8, overnightVolatility: 0.01, startPrice: 1e6);
        foreach (var window in new[] { 5, 21 })
        {
            var direct = Math.Sqrt(252 * NaiveEstimators.DailyVariance(prices, estimator, window, days - 1));

            var series = RollingVolatility.Compute(prices, estimator, window);

            Assert.Equal(days - 1, series.FirstIndex + series.Count - 1);
            Assert.Equal(direct, series.AnnualizedVolatility[^1], Math.Abs(direct) * 1e-12);
        }
    }

    [Fact]
    public void Compute_AnnualizationFactor_ScalesBySquareRoot()
    {
        var prices = Some.GbmBars(seed: 3, days: 100);

        var base252 = RollingVolatility.Compute(prices, Estimator.GarmanKlass, 10);
        var base365 = RollingVolatility.Compute(prices, Estimator.GarmanKlass, 10, annualizationFactor: 365);

        for (var i = 0; i < base252.Count; i++)
        {
            Assert.Equal(base252.AnnualizedVolatility[i] * Math.Sqrt(365.0 / 252.0), base365.AnnualizedVolatility[i], 1e-14);
        }
    }

    [Theory]
    [MemberData(nameof(AllEstimators))]
    public void Compute_WindowBelowTwo_Throws(Estimator estimator)
    {
        var prices = Some.GbmBars(seed: 1, days: 30);

        var error = Assert.Throws<ArgumentOutOfRangeException>(() => RollingVolatility.Compute(prices, estimator, 1));

        Assert.Equal("window", error.ParamName);
        Assert.Contains("at least 2", error.Message, StringComparison.Ordinal);
        Assert.Contains("at least 2 trading days, was 1", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    // Close-to-close needs window + 1 = 31 rows of 30; Parkinson fits 30 but not 31.
    [InlineData(Estimator.CloseToClose, 30)]
    [InlineData(Estimator.Parkinson, 31)]
    [InlineData(Estimator.YangZhang, 252)]
    public void Compute_WindowLongerThanHistory_ThrowsNamingWindowAndRows(Estimator estimator, int window)
    {
        var prices = Some.GbmBars(seed: 1, days: 30);

        var error = Assert.Throws<ArgumentOutOfRangeException>(() => RollingVolatility.Compute(prices, estimator, window));

        Assert.Equal("window", error.ParamName);
        Assert.Contains($"window of {window} trading days", error.Message, StringComparison.Ordinal);
        Assert.Contains("only 30 rows are available", error.Message, StringComparison.Ordinal);
        Assert.Contains(EstimatorNames.Name(estimator), error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Compute_WindowUsingWholeHistory_GivesOneValue()
    {
        var prices = Some.GbmBars(seed: 1, days: 30);

        Assert.Equal(1, RollingVolatility.Compute(prices, Estimator.CloseToClose, 29).Count);
        Assert.Equal(1, RollingVolatility.Compute(prices, Estimator.Parkinson, 30).Count);
    }

    [Theory]
    [MemberData(nameof(RangeEstimators))]
    public void Compute_RangeEstimatorOnCloseOnlyHistory_ThrowsNamingMissingColumnsAndEstimator(Estimator estimator)
    {
        var prices = Some.Closes(seed: 2, days: 50);

        var error = Assert.Throws<ArgumentException>(() => RollingVolatility.Compute(prices, estimator, 10));

        Assert.Contains("open, high, low", error.Message, StringComparison.Ordinal);
        Assert.Contains(EstimatorNames.Name(estimator), error.Message, StringComparison.Ordinal);
        Assert.Equal("prices", error.ParamName);
    }

    [Fact]
    public void Compute_CloseToCloseOnCloseOnlyHistory_MatchesNaive()
    {
        var prices = Some.Closes(seed: 2, days: 50);

        var series = RollingVolatility.Compute(prices, Estimator.CloseToClose, 10);

        AssertClose(NaiveEstimators.AnnualizedSeries(prices, Estimator.CloseToClose, 10), series.AnnualizedVolatility, 1e-12, "close-only");
    }

    [Theory]
    // Zero, negative, NaN and infinite annualization factors are refused.
    [InlineData(0.0)]
    [InlineData(-252.0)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void Compute_BadAnnualizationFactor_Throws(double factor)
    {
        var prices = Some.GbmBars(seed: 1, days: 30);

        var error = Assert.Throws<ArgumentOutOfRangeException>(() => RollingVolatility.Compute(prices, Estimator.Parkinson, 10, factor));

        Assert.Equal("annualizationFactor", error.ParamName);
    }

    [Fact]
    public void Compute_UndefinedEstimator_Throws()
    {
        var prices = Some.GbmBars(seed: 1, days: 30);

        Assert.Throws<ArgumentOutOfRangeException>(() => RollingVolatility.Compute(prices, (Estimator)42, 10));
    }

    [Fact]
    public void Compute_NullPrices_Throws()
    {
        Assert.Throws<ArgumentNullException>(() => RollingVolatility.Compute(null!, Estimator.Parkinson, 10));
    }

    internal static void AssertClose(ReadOnlySpan<double> expected, ReadOnlySpan<double> actual, double relative, string what)
    {
        Assert.Equal(expected.Length, actual.Length);
        for (var i = 0; i < expected.Length; i++)
        {
            var tolerance = Math.Max(Math.Abs(expected[i]) * relative, 1e-300);
            if (Math.Abs(expected[i] - actual[i]) > tolerance)
            {
                Assert.Fail(FormattableString.Invariant($"{what}: element {i} expected {expected[i]:R}, was {actual[i]:R} (relative tolerance {relative})."));
            }
        }
    }
}
