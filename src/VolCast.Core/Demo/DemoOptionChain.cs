using VolCast.Core.Data;
using VolCast.Core.Options;

namespace VolCast.Core.Demo;

/// <summary>
/// Invented option quotes on the demo index, priced from the scenario's own implied volatility, so that
/// <c>volcast implied</c> has a chain to work on and its 30-day result can be compared with the scenario's series.
/// </summary>
/// <remarks>
/// For each of the last <c>days</c> dates with an implied quote: expiries on the third Friday of the next four
/// months (at least 7 days away), strikes every 2.5% from 85% to 115% of spot, calls and puts, rate 3% and
/// dividend yield 1%. Each expiry's at-the-money volatility is the scenario's 30-day implied volatility with a
/// gentle upward term structure (+1 point a year of maturity); the smile skews down to the right by 10 points
/// per unit of log-moneyness. Prices are Black-Scholes-Merton, rounded to cents; quotes under 0.05 are left out.
/// </remarks>
public static class DemoOptionChain
{
    /// <summary>The rate the demo quotes were priced with (continuous, decimal).</summary>
    public const double Rate = 0.03;

    /// <summary>The dividend yield the demo quotes were priced with (continuous, decimal).</summary>
    public const double DividendYield = 0.01;

    /// <summary>Builds the quotes for the last <paramref name="days"/> implied dates of a scenario.</summary>
    /// <param name="index">The index's price history.</param>
    /// <param name="implied">The index's 30-day implied volatility.</param>
    /// <param name="days">How many of the last implied dates to quote, at least 1.</param>
    /// <returns>The quotes, by date, expiry, strike and type.</returns>
    public static IReadOnlyList<OptionQuote> Build(PriceHistory index, ImpliedSeries implied, int days)
    {
        ArgumentNullException.ThrowIfNull(index);
        ArgumentNullException.ThrowIfNull(implied);
        ArgumentOutOfRangeException.ThrowIfLessThan(days, 1);
        var closeByDate = new Dictionary<DateOnly, double>(index.Count);
        for (var i = 0; i < index.Count; i++)
        {
            closeByDate[index.Dates[i]] = index.Close[i];
        }

        var quotes = new List<OptionQuote>();
        for (var i = Math.Max(0, implied.Count - days); i < implied.Count; i++)
        {
            var date = implied.Dates[i];
            if (!closeByDate.TryGetValue(date, out var spot))
            {
                continue;
            }

            foreach (var expiry in Expiries(date))
            {
                var years = DayCount.YearsAct365(date, expiry);
                var atm = implied.Volatility[i] + (0.01 * years);
                var forward = BlackScholesMerton.Forward(spot, years, Rate, DividendYield);
                for (var step = -6; step <= 6; step++)
                {
                    var strike = Math.Round(spot * (1 + (0.025 * step)), 0);
                    var vol = Math.Max(0.05, atm - (0.10 * Math.Log(strike / forward)));
                    foreach (var type in new[] { OptionType.Call, OptionType.Put })
                    {
                        var price = Math.Round(BlackScholesMerton.Price(type, spot, strike, years, vol, Rate, DividendYield), 2);
                        if (price >= 0.05)
                        {
                            quotes.Add(new OptionQuote(date, spot, expiry, strike, type, price, Rate, DividendYield));
                        }
                    }
                }
            }
        }

        return quotes;
    }

    private static IEnumerable<DateOnly> Expiries(DateOnly date)
    {
        var found = 0;
        for (var month = 0; found < 4 && month < 8; month++)
        {
            var first = new DateOnly(date.Year, date.Month, 1).AddMonths(month);
            var offset = ((int)DayOfWeek.Friday - (int)first.DayOfWeek + 7) % 7;
            var thirdFriday = first.AddDays(offset + 14);
            if (thirdFriday.DayNumber - date.DayNumber >= 7)
            {
                found++;
                yield return thirdFriday;
            }
        }
    }
}
