using System.Globalization;

namespace VolCast.IO.Results;

/// <summary>Field formatting shared by calibration.csv and coverage.csv.</summary>
internal static class CalibrationCsvText
{
    /// <summary>A nullable number in invariant culture, shortest round-trip form; empty when null.</summary>
    public static string Number(double? value) => value is { } v ? v.ToString("R", CultureInfo.InvariantCulture) : string.Empty;

    /// <summary>A text field, quoted (with doubled quotes) when it holds a comma, quote or line break, or when asked.</summary>
    public static string Field(string text, bool alwaysQuote = false)
    {
        if (!alwaysQuote && text.AsSpan().IndexOfAny(",\"\n\r") < 0)
        {
            return text;
        }

        return "\"" + text.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"";
    }
}
