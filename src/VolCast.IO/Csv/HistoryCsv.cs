using System.Globalization;
using VolCast.Core.Data;

namespace VolCast.IO.Csv;

/// <summary>
/// Writes histories and series as CSV in the formats the readers accept: ISO dates, invariant culture,
/// a header row, LF line ends.
/// </summary>
public static class HistoryCsv
{
    /// <summary>Writes a price history: <c>date,open,high,low,close</c>, or <c>date,close</c> when close-only.</summary>
    /// <param name="writer">Where to write.</param>
    /// <param name="prices">The history.</param>
    public static void WritePrices(TextWriter writer, PriceHistory prices)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(prices);
        var dates = prices.Dates;
        var close = prices.Close;
        if (!prices.HasRange)
        {
            writer.Write("date,close\n");
            for (var i = 0; i < prices.Count; i++)
            {
                writer.Write(string.Create(CultureInfo.InvariantCulture, $"{dates[i]:yyyy-MM-dd},{close[i]:R}\n"));
            }

            return;
        }

        var open = prices.Open;
        var high = prices.High;
        var low = prices.Low;
        writer.Write("date,open,high,low,close\n");
        for (var i = 0; i < prices.Count; i++)
        {
            writer.Write(string.Create(CultureInfo.InvariantCulture, $"{dates[i]:yyyy-MM-dd},{open[i]:R},{high[i]:R},{low[i]:R},{close[i]:R}\n"));
        }
    }

    /// <summary>Writes a dated series with round-trip precision: <c>date,NAME</c>.</summary>
    /// <param name="writer">Where to write.</param>
    /// <param name="valueColumn">The header of the value column, such as <c>vol</c> or <c>iv</c>.</param>
    /// <param name="dates">The dates.</param>
    /// <param name="values">One value per date.</param>
    /// <exception cref="ArgumentException">The lengths differ.</exception>
    public static void WriteSeries(TextWriter writer, string valueColumn, ReadOnlySpan<DateOnly> dates, ReadOnlySpan<double> values)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentException.ThrowIfNullOrWhiteSpace(valueColumn);
        if (dates.Length != values.Length)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"values must have one entry per date ({dates.Length}), was {values.Length}."), nameof(values));
        }

        CsvText.WriteHeader(writer, ["date", valueColumn]);
        for (var i = 0; i < dates.Length; i++)
        {
            writer.Write(string.Create(CultureInfo.InvariantCulture, $"{dates[i]:yyyy-MM-dd},{values[i]:R}\n"));
        }
    }
}
