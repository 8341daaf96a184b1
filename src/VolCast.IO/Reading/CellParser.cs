using System.Globalization;
using System.Text.RegularExpressions;

namespace VolCast.IO.Reading;

/// <summary>Parses single cells in a file's declared <see cref="CsvFormat"/>, turning every failure into an <see cref="InputDataException"/>.</summary>
internal static partial class CellParser
{
    /// <summary>The earliest date accepted in an input file: 1800-01-01 (older market records are not daily closes).</summary>
    public static readonly DateOnly MinDate = new(1800, 1, 1);

    /// <summary>The latest date accepted in an input file: 9989-12-31, so that a tenor of up to ten years past it is still a calendar date.</summary>
    public static readonly DateOnly MaxDate = new(9989, 12, 31);

    /// <summary>Cells that mark a missing value, compared case-insensitively after trimming (an empty cell is missing too).</summary>
    public static readonly IReadOnlyList<string> MissingTokens = ["null", "NA", "N/A", "#N/A", "NaN", "-"];

    /// <summary>
    /// Times of day at which a timestamp is read as its date: midnight (a date stored as a timestamp), the end of the day,
    /// and the usual closing times of stock exchanges on the full or half hour from 15:00 to 17:30 (common practice, no source).
    /// </summary>
    public static readonly IReadOnlyList<TimeOnly> DailyTimes =
    [
        new(0, 0), new(15, 0), new(15, 30), new(16, 0), new(16, 30), new(17, 0), new(17, 30), new(23, 59), new(23, 59, 59),
    ];

    private static readonly string[] TimeFormats = ["HH:mm:ss", "HH:mm", "HH:mm:ss.FFFFFFF", "HHmmss", "HHmm"];

    /// <summary>Returns whether a cell is empty or one of <see cref="MissingTokens"/>.</summary>
    public static bool IsMissing(string cell)
    {
        var text = cell.AsSpan().Trim();
        if (text.IsEmpty)
        {
            return true;
        }

        foreach (var token in MissingTokens)
        {
            if (text.Equals(token, StringComparison.OrdinalIgnoreCase))
            {
                return true;
            }
        }

        return false;
    }

    /// <summary>Parses an ISO 8601 calendar date, yyyy-MM-dd, between <see cref="MinDate"/> and <see cref="MaxDate"/>.</summary>
    /// <exception cref="InputDataException">The cell is not such a date, or its year is implausible.</exception>
    public static DateOnly Date(string cell, string file, int line, string column) => Date(cell, file, line, column, CsvFormat.Default);

    /// <summary>
    /// Parses a date in the declared format (ISO 8601 yyyy-MM-dd by default), between <see cref="MinDate"/> and <see cref="MaxDate"/>.
    /// A time part after a space or 'T' (with an optional 'Z' or offset, which is not applied) is accepted when it is one of
    /// <see cref="DailyTimes"/>; the date is then the date as written.
    /// </summary>
    /// <exception cref="InputDataException">The cell is not such a date, has an intraday time, or its year is implausible.</exception>
    public static DateOnly Date(string cell, string file, int line, string column, CsvFormat format)
    {
        ArgumentNullException.ThrowIfNull(format);
        var text = cell.Trim();
        var pattern = format.DateFormatOrIso;
        if (TryDate(text, pattern, out var date) || TryTimestamp(text, pattern, file, line, column, out date))
        {
            if (date < MinDate || date > MaxDate)
            {
                throw new InputDataException(file, line, column, ValueText.Quote(cell) + " is " + (date < MinDate ? "before " : "after ")
                    + ValueText.Date(date < MinDate ? MinDate : MaxDate) + "; expected a date from " + ValueText.Date(MinDate) + " to "
                    + ValueText.Date(MaxDate) + " (is the year mistyped, such as 0024 for 2024?).");
            }

            return date;
        }

        var expected = format.DateFormat is null ? "an ISO 8601 date yyyy-MM-dd, such as 2024-03-15" : "a date written " + pattern + " (--date-format), such as " + new DateOnly(2024, 3, 15).ToString(pattern, CultureInfo.InvariantCulture);
        if (text.Length == 0 || IsMissing(text))
        {
            throw new InputDataException(file, line, column, "the date is missing" + (text.Length == 0 ? string.Empty : " (" + ValueText.Quote(text) + ")") + "; expected " + expected + ".");
        }

        throw new InputDataException(file, line, column, ValueText.Quote(cell) + " is not " + expected + "." + DateHint(text, format));
    }

    /// <summary>Parses a finite number written with a '.' decimal point and no thousands separators.</summary>
    /// <exception cref="InputDataException">The cell is blank, a missing-value mark, not a number, or infinite.</exception>
    public static double Number(string cell, string file, int line, string column, string expected) =>
        Number(cell, file, line, column, expected, CsvFormat.Default);

