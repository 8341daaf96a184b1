using System.Text;
using System.Text.Json;

namespace VolCast.IO.Results;

/// <summary>Builds the text of a JSON document: indented, UTF-8, LF line ends and a final line end.</summary>
internal static class JsonText
{
    private static readonly JsonWriterOptions Options = new() { Indented = true };

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
