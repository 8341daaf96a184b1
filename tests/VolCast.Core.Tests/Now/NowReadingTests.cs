using System.Collections.Immutable;
using VolCast.Core.Backtest;
using VolCast.Core.Data;
using VolCast.Core.Now;
using VolCast.Core.Tests.Forecasters;

namespace VolCast.Core.Tests.Now;

public sealed class NowReadingTests
{
    private static readonly BacktestSettings Settings = new()
    {
        Horizon = BacktestHorizon.Days(5),
        Forecasters = ["close-to-close:21", "ewma:0.94", "har", "implied-debiased:60"],
        SweepLookbacks = [5, 10, 21],
        EwmaLambdas = [0.90, 0.94],
        SelectionWindowDays = 60,
        McsReplications = 50,
        RuleHistorical = "close-to-close:10",
    };

    [Fact]
    public void GapPercentile_WorkedExample_MidRankAmongEarlierDates()
    {
        // Gaps 0.01, 0.03, 0.02, 0.00 on earlier dates and 0.02 today: two below and one equal of four, so
        // 100 × (2 + 0.5) / 4 = 62.5 [D: mid-rank percentile, common practice, no source]. A date without a
        // forecast (null) is not counted.
        ImmutableArray<double?> implied = [0.2, 0.2, 0.2, 0.2, 0.2, 0.2];
        ImmutableArray<double?> forecast = [0.19, 0.17, null, 0.18, 0.20, 0.18];
        var (percentile, earlier) = NowReading.GapPercentile(implied, forecast, 5);
        Assert.Equal(4, earlier);
        Assert.Equal(62.5, percentile);
    }

    [Fact]
    public void GapPercentile_NoGapToday_NoPercentile()
    {
        ImmutableArray<double?> implied = [0.2, 0.2, null];
        ImmutableArray<double?> forecast = [0.19, 0.17, 0.18];
        Assert.Null(NowReading.GapPercentile(implied, forecast, 2).Percentile);
    }

    [Theory]
    [InlineData(200)]
    [InlineData(333)]
    [InlineData(419)]
    public void From_HistoryCutAtTheDate_SameReadingAsTheWholeHistoryEndingThereBitForBit(int k)
    {
        // No data after the last date enters the reading: a run on the history cut at date k reads that date exactly as
        // a run on the whole history whose last forecast date is k.
        var prices = ForecastData.Bars(420, seed: 31);
        var implied = ForecastData.Implied(prices);
        var date = prices.Dates[k];
        var cut = prices.Take(k + 1);
        var fromCut = NowReading.From(Backtester.Run(cut, ForecastData.ImpliedUpTo(implied, date), Settings), cut);
        var fromWhole = NowReading.From(Backtester.Run(prices, implied, Settings with { End = date }), prices);
        AssertSame(fromWhole, fromCut);
        Assert.Equal(date, fromCut.Date);
        Assert.Contains(fromCut.Forecasts, f => f.Percentile is not null);
        Assert.Equal(5, fromCut.Rules.Length);
        Assert.Equal("the rule's trades were not run, so no threshold was chosen", fromCut.Rules[^1].Note);
    }

    [Theory]
    [InlineData(333)]
    [InlineData(419)]
    public void From_WithTrades_HistoryCutAtTheDate_SameWalkForwardThresholdBitForBit(int k)
    {
        // The walk-forward threshold's choice today uses only trades closed by the last date: the run on the history cut
        // there and the run on the whole history ending there (whose trades may use later closes) read it identically.
        var prices = ForecastData.Bars(420, seed: 31);
        var implied = ForecastData.Implied(prices);
        var date = prices.Dates[k];
        var cut = prices.Take(k + 1);
        var settings = Settings with { RuleThreshold = 0.01 };
        var cutResult = Backtester.Run(cut, ForecastData.ImpliedUpTo(implied, date), settings);
        var wholeResult = Backtester.Run(prices, implied, settings with { End = date });
        var cutPnl = Core.Trading.RulePnlEvaluator.Evaluate(cutResult, cut).Report;
        var wholePnl = Core.Trading.RulePnlEvaluator.Evaluate(wholeResult, prices).Report;
        Assert.NotNull(cutPnl);

        var fromCut = NowReading.From(cutResult, cut, cutPnl);
        var fromWhole = NowReading.From(wholeResult, prices, wholePnl);

        AssertSame(fromWhole, fromCut);
        var walk = fromCut.Rules.Single(r => r.Rule == "walk-forward threshold");
        Assert.Equal(settings.RuleForecaster ?? cutResult.Candidate, walk.Forecaster);
        Assert.NotNull(walk.ThresholdVolPoints);
        Assert.Contains(walk.ThresholdVolPoints!.Value / 100, settings.Trading.SweepThresholds);
        Assert.True(cutPnl!.AtClose.WalkForwardToday!.TradesClosed > 0);
        Assert.Equal(BitConverter.DoubleToInt64Bits(cutPnl.AtClose.WalkForwardToday.Threshold), BitConverter.DoubleToInt64Bits(wholePnl!.AtClose.WalkForwardToday!.Threshold));
    }