    /// <summary>Parses a finite number written with the declared decimal separator and no thousands separators.</summary>
    /// <param name="cell">The cell as read.</param>
    /// <param name="file">The file, for messages.</param>
    /// <param name="line">The physical line, for messages.</param>
    /// <param name="column">The column, for messages.</param>
    /// <param name="expected">What the cell should hold, e.g. "a price above zero, such as 101.25".</param>
    /// <param name="format">The file's declared form.</param>
    /// <exception cref="InputDataException">The cell is blank, a missing-value mark (<see cref="MissingTokens"/>), not a number, or infinite.</exception>
    public static double Number(string cell, string file, int line, string column, string expected, CsvFormat format)
    {
        ArgumentNullException.ThrowIfNull(format);
        var text = cell.Trim();
        if (IsMissing(text))
        {
            throw new InputDataException(file, line, column, (text.Length == 0 ? "the value is missing" : ValueText.Quote(text) + " marks a missing value")
                + ", but the column is required on every row; expected " + expected + " (fill the value in, or remove the row).");
        }

        var point = format.DecimalSeparator;
        if (!TryNumber(text, format, out var value))
        {
            var hint = point == '.' && text.Contains(',', StringComparison.Ordinal)
                ? " (for numbers written with a decimal comma, give --decimal ',' and --delimiter ';')"
                : point == ',' && text.Contains('.', StringComparison.Ordinal) ? " (the file was declared with --decimal ','; a '.' decimal point is the default, without --decimal)" : string.Empty;
            throw new InputDataException(file, line, column, ValueText.Quote(cell) + " is not a number; expected " + expected
                + ", written with '" + point + "' as the decimal point and no thousands separators" + hint + ".");
        }

        if (!double.IsFinite(value))
        {
            throw new InputDataException(file, line, column, ValueText.Quote(cell) + " is not a finite number; expected " + expected + ".");
        }

        return value;
    }

    /// <summary>Reads a date (with an optional daily time part) in the declared format without range checks; false when it is not one.</summary>
    /// <exception cref="InputDataException">The cell is a timestamp with an intraday time.</exception>
    public static bool TryDate(string cell, CsvFormat format, string file, int line, string column, out DateOnly date)
    {
        ArgumentNullException.ThrowIfNull(format);
        var text = cell.Trim();
        return TryDate(text, format.DateFormatOrIso, out date) || TryTimestamp(text, format.DateFormatOrIso, file, line, column, out date);
    }

    /// <summary>Reads a number written with the declared decimal separator; false when it is not one (finite or not).</summary>
    public static bool TryNumber(string cell, CsvFormat format, out double value)
    {
        ArgumentNullException.ThrowIfNull(format);
        var text = cell.Trim();
        var other = format.DecimalSeparator == '.' ? ',' : '.';
        value = 0;
        return !text.Contains(other, StringComparison.Ordinal)
            && double.TryParse(format.DecimalSeparator == '.' ? text : text.Replace(',', '.'), NumberStyles.Float, CultureInfo.InvariantCulture, out value);
    }

    private static bool TryDate(string text, string pattern, out DateOnly date) =>
        DateOnly.TryParseExact(text, pattern, CultureInfo.InvariantCulture, DateTimeStyles.None, out date);

    /// <summary>Reads "DATE TIME" or "DATETTIME[Z|±hh:mm]": a date in the pattern, then a time of day that must be a daily one.</summary>
    private static bool TryTimestamp(string text, string pattern, string file, int line, string column, out DateOnly date)
    {
        for (var i = 1; i < text.Length - 1; i++)
        {
            if (text[i] is not (' ' or 'T') || !TryDate(text[..i], pattern, out date))
            {
                continue;
            }

            var time = TimeOfDay().Match(text[(i + 1)..].Trim());
            if (!time.Success || !TimeOnly.TryParseExact(time.Groups["time"].Value, TimeFormats, CultureInfo.InvariantCulture, DateTimeStyles.None, out var t))
            {
                continue;
            }

            foreach (var daily in DailyTimes)
            {
                if (t == daily)
                {
                    return true;
                }
            }

            throw new InputDataException(file, line, column, ValueText.Quote(text) + " has the time of day " + t.ToString("HH:mm:ss", CultureInfo.InvariantCulture)
                + "; a timestamp is read as its date only at midnight, at a usual close (15:00, 15:30, 16:00, 16:30, 17:00 or 17:30) or at 23:59(:59). An intraday time means the rows are not daily closes: export daily bars, or write the date alone.");
        }

        date = default;
        return false;
    }

    /// <summary>Suggests the option that would read a date written another way.</summary>
    private static string DateHint(string text, CsvFormat format)
    {
        if (format.DateFormat is not null)
        {
            return " Check --date-format against the file.";
        }

        var slash = SlashDate().Match(text);
        if (slash.Success)
        {
            var first = int.Parse(slash.Groups["first"].Value, CultureInfo.InvariantCulture);
            var second = int.Parse(slash.Groups["second"].Value, CultureInfo.InvariantCulture);
            var sep = slash.Groups["sep"].Value;
            var pattern = first > 12 ? $"dd{sep}MM{sep}yyyy" : second > 12 ? $"MM{sep}dd{sep}yyyy" : $"MM{sep}dd{sep}yyyy (or dd{sep}MM{sep}yyyy)";
            return " To read dates written this way, give --date-format " + pattern + ".";
        }

        if (text.Length == 8 && text.All(char.IsAsciiDigit))
        {
            return " To read dates written this way, give --date-format yyyyMMdd.";
        }

        return " Dates written another way are read with --date-format, such as --date-format MM/dd/yyyy.";
    }

    [GeneratedRegex(@"^(?<time>\d{2}:?\d{2}(:?\d{2}(\.\d{1,7})?)?)(Z|[+-]\d{2}(:?\d{2})?)?$", RegexOptions.CultureInvariant)]
    private static partial Regex TimeOfDay();

    [GeneratedRegex(@"^(?<first>\d{1,2})(?<sep>[/.\-])(?<second>\d{1,2})\k<sep>\d{4}$", RegexOptions.CultureInvariant)]
    private static partial Regex SlashDate();
}
