using Microsoft.Data.Analysis;
using VolCast.Core.Data;

namespace VolCast.IO;

/// <summary>DataFrame views of loaded data, for notebook users who explore with Microsoft.Data.Analysis.</summary>
public static class DataFrameViews
{
    /// <summary>Copies a price history into a DataFrame with columns date, open, high, low, close (date, close when close-only).</summary>
    /// <param name="h">The history.</param>
    /// <returns>A new DataFrame; dates are <see cref="DateTime"/> values at midnight.</returns>
    public static DataFrame ToDataFrame(PriceHistory h)
    {
        ArgumentNullException.ThrowIfNull(h);
        var columns = new List<DataFrameColumn> { DateColumn(h.Dates) };
        if (h.HasRange)
        {
            columns.Add(new DoubleDataFrameColumn("open", h.Open.ToArray()));
            columns.Add(new DoubleDataFrameColumn("high", h.High.ToArray()));
            columns.Add(new DoubleDataFrameColumn("low", h.Low.ToArray()));
        }

        columns.Add(new DoubleDataFrameColumn("close", h.Close.ToArray()));
        return new DataFrame(columns);
    }

    /// <summary>Copies an implied-volatility series into a DataFrame with columns date, iv (decimal).</summary>
    /// <param name="series">The series.</param>
    /// <returns>A new DataFrame; dates are <see cref="DateTime"/> values at midnight.</returns>
    public static DataFrame ToDataFrame(ImpliedSeries series)
    {
        ArgumentNullException.ThrowIfNull(series);
        return new DataFrame(DateColumn(series.Dates), new DoubleDataFrameColumn("iv", series.Volatility.ToArray()));
    }

    private static DateTimeDataFrameColumn DateColumn(ReadOnlySpan<DateOnly> dates)
    {
        var values = new DateTime[dates.Length];
        for (var i = 0; i < dates.Length; i++)
        {
            values[i] = dates[i].ToDateTime(TimeOnly.MinValue, DateTimeKind.Unspecified);
        }

        return new DateTimeDataFrameColumn("date", values);
    }
}