    [Fact]
    public void From_EarlierCloseAltered_ReadingChanges()
    {
        // The reading does depend on the history before the date: the check above is not vacuous.
        var prices = ForecastData.Bars(300, seed: 12);
        var implied = ForecastData.Implied(prices);
        // The bar of day 297 (inside the last 5-day window) scaled by 5%, open, high, low and close alike.
        static double[] Scaled(ReadOnlySpan<double> values)
        {
            var copy = values.ToArray();
            copy[297] *= 1.05;
            return copy;
        }

        var altered = PriceHistory.FromBars(prices.Dates, Scaled(prices.Open), Scaled(prices.High), Scaled(prices.Low), Scaled(prices.Close));
        var a = NowReading.From(Backtester.Run(prices, implied, Settings), prices);
        var b = NowReading.From(Backtester.Run(altered, implied, Settings), altered);
        Assert.NotEqual(a.RealizedLastWindow, b.RealizedLastWindow);
    }

    [Fact]
    public void From_RealizedLastWindow_EqualsTheLastHReturnsOfTheCloses()
    {
        // RV = √(A/h · Σ r²) over the h returns ending on the last date (the cone's convention, Burghardt and Lane 1990) [D].
        var prices = ForecastData.Bars(260, seed: 2);
        var now = NowReading.From(Backtester.Run(prices, ForecastData.Implied(prices), Settings), prices);
        var close = prices.Close;
        double sum = 0;
        for (var j = close.Length - 5; j < close.Length; j++)
        {
            var r = Math.Log(close[j] / close[j - 1]);
            sum += r * r;
        }

        var expected = Math.Sqrt(252.0 / 5 * sum);
        Assert.Equal(expected, now.RealizedLastWindow!.Value, expected * 1e-10);
        Assert.Equal(close.Length - 5, now.ConeWindows);
        Assert.InRange(now.ConePercentile!.Value, 0, 100);
    }

    private static void AssertSame(NowReading expected, NowReading actual)
    {
        Assert.Equal(expected.Date, actual.Date);
        Assert.Equal(Bits(expected.Implied), Bits(actual.Implied));
        Assert.Equal(Bits(expected.RealizedLastWindow), Bits(actual.RealizedLastWindow));
        Assert.Equal(Bits(expected.ConePercentile), Bits(actual.ConePercentile));
        Assert.Equal(expected.ConeWindows, actual.ConeWindows);
        Assert.Equal(expected.Forecasts.Length, actual.Forecasts.Length);
        foreach (var (e, a) in expected.Forecasts.Zip(actual.Forecasts))
        {
            Assert.Equal(e.Spec, a.Spec);
            Assert.Equal(Bits(e.Forecast), Bits(a.Forecast));
            Assert.Equal(Bits(e.ImpliedMinusForecast), Bits(a.ImpliedMinusForecast));
            Assert.Equal(Bits(e.Percentile), Bits(a.Percentile));
            Assert.Equal(e.EarlierDates, a.EarlierDates);
        }

        Assert.Equal(expected.Rules.ToArray(), actual.Rules.ToArray());
    }

    private static long? Bits(double? value) => value is double v ? BitConverter.DoubleToInt64Bits(v) : null;
}
