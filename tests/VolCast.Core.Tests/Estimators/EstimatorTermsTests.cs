using VolCast.Core.Estimators;

namespace VolCast.Core.Tests.Estimators;

public sealed class EstimatorTermsTests
{
    private static readonly int[] SweepWindows = [5, 10, 15, 21, 42, 63, 126, 252];

    [Fact]
    public void RollingDailyVariance_SweepFromOneTermsObject_MatchesNaiveForEveryWindowAndEstimator()
    {
        var prices = Some.GbmBars(seed: 5, days: 600, overnightVolatility: 0.005);
        var terms = EstimatorTerms.From(prices);
        var buffer = new double[prices.Count];
        foreach (var estimator in Enum.GetValues<Estimator>())
        {
            foreach (var window in SweepWindows)
            {
                var written = terms.RollingAnnualizedVolatility(estimator, window, buffer);

                Assert.Equal(terms.ValueCount(estimator, window), written);
                RollingVolatilityTests.AssertClose(NaiveEstimators.AnnualizedSeries(prices, estimator, window), buffer.AsSpan(0, written), 1e-12, $"{estimator} {window}");
            }
        }
    }

    [Fact]
    public void RollingDailyVariance_SpanAndArrayOverloads_Agree()
    {
        var terms = EstimatorTerms.From(Some.GbmBars(seed: 6, days: 100));
        var span = new double[terms.ValueCount(Estimator.YangZhang, 10)];

        terms.RollingDailyVariance(Estimator.YangZhang, 10, span);

        Assert.Equal(span, terms.RollingDailyVariance(Estimator.YangZhang, 10));
    }

    [Fact]
    public void RollingDailyVariance_DestinationTooShort_Throws()
    {
        var terms = EstimatorTerms.From(Some.GbmBars(seed: 6, days: 100));
        var destination = new double[terms.ValueCount(Estimator.Parkinson, 10) - 1];

        var error = Assert.Throws<ArgumentException>(() => terms.RollingDailyVariance(Estimator.Parkinson, 10, destination));

        Assert.Equal("destination", error.ParamName);
        Assert.Contains("at least 91", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Volatility_CloseOnlyTerms_CloseToCloseWorksAndRangeEstimatorNamesMissingColumns()
    {
        var terms = EstimatorTerms.From(Some.Closes(seed: 8, days: 40));

        Assert.False(terms.HasRange);
        Assert.Equal(20, terms.Volatility(Estimator.CloseToClose, 20).Count);
        var error = Assert.Throws<ArgumentException>(() => terms.Volatility(Estimator.GarmanKlass, 20));
        Assert.Contains("garman-klass", error.Message, StringComparison.Ordinal);
        Assert.Contains("missing columns: open, high, low", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void FirstIndexAndValueCount_ShortHistory_AreConsistent()
    {
        var terms = EstimatorTerms.From(Some.GbmBars(seed: 9, days: 10));

        Assert.Equal(10, EstimatorTerms.FirstIndex(Estimator.YangZhang, 10));
        Assert.Equal(0, terms.ValueCount(Estimator.YangZhang, 10));
        Assert.Equal(1, terms.ValueCount(Estimator.Parkinson, 10));
        Assert.Throws<ArgumentOutOfRangeException>(() => terms.RollingDailyVariance(Estimator.YangZhang, 10));
    }
}
