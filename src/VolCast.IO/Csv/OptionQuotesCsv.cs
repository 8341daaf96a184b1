using System.Globalization;
using VolCast.Core.Options;

namespace VolCast.IO.Csv;

/// <summary>Writes option quotes in the format <see cref="Quotes.OptionQuoteCsvReader"/> reads.</summary>
public static class OptionQuotesCsv
{
    /// <summary>Writes <c>date,underlying,expiry,strike,type,price,rate,dividend_yield</c>, one row per quote.</summary>
    /// <param name="writer">Where to write.</param>
    /// <param name="quotes">The quotes.</param>
    public static void Write(TextWriter writer, IReadOnlyList<OptionQuote> quotes)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(quotes);
        writer.Write("date,underlying,expiry,strike,type,price,rate,dividend_yield\n");
        foreach (var q in quotes)
        {
            var type = q.Type == OptionType.Call ? "call" : "put";
            writer.Write(string.Create(CultureInfo.InvariantCulture,
                $"{q.Date:yyyy-MM-dd},{q.Underlying:R},{q.Expiry:yyyy-MM-dd},{q.Strike:R},{type},{q.Price:R},{q.Rate:R},{q.DividendYield:R}\n"));
        }
    }
}
