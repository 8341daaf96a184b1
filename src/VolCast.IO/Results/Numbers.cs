using System.Globalization;
using System.Text.Json;

namespace VolCast.IO.Results;

/// <summary>Value formatting shared by the results writers: invariant culture, round-trip doubles, empty (CSV) or null (JSON) where undefined.</summary>
internal static class Numbers
{
    public static string Csv(double? value) =>
        value is double v && double.IsFinite(v) ? v.ToString("R", CultureInfo.InvariantCulture) : string.Empty;

    public static string Csv(int? value) => value?.ToString(CultureInfo.InvariantCulture) ?? string.Empty;

    public static string Csv(bool? value) => value is bool b ? (b ? "true" : "false") : string.Empty;

    public static void Write(Utf8JsonWriter json, string name, double? value)
    {
        if (value is double v && double.IsFinite(v))
        {
            json.WriteNumber(name, v);
        }
        else
        {
            json.WriteNull(name);
        }
    }

    public static void Write(Utf8JsonWriter json, string name, int? value)
    {
        if (value is int v)
        {
            json.WriteNumber(name, v);
        }
        else
        {
            json.WriteNull(name);
        }
    }

    public static void Write(Utf8JsonWriter json, string name, bool? value)
    {
        if (value is bool v)
        {
            json.WriteBoolean(name, v);
        }
        else
        {
            json.WriteNull(name);
        }
    }

    public static void Write(Utf8JsonWriter json, string name, string? value)
    {
        if (value is null)
        {
            json.WriteNull(name);
        }
        else
        {
            json.WriteString(name, value);
        }
    }

    public static void WriteValue(Utf8JsonWriter json, double? value)
    {
        if (value is double v && double.IsFinite(v))
        {
            json.WriteNumberValue(v);
        }
        else
        {
            json.WriteNullValue();
        }
    }

    /// <summary>Quotes a CSV field when it holds a comma, quote or line break.</summary>
    public static string Field(string text) =>
        text.IndexOfAny([',', '"', '\n', '\r']) >= 0 ? "\"" + text.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"" : text;
}
