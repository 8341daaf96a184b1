using System.Text.Json;

namespace VolCast.IO.Results;

/// <summary>JSON value writing shared by the results writers: round-trip doubles, null where undefined (CSV cells are written by Csv.CsvText).</summary>
internal static class Numbers
{
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
}
