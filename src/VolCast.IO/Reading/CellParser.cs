using System.Globalization;

namespace VolCast.IO.Reading;

/// <summary>Parses single cells with the invariant culture, turning every failure into an <see cref="InputDataException"/>.</summary>
internal static class CellParser
{
    /// <summary>The earliest date accepted in an input file: 1800-01-01 (older market records are not daily closes).</summary>
    public static readonly DateOnly MinDate = new(1800, 1, 1);

    /// <summary>The latest date accepted in an input file: 9989-12-31, so that a tenor of up to ten years past it is still a calendar date.</summary>
    public static readonly DateOnly MaxDate = new(9989, 12, 31);

    /// <summary>Parses an ISO 8601 calendar date, yyyy-MM-dd, between <see cref="MinDate"/> and <see cref="MaxDate"/>.</summary>
    /// <exception cref="InputDataException">The cell is not such a date, or its year is implausible.</exception>
    public static DateOnly Date(string cell, string file, int line, string column)
    {
        var text = cell.Trim();
        if (DateOnly.TryParseExact(text, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var date))
        {
            if (date < MinDate || date > MaxDate)
            {
                throw new InputDataException(file, line, column, ValueText.Quote(cell) + " is " + (date < MinDate ? "before " : "after ")
                    + ValueText.Date(date < MinDate ? MinDate : MaxDate) + "; expected a date from " + ValueText.Date(MinDate) + " to "
                    + ValueText.Date(MaxDate) + " (is the year mistyped, such as 0024 for 2024?).");
            }

            return date;
        }

        var problem = text.Length == 0
            ? "the date is missing; expected an ISO 8601 date yyyy-MM-dd, such as 2024-03-15."
            : ValueText.Quote(cell) + " is not an ISO 8601 date; expected yyyy-MM-dd, such as 2024-03-15.";
        throw new InputDataException(file, line, column, problem);
    }

    /// <summary>Parses a finite number written with a '.' decimal point and no thousands separators.</summary>
    /// <param name="cell">The cell as read.</param>
    /// <param name="file">The file, for messages.</param>
    /// <param name="line">The physical line, for messages.</param>
    /// <param name="column">The column, for messages.</param>
    /// <param name="expected">What the cell should hold, e.g. "a price above zero, such as 101.25".</param>
    /// <exception cref="InputDataException">The cell is blank, not a number, NaN or infinite.</exception>
    public static double Number(string cell, string file, int line, string column, string expected)
    {
        var text = cell.Trim();
        if (text.Length == 0)
        {
            throw new InputDataException(file, line, column, "the value is missing; expected " + expected + ".");
        }

        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var value))
        {
            throw new InputDataException(file, line, column, ValueText.Quote(cell) + " is not a number; expected " + expected
                + ", written with '.' as the decimal point and no thousands separators.");
        }

        if (!double.IsFinite(value))
        {
            throw new InputDataException(file, line, column, ValueText.Quote(cell) + " is not a finite number; expected " + expected + ".");
        }

        return value;
    }
}
