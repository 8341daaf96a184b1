using System.Globalization;

namespace VolCast.IO;

/// <summary>
/// How a user's CSV file writes its cells: the date format, the cell delimiter and the decimal separator. The default is
/// the strict form every reader has always used: ISO 8601 dates (yyyy-MM-dd), commas between cells, '.' as the decimal point.
/// </summary>
/// <remarks>
/// A regional spreadsheet export is read by declaring its form, for example <c>dd.MM.yyyy</c> with <c>;</c> and
/// <c>,</c>. The form is never guessed: a cell that does not match it is refused, and the message names the option
/// that would read it (see docs/files.md, "Regional formats").
/// </remarks>
/// <param name="DateFormat">A .NET custom date format (yyyy, MM, dd, ...), or null for ISO 8601 yyyy-MM-dd.</param>
/// <param name="Delimiter">The character between cells: ',', ';', tab or '|'.</param>
/// <param name="DecimalSeparator">The decimal separator of numbers: '.' or ','.</param>
public sealed record CsvFormat(string? DateFormat, char Delimiter, char DecimalSeparator)
{
    /// <summary>The ISO date format used when none is declared.</summary>
    public const string IsoDate = "yyyy-MM-dd";

    private static readonly DateOnly Probe = new(2024, 3, 28);

    /// <summary>Gets the default form: ISO dates, comma-separated cells, '.' decimal point.</summary>
    public static CsvFormat Default { get; } = new(null, ',', '.');

    /// <summary>Gets the cells that every reader takes as a missing value besides an empty cell, compared without regard to capitals.</summary>
    public static IReadOnlyList<string> MissingMarks => Reading.CellParser.MissingTokens;

    /// <summary>Gets whether this is the default form.</summary>
    public bool IsDefault => DateFormat is null && Delimiter == ',' && DecimalSeparator == '.';

    /// <summary>Gets the date format in force: the declared one or yyyy-MM-dd.</summary>
    public string DateFormatOrIso => DateFormat ?? IsoDate;

    /// <summary>Describes the form for messages and run records, e.g. "dates dd.MM.yyyy, delimiter ';', decimal ','".</summary>
    /// <returns>The description.</returns>
    public override string ToString() =>
        "dates " + DateFormatOrIso + ", delimiter " + Name(Delimiter) + ", decimal '" + DecimalSeparator + "'";

    /// <summary>Describes the form with the missing-value marks, for the report's settings: "dates dd.MM.yyyy, delimiter ';', decimal ','; missing values: empty, null, NA, ...".</summary>
    /// <returns>The description.</returns>
    public string Describe() => this + "; missing values: an empty cell, " + string.Join(", ", MissingMarks);

    /// <summary>Builds a form from the user's words, checking each part and that they fit together.</summary>
    /// <param name="dateFormat">The date format, or null for ISO.</param>
    /// <param name="delimiter">The delimiter as written (",", ";", "tab" or "\t", "|"), or null for a comma.</param>
    /// <param name="decimalSeparator">The decimal separator as written ("." or ","), or null for '.'.</param>
    /// <param name="source">Where the values came from, named in messages (such as "--delimiter" or "delimiter").</param>
    /// <returns>The form.</returns>
    /// <exception cref="ArgumentException">A part is not accepted, or the delimiter and decimal separator are the same character.</exception>
    public static CsvFormat Parse(string? dateFormat, string? delimiter, string? decimalSeparator, Func<string, string> source)
    {
        ArgumentNullException.ThrowIfNull(source);
        var date = dateFormat is null ? null : CheckDateFormat(dateFormat, source("date-format"));
        var cells = delimiter is null ? ',' : ParseDelimiter(delimiter, source("delimiter"));
        var point = decimalSeparator is null ? '.' : ParseDecimal(decimalSeparator, source("decimal"));
        if (cells == point)
        {
            throw new ArgumentException(source("decimal") + " '" + point + "' is also the delimiter; a file with a decimal comma separates its cells with ';' (give " + source("delimiter") + " ';').");
        }

        return new CsvFormat(date == IsoDate ? null : date, cells, point);
    }

    /// <summary>Names a delimiter for messages: "','", "';'", "tab", "'|'".</summary>
    /// <param name="delimiter">The character.</param>
    /// <returns>Its name.</returns>
    public static string Name(char delimiter) => delimiter == '\t' ? "tab" : "'" + delimiter + "'";

    private static string CheckDateFormat(string text, string option)
    {
        var format = text.Trim();
        var shown = Reading.ValueText.Quote(text);
        if (format.Length == 0 || format.Length > 40)
        {
            throw new ArgumentException(option + " " + shown + " is not a date format; expected a pattern such as MM/dd/yyyy, dd.MM.yyyy or yyyyMMdd.");
        }

        if (!format.Contains("yyyy", StringComparison.Ordinal) || !format.Contains('M', StringComparison.Ordinal) || !format.Contains('d', StringComparison.Ordinal))
        {
            throw new ArgumentException(option + " " + shown + " must name the four-digit year (yyyy), the month (MM) and the day (dd); for example MM/dd/yyyy, dd.MM.yyyy or yyyyMMdd.");
        }

        string written;
        try
        {
            written = Probe.ToString(format, CultureInfo.InvariantCulture);
        }
        catch (FormatException)
        {
            throw new ArgumentException(option + " " + shown + " is not a valid date format; expected a pattern such as MM/dd/yyyy, dd.MM.yyyy or yyyyMMdd.");
        }

        if (!DateOnly.TryParseExact(written, format, CultureInfo.InvariantCulture, DateTimeStyles.None, out var back) || back != Probe)
        {
            throw new ArgumentException(option + " " + shown + " does not read back the date it writes (2024-03-28 is written " + Reading.ValueText.Quote(written)
                + "); expected a pattern with the year, month and day once each, such as MM/dd/yyyy, dd.MM.yyyy or yyyyMMdd.");
        }

        return format;
    }

    private static char ParseDelimiter(string text, string option) => text switch
    {
        "," or "comma" => ',',
        ";" or "semicolon" => ';',
        "\t" or "\\t" or "tab" => '\t',
        "|" or "pipe" => '|',
        _ => throw new ArgumentException(option + " " + Reading.ValueText.Quote(text) + " is not accepted; expected ',', ';', tab or '|'."),
    };

    private static char ParseDecimal(string text, string option) => text switch
    {
        "." or "point" => '.',
        "," or "comma" => ',',
        _ => throw new ArgumentException(option + " " + Reading.ValueText.Quote(text) + " is not accepted; expected '.' or ','."),
    };
}
