using VolCast.Core.Forecasters;

namespace VolCast.Core.Tests.Forecasters;

/// <summary>Properties every forecaster's session must have, checked over all of them.</summary>
public sealed class DailySessionTests
{
    private const int Days = 420;
    private const int Horizon = 5;

    public static TheoryData<string> AllSpecs => ["ewma:0.94", "ewma:0.97", "garch", "garch:zero-mean", "gjr-garch", "har", "har:garman-klass", "implied", "implied-debiased", "implied-debiased:40",
        "close-to-close:21", "parkinson:10", "garman-klass:63", "rogers-satchell:5", "yang-zhang:21", "yang-zhang:252"];

    [Theory]
    [MemberData(nameof(AllSpecs))]
    public void Forecast_FullHistoryVersusTruncated_BitForBitEqual(string spec)
    {
        // No look-ahead: the forecast at t from the full history equals the forecast at t from the history cut at t
        // (prices Take(t + 1), implied quotes up to t's date), bit for bit, for every t.
        var prices = ForecastData.Bars(Days, seed: 21);
        var implied = ForecastData.Implied(prices);
        var forecaster = ForecasterSpec.Parse(spec);
        var full = forecaster.Start(new ForecastInput(prices, implied, Horizon));
        var made = 0;
        for (var t = 0; t < Days; t++)
        {
            var expected = full.Forecast(t);
            var cut = prices.Take(t + 1);
            var truncated = forecaster.Start(new ForecastInput(cut, ForecastData.ImpliedUpTo(implied, cut.Dates[t]), Horizon));
            var actual = truncated.Forecast(t);
            Assert.Equal(expected.HasValue, actual.HasValue);
            if (expected is double e)
            {
                Assert.Equal(BitConverter.DoubleToInt64Bits(e), BitConverter.DoubleToInt64Bits(actual!.Value));
                made++;
            }
        }

        // The check is not vacuous: the forecaster made forecasts over a good part of the history.
        Assert.True(made >= 100, $"{spec} made only {made} forecasts");
    }

    [Theory]
    [MemberData(nameof(AllSpecs))]
    public void Forecast_SkippingDays_SameAsAskingEveryDay(string spec)
    {
        var prices = ForecastData.Bars(Days, seed: 4);
        var implied = ForecastData.Implied(prices);
        var forecaster = ForecasterSpec.Parse(spec);
        var everyDay = forecaster.Start(new ForecastInput(prices, implied, Horizon));
        var sparse = forecaster.Start(new ForecastInput(prices, implied, Horizon));
        for (var t = 0; t < Days; t++)
        {
            var a = everyDay.Forecast(t);
            if (t % 13 == 0)
            {
                Assert.Equal(a, sparse.Forecast(t));
            }
        }
    }

    [Theory]
    [MemberData(nameof(AllSpecs))]
    public void Forecast_ValuesArePositiveAndFinite(string spec)
    {
        var prices = ForecastData.Bars(Days, seed: 9);
        var session = ForecasterSpec.Parse(spec).Start(new ForecastInput(prices, ForecastData.Implied(prices), Horizon));
        for (var t = 0; t < Days; t++)
        {
            if (session.Forecast(t) is double v)
            {
                Assert.True(double.IsFinite(v) && v > 0, $"{spec} at {t}: {v}");
            }
        }
    }

    [Fact]
    public void Forecast_SameDayTwice_Throws()
    {
        var prices = ForecastData.Bars(50, seed: 1);
        var session = ForecasterSpec.Parse("ewma").Start(new ForecastInput(prices, null, 1));
        session.Forecast(30);
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => session.Forecast(30));
        Assert.Contains("after the previous call (30)", ex.Message, StringComparison.Ordinal);
        Assert.Throws<ArgumentOutOfRangeException>(() => session.Forecast(50));
    }
}
