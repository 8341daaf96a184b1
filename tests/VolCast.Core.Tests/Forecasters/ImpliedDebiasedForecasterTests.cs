using VolCast.Core.Data;
using VolCast.Core.Forecasters;

namespace VolCast.Core.Tests.Forecasters;

public sealed class ImpliedDebiasedForecasterTests
{
    private const int Horizon = 5;

    [Fact]
    public void Forecast_EveryDay_EqualsTheFormulaWrittenOutNaively()
    {
        // Christensen & Prabhala (1998) and Poon & Granger (2003): implied is an upward-biased forecast of realized
        // volatility, so it is scaled by √(mean RV²/IV²) over past windows closed by t [D: the formula evaluated directly].
        var prices = ForecastData.Bars(300, seed: 17);
        var implied = ForecastData.Implied(prices);
        const int windows = 30;
        var session = new ImpliedDebiasedForecaster(windows).Start(new ForecastInput(prices, implied, Horizon));
        var iv = ImpliedByDay(prices, implied);
        var made = 0;
        for (var t = 0; t < prices.Count; t++)
        {
            var actual = session.Forecast(t);
            double sum = 0;
            var count = 0;
            for (var s = Math.Max(0, t - Horizon - windows + 1); s <= t - Horizon; s++)
            {
                if (iv[s] is double v)
                {
                    double squares = 0;
                    for (var j = s + 1; j <= s + Horizon; j++)
                    {
                        var r = Math.Log(prices.Close[j] / prices.Close[j - 1]);
                        squares += r * r;
                    }

                    sum += 252.0 / Horizon * squares / (v * v);
                    count++;
                }
            }

            if (iv[t] is not double today || count == 0)
            {
                Assert.Null(actual);
                continue;
            }

            var expected = today * Math.Sqrt(sum / count);
            Assert.NotNull(actual);
            Assert.Equal(expected, actual!.Value, expected * 1e-10);
            made++;
        }

        Assert.True(made > 200, $"only {made} forecasts were compared");
    }

    [Fact]
    public void Forecast_ImpliedEqualToTheRealizedThatFollowed_IsImpliedItself()
    {
        // When every past quote equalled the realized volatility of its window, the ratio is 1 and the forecast is
        // implied unchanged [D].
        var prices = ForecastData.Bars(120, seed: 5);
        var n = prices.Count;
        var rv = new double[n - Horizon];
        for (var s = 0; s < rv.Length; s++)
        {
            double squares = 0;
            for (var j = s + 1; j <= s + Horizon; j++)
            {
                var r = Math.Log(prices.Close[j] / prices.Close[j - 1]);
                squares += r * r;
            }

            rv[s] = Math.Sqrt(252.0 / Horizon * squares);
        }

        var quotes = new double[n];
        for (var t = 0; t < n; t++)
        {
            quotes[t] = t < rv.Length ? rv[t] : 0.2;
        }

        var session = new ImpliedDebiasedForecaster(20).Start(new ForecastInput(prices, new ImpliedSeries(prices.Dates, quotes), Horizon));
        for (var t = 0; t < n; t++)
        {
            if (session.Forecast(t) is double f)
            {
                Assert.Equal(quotes[t], f, quotes[t] * 1e-12);
            }
        }
    }

    [Fact]
    public void Forecast_DataAfterTheForecastDateChanged_ForecastUnchanged()
    {
        // No look-ahead: doubling every close and quote after day t leaves the forecast at t the same, bit for bit.
        var prices = ForecastData.Bars(260, seed: 8);
        var implied = new ImpliedSeries(prices.Dates, Enumerable.Range(0, prices.Count).Select(i => 0.15 + (0.001 * (i % 11))).ToArray());
        const int t = 200;
        var closes = prices.Close.ToArray();
        var quotes = implied.Volatility.ToArray();
        for (var i = t + 1; i < closes.Length; i++)
        {
            closes[i] *= i % 2 == 0 ? 2 : 0.5;
            quotes[i] *= 3;
        }

        var altered = PriceHistory.FromCloses(prices.Dates, closes);
        var original = RunTo(new ImpliedDebiasedForecaster(), prices, implied, t);
        var changed = RunTo(new ImpliedDebiasedForecaster(), altered, new ImpliedSeries(prices.Dates, quotes), t);
        Assert.NotNull(original);
        Assert.Equal(BitConverter.DoubleToInt64Bits(original!.Value), BitConverter.DoubleToInt64Bits(changed!.Value));
    }

    [Fact]
    public void Start_WithoutWindowInSpec_UsesTheRunsSelectionWindow()
    {
        var prices = ForecastData.Bars(200, seed: 3);
        var implied = ForecastData.Implied(prices);
        var fromInput = RunTo(ForecasterSpec.Parse("implied-debiased"), prices, implied, 151, selectionWindow: 40);
        var fromSpec = RunTo(ForecasterSpec.Parse("implied-debiased:40"), prices, implied, 151, selectionWindow: 504);
        var other = RunTo(ForecasterSpec.Parse("implied-debiased:10"), prices, implied, 151, selectionWindow: 504);
        Assert.NotNull(fromInput);
        Assert.Equal(fromSpec, fromInput);
        Assert.NotEqual(other, fromInput);
    }

    [Fact]
    public void Start_NoImpliedSeries_ThrowsSayingWhatIsNeeded()
    {
        var prices = PriceHistory.FromCloses(ForecastData.Dates(3), [100, 101, 102]);
        var ex = Assert.Throws<ArgumentException>(() => new ImpliedDebiasedForecaster().Start(new ForecastInput(prices, null, 21)));
        Assert.Contains("needs an implied-volatility series", ex.Message, StringComparison.Ordinal);
    }

    private static double? RunTo(IVolatilityForecaster forecaster, PriceHistory prices, ImpliedSeries implied, int t, int selectionWindow = 504)
    {
        var session = forecaster.Start(new ForecastInput(prices, implied, Horizon) { SelectionWindowDays = selectionWindow });
        return session.Forecast(t);
    }

    private static double?[] ImpliedByDay(PriceHistory prices, ImpliedSeries implied)
    {
        var byDate = new Dictionary<DateOnly, double>();
        for (var k = 0; k < implied.Count; k++)
        {
            byDate[implied.Dates[k]] = implied.Volatility[k];
        }

        var values = new double?[prices.Count];
        for (var t = 0; t < prices.Count; t++)
        {
            values[t] = byDate.TryGetValue(prices.Dates[t], out var v) ? v : null;
        }

        return values;
    }
}
