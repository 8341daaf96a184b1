using System.Globalization;

namespace VolCast.IO.Reading;

/// <summary>Checks on a dated series once its rows have been read: order, gaps between dates, stale stretches.</summary>
internal static class SeriesChecks
{
    /// <summary>Gaps longer than this many calendar days between consecutive dates draw a warning.</summary>
    public const int MaxGapCalendarDays = 10;

    /// <summary>This many identical closes in a row (or more) draw a stale-series warning.</summary>
    public const int StaleRunLength = 5;

    /// <summary>
    /// Sorts the rows by date when they are out of order, warning once with the count of rows that came
    /// before the row above them. The dates must be distinct (duplicates are refused while reading).
    /// </summary>
    /// <returns>The row order to use: null when the file was already sorted, otherwise the sorting permutation.</returns>
    public static int[]? SortIfNeeded(DateOnly[] dates, int[] lines, string file, List<InputWarning> warnings)
    {
        var outOfOrder = 0;
        var firstLine = 0;
        for (var i = 1; i < dates.Length; i++)
        {
            if (dates[i] < dates[i - 1])
            {
                if (outOfOrder == 0)
                {
                    firstLine = lines[i];
                }

                outOfOrder++;
            }
        }

        if (outOfOrder == 0)
        {
            return null;
        }

        var order = new int[dates.Length];
        for (var i = 0; i < order.Length; i++)
        {
            order[i] = i;
        }

        var keys = (DateOnly[])dates.Clone();
        Array.Sort(keys, order);
        warnings.Add(new InputWarning(file, firstLine, string.Create(CultureInfo.InvariantCulture,
            $"the rows are not in date order ({outOfOrder} row(s) dated before the row above them, the first on line {firstLine}); they were sorted by date.")));
        return order;
    }

    /// <summary>Reorders a column by a permutation.</summary>
    public static T[] Permute<T>(T[] values, int[]? order)
    {
        if (order is null)
        {
            return values;
        }

        var result = new T[values.Length];
        for (var i = 0; i < order.Length; i++)
        {
            result[i] = values[order[i]];
        }

        return result;
    }

    /// <summary>Warns once per gap of more than <see cref="MaxGapCalendarDays"/> calendar days between consecutive dates.</summary>
    public static void WarnGaps(ReadOnlySpan<DateOnly> dates, ReadOnlySpan<int> lines, string file, List<InputWarning> warnings)
    {
        for (var i = 1; i < dates.Length; i++)
        {
            var days = dates[i].DayNumber - dates[i - 1].DayNumber;
            if (days > MaxGapCalendarDays)
            {
                warnings.Add(new InputWarning(file, lines[i], string.Create(CultureInfo.InvariantCulture,
                    $"a gap of {days} calendar days between {ValueText.Date(dates[i - 1])} (line {lines[i - 1]}) and {ValueText.Date(dates[i])} (line {lines[i]}); returns across it span more than one trading day.")));
            }
        }
    }

    /// <summary>Warns once per run of <see cref="StaleRunLength"/> or more identical closes in a row.</summary>
    public static void WarnStale(ReadOnlySpan<DateOnly> dates, ReadOnlySpan<double> close, ReadOnlySpan<int> lines, string file, List<InputWarning> warnings)
    {
        var start = 0;
        for (var i = 1; i <= close.Length; i++)
        {
            if (i < close.Length && close[i] == close[start])
            {
                continue;
            }

            var run = i - start;
            if (run >= StaleRunLength)
            {
                warnings.Add(new InputWarning(file, lines[start], string.Create(CultureInfo.InvariantCulture,
                    $"the close stays at {ValueText.Number(close[start])} for {run} rows in a row, {ValueText.Date(dates[start])} (line {lines[start]}) to {ValueText.Date(dates[i - 1])} (line {lines[i - 1]}); a stale or filled-in series understates volatility.")));
            }

            start = i;
        }
    }
}
