using System.Buffers;
using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using System.Text.Unicode;

namespace VolCast.IO.Reading;

/// <summary>
/// Turns an input file into text and a SHA-256 fingerprint. The file is opened read-only and shared for
/// reading only, read once, and never written; the text must be UTF-8 (a byte-order mark is skipped).
/// </summary>
internal static class InputText
{
    /// <summary>Largest input accepted; a hundred years of daily rows is a few megabytes.</summary>
    public const long MaxBytes = 256L * 1024 * 1024;

    /// <summary>Reads a file's bytes.</summary>
    /// <exception cref="InputDataException">The file is missing, is a folder, cannot be read, or is too large.</exception>
    public static byte[] ReadBytes(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        if (string.IsNullOrWhiteSpace(path))
        {
            throw new InputDataException(path, null, null, "file not found: the path is empty; give the path of a CSV file.");
        }

        if (Directory.Exists(path))
        {
            throw new InputDataException(path, null, null, "this is a folder, not a file; give the path of a CSV file.");
        }

        try
        {
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read);
            if (stream.Length > MaxBytes)
            {
                throw new InputDataException(path, null, null, string.Create(CultureInfo.InvariantCulture,
                    $"the file is {stream.Length} bytes; expected at most {MaxBytes} bytes for a daily history."));
            }

            var bytes = new byte[stream.Length];
            stream.ReadExactly(bytes);
            return bytes;
        }
        catch (Exception e) when (e is FileNotFoundException or DirectoryNotFoundException)
        {
            throw new InputDataException(path, null, null, "file not found; check the path and that the file exists.");
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or NotSupportedException or ArgumentException)
        {
            throw new InputDataException(path, null, null, "the file could not be read (" + e.Message + "); check that it exists and is readable.");
        }
    }

    /// <summary>Reads everything a reader holds.</summary>
    public static string ReadAll(TextReader reader)
    {
        ArgumentNullException.ThrowIfNull(reader);
        return reader.ReadToEnd();
    }

    /// <summary>Lowercase hexadecimal SHA-256 of some bytes.</summary>
    public static string Sha256Hex(ReadOnlySpan<byte> bytes) => Convert.ToHexStringLower(SHA256.HashData(bytes));

    /// <summary>Lowercase hexadecimal SHA-256 of the UTF-8 encoding of a text (used when the input came as text).</summary>
    public static string Sha256Hex(string text) => Sha256Hex(Encoding.UTF8.GetBytes(text));

    /// <summary>Decodes UTF-8 bytes, skipping a byte-order mark.</summary>
    /// <exception cref="InputDataException">The bytes are UTF-16 or not valid UTF-8; the message names the line.</exception>
    public static string Decode(byte[] bytes, string file)
    {
        ArgumentNullException.ThrowIfNull(bytes);
        ReadOnlySpan<byte> span = bytes;
        if (span.StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF]))
        {
            span = span[3..];
        }
        else if (span.StartsWith((ReadOnlySpan<byte>)[0xFF, 0xFE]) || span.StartsWith((ReadOnlySpan<byte>)[0xFE, 0xFF]))
        {
            throw new InputDataException(file, 1, null,
                "the file is UTF-16 encoded; expected UTF-8 text (save or export it as CSV UTF-8).");
        }

        var chars = ArrayPool<char>.Shared.Rent(Math.Max(span.Length, 1));
        try
        {
            var status = Utf8.ToUtf16(span, chars, out var bytesRead, out var charsWritten, replaceInvalidSequences: false);
            if (status != OperationStatus.Done)
            {
                var offset = bytesRead + (bytes.Length - span.Length);
                throw new InputDataException(file, LineAt(bytes, offset), null, string.Create(CultureInfo.InvariantCulture,
                    $"byte 0x{bytes[Math.Min(offset, bytes.Length - 1)]:X2} at byte offset {offset} is not valid UTF-8; expected UTF-8 text (save or export the file as CSV UTF-8)."));
            }

            return new string(chars, 0, charsWritten);
        }
        finally
        {
            ArrayPool<char>.Shared.Return(chars);
        }
    }

    /// <summary>The 1-based line holding a byte offset, counting LF, CRLF and lone CR as line ends.</summary>
    private static int LineAt(ReadOnlySpan<byte> bytes, int offset)
    {
        var line = 1;
        var end = Math.Min(offset, bytes.Length);
        for (var i = 0; i < end; i++)
        {
            if (bytes[i] == (byte)'\n' || (bytes[i] == (byte)'\r' && (i + 1 >= bytes.Length || bytes[i + 1] != (byte)'\n')))
            {
                line++;
            }
        }

        return line;
    }
}
