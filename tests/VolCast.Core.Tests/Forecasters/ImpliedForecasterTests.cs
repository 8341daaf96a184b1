using VolCast.Core.Data;
using VolCast.Core.Forecasters;

namespace VolCast.Core.Tests.Forecasters;

public sealed class ImpliedForecasterTests
{
    [Fact]
    public void Forecast_QuotedAndMissingDays_QuoteOrNothing()
    {
        var dates = ForecastData.Dates(5);
        var prices = PriceHistory.FromCloses(dates, [100, 101, 102, 101, 100]);
        // Quotes on days 0, 2 and 4, plus one on a date that is not a trading day (Saturday after day 4, a Friday).
        var implied = new ImpliedSeries([dates[0], dates[2], dates[4], dates[4].AddDays(1)], [0.20, 0.22, 0.25, 0.99]);
        var session = new ImpliedForecaster().Start(new ForecastInput(prices, implied, 21));

        Assert.Equal(0.20, session.Forecast(0));
        Assert.Null(session.Forecast(1));
        Assert.Equal(0.22, session.Forecast(2));
        Assert.Null(session.Forecast(3));
        Assert.Equal(0.25, session.Forecast(4));
    }

    [Fact]
    public void Start_NoImpliedSeries_ThrowsSayingWhatIsNeeded()
    {
        var prices = PriceHistory.FromCloses(ForecastData.Dates(3), [100, 101, 102]);
        var ex = Assert.Throws<ArgumentException>(() => new ImpliedForecaster().Start(new ForecastInput(prices, null, 21)));
        Assert.Contains("needs an implied-volatility series", ex.Message, StringComparison.Ordinal);
    }
}
