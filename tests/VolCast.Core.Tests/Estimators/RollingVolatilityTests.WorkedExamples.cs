using VolCast.Core.Data;
using VolCast.Core.Estimators;

namespace VolCast.Core.Tests.Estimators;

/// <summary>Worked examples with published or hand-derived numbers (docs/methods.md#yang-zhang and docs/methods.md#close-to-close-and-annualisation).</summary>
public sealed partial class RollingVolatilityTests
{
    // Hull, Options, Futures, and Other Derivatives 11e, Ex. 15.4 / Table 15.1 [C] (docs/methods.md#close-to-close-and-annualisation).
    private static readonly double[] HullCloses =
    [
        20.00, 20.10, 19.90, 20.00, 20.50, 20.25, 20.90, 20.90, 20.90, 20.75, 20.75,
        21.00, 21.10, 20.90, 20.90, 21.25, 21.40, 21.40, 21.25, 21.75, 22.00,
    ];

    private static PriceHistory HullHistory() => PriceHistory.FromCloses(Some.TradingDates(HullCloses.Length), HullCloses);

    /// <summary>
    /// The 3-bar convention history of docs/methods.md#yang-zhang [D]: row 0 carries only the previous close 99.5 (a flat bar),
    /// rows 1..3 are the three bars; a window of 3 ending at row 3 covers them.
    /// </summary>
    private static PriceHistory ThreeBarHistory() => PriceHistory.FromBars(
        Some.TradingDates(4),
        [99.5, 100.0, 101.5, 100.8],
        [99.5, 102.0, 103.0, 101.9],
        [99.5, 99.0, 100.9, 99.5],
        [99.5, 101.0, 101.2, 100.0]);

    [Fact]
    public void Compute_HullTwentyOneCloses_SampleConventionGivesHullsDailyAndAnnualVolatility()
    {
        var prices = HullHistory();

        var series = RollingVolatility.Compute(prices, Estimator.CloseToClose, 20);

        Assert.Equal(1, series.Count);
        Assert.Equal(20, series.FirstIndex);
        var daily = series.AnnualizedVolatility[0] / Math.Sqrt(252);
        // Hull 11e Ex. 15.4 [C]: s = 0.01216 per day (printed to 4 significant figures), 19.3% a year.
        Assert.Equal(0.01216, daily, 0.000005);
        Assert.Equal(0.193, series.AnnualizedVolatility[0], 0.0005);
    }

    [Fact]
    public void Compute_HullTwentyOneCloses_ZeroMeanConventionGivesDerivedValue()
    {
        var series = RollingVolatility.Compute(HullHistory(), Estimator.CloseToClose, 20, zeroMean: true);

        // docs/methods.md#close-to-close-and-annualisation: zero-mean, divisor n = 20, gives 20.2776% a year [D, printed to 6 significant figures].
        Assert.Equal(0.202776, series.AnnualizedVolatility[0], 0.0000005);
    }

    [Theory]
    // docs/methods.md#yang-zhang convention table [D, formula evaluation printed to 7 significant figures]: daily variance, annualized vol.
    [InlineData(Estimator.Parkinson, 2.264544e-4, 0.238886)]
    [InlineData(Estimator.GarmanKlass, 2.918798e-4, 0.271208)]
    [InlineData(Estimator.RogersSatchell, 3.139018e-4, 0.281253)]
    [InlineData(Estimator.YangZhang, 3.172661e-4, 0.282756)]
    public void RollingDailyVariance_ThreeBarConventionTable_MatchesTable(Estimator estimator, double dailyVariance, double annualized)
    {
        var prices = ThreeBarHistory();

        var variance = EstimatorTerms.From(prices).RollingDailyVariance(estimator, 3);
        var series = RollingVolatility.Compute(prices, estimator, 3);

        var last = variance[^1];
        Assert.Equal(dailyVariance, last, dailyVariance * 5e-7);
        Assert.Equal(annualized, series.AnnualizedVolatility[^1], 0.0000005);
    }

    [Theory]
    // docs/methods.md#yang-zhang [D]: close-to-close demeaned n − 1 = 1.808583e-4 (21.3486%), zero mean /n = 1.233639e-4 (17.6317%).
    [InlineData(false, 1.808583e-4, 0.213486)]
    [InlineData(true, 1.233639e-4, 0.176317)]
    public void RollingDailyVariance_ThreeBarConventionTable_CloseToCloseBothConventions(bool zeroMean, double dailyVariance, double annualized)
    {
        var prices = ThreeBarHistory();

        var variance = EstimatorTerms.From(prices).RollingDailyVariance(Estimator.CloseToClose, 3, zeroMean);
        var series = RollingVolatility.Compute(prices, Estimator.CloseToClose, 3, zeroMean: zeroMean);

        Assert.Single(variance);
        Assert.Equal(dailyVariance, variance[0], dailyVariance * 5e-7);
        Assert.Equal(annualized, series.AnnualizedVolatility[0], 0.0000005);
    }

    [Fact]
    public void RollingYangZhangParts_ThreeBarConventionTable_MatchesOvernightOpenToCloseAndK()
    {
        var terms = EstimatorTerms.From(ThreeBarHistory());
        var overnight = new double[1];
        var openToClose = new double[1];
        var rogersSatchell = new double[1];

        terms.RollingYangZhangParts(3, overnight, openToClose, rogersSatchell);

        // docs/methods.md#yang-zhang [D]: V_O = 2.66176e-5, V_C = 8.5472e-5 (6 and 5 significant figures), k = 0.1017964, RS = 3.139018e-4.
        Assert.Equal(2.66176e-5, overnight[0], 2.66176e-5 * 5e-6);
        Assert.Equal(8.5472e-5, openToClose[0], 8.5472e-5 * 1e-5);
        Assert.Equal(3.139018e-4, rogersSatchell[0], 3.139018e-4 * 5e-7);
        Assert.Equal(0.1017964, RollingVolatility.YangZhangK(3), 0.00000005);
    }

    [Theory]
    // docs/methods.md#yang-zhang k table [D, 6 decimals]: k = 0.34 / (1.34 + (n + 1)/(n − 1)).
    [InlineData(5, 0.119718)]
    [InlineData(10, 0.132697)]
    [InlineData(21, 0.139344)]
    [InlineData(22, 0.139617)]
    [InlineData(63, 0.143323)]
    [InlineData(252, 0.144806)]
    public void YangZhangK_TableWindows_MatchTable(int window, double expected)
    {
        Assert.Equal(expected, RollingVolatility.YangZhangK(window), 0.0000005);
    }

    [Fact]
    public void YangZhangK_VeryLongWindow_ApproachesLimit()
    {
        // docs/methods.md#yang-zhang [D]: k → 0.34 / 2.34 = 0.145299 as n → ∞.
        Assert.Equal(0.145299, RollingVolatility.YangZhangK(10_000_000), 0.0000005);
    }
}
