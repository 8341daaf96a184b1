using System.Globalization;

namespace VolCast.IO.Reading;

/// <summary>Parses single cells with the invariant culture, turning every failure into an <see cref="InputDataException"/>.</summary>
internal static class CellParser
{
    /// <summary>Parses an ISO 8601 calendar date, yyyy-MM-dd.</summary>
    /// <exception cref="InputDataException">The cell is not such a date.</exception>
    public static DateOnly Date(string cell, string file, int line, string column)
    {
        var text = cell.Trim();
        if (DateOnly.TryParseExact(text, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var date))
        {
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
