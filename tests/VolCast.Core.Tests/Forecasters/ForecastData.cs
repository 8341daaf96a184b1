using VolCast.Core.Data;
using VolCast.Core.Garch;
using VolCast.Core.Tests.Garch;

namespace VolCast.Core.Tests.Forecasters;

/// <summary>Seeded invented histories for forecaster tests (not reference data).</summary>
internal static class ForecastData
{
    /// <summary>Business dates from 2010-01-04.</summary>
    public static DateOnly[] Dates(int n) => Weekdays.From(new DateOnly(2010, 1, 4), n);

    /// <summary>OHLC bars whose closes follow a GJR-GARCH path; opens gap from the previous close, highs and lows bracket open and close.</summary>
    public static PriceHistory Bars(int n, int seed)
    {
        var returns = GarchSimulation.Returns(new GarchParameters(0.0002, 3e-6, 0.04, 0.88, 0.1), n - 1, seed);
        var closes = GarchSimulation.Closes(returns);
        var random = new Random(seed + 1000);
        var open = new double[n];
        var high = new double[n];
        var low = new double[n];
        for (var i = 0; i < n; i++)
        {
            open[i] = i == 0 ? closes[0] : closes[i - 1] * Math.Exp(0.002 * Gaussian.Next(random));
            high[i] = Math.Max(open[i], closes[i]) * Math.Exp(0.004 * Math.Abs(Gaussian.Next(random)));
            low[i] = Math.Min(open[i], closes[i]) * Math.Exp(-0.004 * Math.Abs(Gaussian.Next(random)));
        }

        return PriceHistory.FromBars(Dates(n), open, high, low, closes);
    }

    /// <summary>An implied series on most of the history's dates (every seventh missing), plus a quote on each Saturday after a Friday, which no trading day matches.</summary>
    public static ImpliedSeries Implied(PriceHistory prices)
    {
        var dates = new List<DateOnly>();
        var vols = new List<double>();
        for (var i = 0; i < prices.Count; i++)
        {
            var date = prices.Dates[i];
            if (i % 7 != 3)
            {
                dates.Add(date);
                vols.Add(0.15 + (0.0001 * i));
            }

            if (date.DayOfWeek == DayOfWeek.Friday)
            {
                dates.Add(date.AddDays(1));
                vols.Add(0.99);
            }
        }

        return new ImpliedSeries(dates.ToArray(), vols.ToArray());
    }

    /// <summary>The implied series cut to dates up to and including <paramref name="last"/>.</summary>
    public static ImpliedSeries ImpliedUpTo(ImpliedSeries implied, DateOnly last)
    {
        var count = 0;
        while (count < implied.Count && implied.Dates[count] <= last)
        {
            count++;
        }

        return new ImpliedSeries(implied.Dates[..count], implied.Volatility[..count]);
    }
}
