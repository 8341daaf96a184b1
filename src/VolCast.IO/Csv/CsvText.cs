using System.Globalization;

namespace VolCast.IO.Csv;

/// <summary>
/// The one place where every CSV the tool writes gets its cells: invariant culture, shortest round-trip doubles,
/// empty cells where a value does not exist, quoting of text that holds a comma, quote or line break, and
/// neutralising of text that a spreadsheet would run as a formula.
/// </summary>
/// <remarks>
/// A text cell that begins with <c>=</c>, <c>+</c>, <c>-</c>, <c>@</c>, a tab or a carriage return is written with a
/// leading apostrophe (<c>'=HYPERLINK(…)</c>), so that a spreadsheet shows it as text instead of evaluating it; this
/// is the OWASP advice against CSV injection. Numbers are never changed: numeric cells are written by
/// <see cref="Number(double?)"/> and <see cref="Integer(int?)"/>, and a text cell that is a plain decimal number
/// (such as <c>-0.5</c>) is left as it is, since a spreadsheet reads it as that number and nothing more.
/// </remarks>
internal static class CsvText
{
    /// <summary>The prefix written before a text cell that a spreadsheet would otherwise read as a formula.</summary>
    public const char NeutralPrefix = '\'';

    /// <summary>A text cell: neutralised when it begins like a formula, then quoted (with doubled quotes) when it holds a comma, quote or line break, begins or ends with a space, or when asked.</summary>
    /// <param name="text">The text.</param>
    /// <param name="alwaysQuote">Quote even when nothing requires it.</param>
    /// <returns>The cell as written.</returns>
    public static string Text(string text, bool alwaysQuote = false)
    {
        ArgumentNullException.ThrowIfNull(text);
        if (BeginsLikeFormula(text))
        {
            text = NeutralPrefix + text;
        }

        if (!alwaysQuote && text.AsSpan().IndexOfAny(",\"\n\r") < 0 && !(text.Length > 0 && (text[0] == ' ' || text[^1] == ' ')))
        {
            return text;
        }

        return "\"" + text.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"";
    }

    /// <summary>Whether a text cell would be read by a spreadsheet as a formula: it begins with <c>= + - @</c>, tab or carriage return and is not a plain decimal number.</summary>
    /// <param name="text">The text.</param>
    /// <returns>True when the cell needs the neutral prefix.</returns>
    public static bool BeginsLikeFormula(string text) =>
        text.Length > 0 && text[0] is '=' or '+' or '-' or '@' or '\t' or '\r' && !IsPlainNumber(text);

    /// <summary>A number in invariant culture, shortest round-trip form; empty when null, NaN or infinite.</summary>
    /// <param name="value">The value.</param>
    /// <returns>The cell.</returns>
    public static string Number(double? value) =>
        value is double v && double.IsFinite(v) ? v.ToString("R", CultureInfo.InvariantCulture) : string.Empty;

    /// <summary>Writes <see cref="Number(double?)"/>'s cell without making a string (the same characters).</summary>
    /// <param name="writer">Where to write.</param>
    /// <param name="value">The value.</param>
    public static void WriteNumber(TextWriter writer, double? value)
    {
        if (value is not double v || !double.IsFinite(v))
        {
            return;
        }

        Span<char> buffer = stackalloc char[32];
        if (v.TryFormat(buffer, out var written, "R", CultureInfo.InvariantCulture))
        {
            writer.Write(buffer[..written]);
        }
        else
        {
            writer.Write(v.ToString("R", CultureInfo.InvariantCulture));
        }
    }

    /// <summary>Writes <see cref="Integer(int?)"/>'s cell without making a string (the same characters).</summary>
    /// <param name="writer">Where to write.</param>
    /// <param name="value">The value.</param>
    public static void WriteInteger(TextWriter writer, int? value)
    {
        if (value is not int v)
        {
            return;
        }

        Span<char> buffer = stackalloc char[16];
        _ = v.TryFormat(buffer, out var written, provider: CultureInfo.InvariantCulture);
        writer.Write(buffer[..written]);
    }

    /// <summary>Writes <see cref="Date(DateOnly)"/>'s cell without making a string (the same characters).</summary>
    /// <param name="writer">Where to write.</param>
    /// <param name="date">The date.</param>
    public static void WriteDate(TextWriter writer, DateOnly date)
    {
        Span<char> buffer = stackalloc char[10];
        _ = date.TryFormat(buffer, out var written, "yyyy-MM-dd", CultureInfo.InvariantCulture);
        writer.Write(buffer[..written]);
    }

    /// <summary>An integer in invariant culture; empty when null.</summary>
    /// <param name="value">The value.</param>
    /// <returns>The cell.</returns>
    public static string Integer(int? value) => value?.ToString(CultureInfo.InvariantCulture) ?? string.Empty;

    /// <summary><c>true</c> or <c>false</c>; empty when null.</summary>
    /// <param name="value">The value.</param>
    /// <returns>The cell.</returns>
    public static string Boolean(bool? value) => value is bool b ? (b ? "true" : "false") : string.Empty;

    /// <summary>A date as yyyy-MM-dd.</summary>
    /// <param name="date">The date.</param>
    /// <returns>The cell.</returns>
    public static string Date(DateOnly date) => date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);

    /// <summary>Writes one record: the cells joined by commas, then LF.</summary>
    /// <param name="writer">Where to write.</param>
    /// <param name="cells">The cells, each already formatted by this class.</param>
    public static void WriteRecord(TextWriter writer, IEnumerable<string> cells)
    {
        writer.Write(string.Join(',', cells));
        writer.Write('\n');
    }

    /// <summary>Writes a header record: each name is a text cell.</summary>
    /// <param name="writer">Where to write.</param>
    /// <param name="names">The column names.</param>
    public static void WriteHeader(TextWriter writer, IEnumerable<string> names) => WriteRecord(writer, names.Select(n => Text(n)));

    private static bool IsPlainNumber(string text)
    {
        for (var i = 1; i < text.Length; i++)
        {
            if (!(char.IsAsciiDigit(text[i]) || text[i] is '.' or 'e' or 'E' or '+' or '-'))
            {
                return false;
            }
        }

        return double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out _);
    }
}
