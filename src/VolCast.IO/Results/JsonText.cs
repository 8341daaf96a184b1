using System.Globalization;
using System.Text;
using System.Text.Encodings.Web;
using System.Text.Json;

namespace VolCast.IO.Results;

/// <summary>
/// Builds the text of a JSON document: indented, UTF-8, LF line ends and a final line end. The files are for people as
/// well as programs, so ordinary characters (+, ', &amp;, ≤, σ) are written as themselves, not as \u escapes; only what
/// JSON requires is escaped. (The HTML report escapes strictly on its own.)
/// </summary>
internal static class JsonText
{
    /// <summary>The writer options of every JSON file: indented, relaxed escaping.</summary>
    public static readonly JsonWriterOptions Options = new() { Indented = true, Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping };

    /// <summary>A UTC time as ISO 8601 ending in Z, e.g. 2026-12-02T01:45:16.7358867Z.</summary>
    /// <param name="time">Any time; it is converted to UTC.</param>
    /// <returns>The text.</returns>
    public static string Utc(DateTimeOffset time) => time.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fffffff'Z'", CultureInfo.InvariantCulture);

    public static string Build(Action<Utf8JsonWriter> write)
    {
        using var stream = new MemoryStream();
        using (var json = new Utf8JsonWriter(stream, Options))
        {
            write(json);
        }

        return Encoding.UTF8.GetString(stream.ToArray()).Replace("\r\n", "\n", StringComparison.Ordinal) + "\n";
    }
}
