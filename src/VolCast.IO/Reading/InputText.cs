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
    /// <exception cref="InputDataException">The file is missing, is a folder or a pipe or device, cannot be read, or is too large.</exception>
    public static byte[] ReadBytes(string path) => InputFiles.ReadCapped(path, "a CSV file", MaxBytes);

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

        CheckNoNulBytes(span, file);
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

    /// <summary>
    /// Refuses text with NUL bytes, naming UTF-16 without a byte-order mark when the NULs fall on every other byte of
    /// the start (ASCII text in UTF-16 has a zero high byte beside each character).
    /// </summary>
    private static void CheckNoNulBytes(ReadOnlySpan<byte> span, string file)
    {
        var first = span.IndexOf((byte)0);
        if (first < 0)
        {
            return;
        }

        var sample = span[..Math.Min(span.Length, 1024)];
        int even = 0, odd = 0;
        for (var i = 0; i < sample.Length; i++)
        {
            if (sample[i] == 0)
            {
                if (i % 2 == 0)
                {
                    even++;
                }
                else
                {
                    odd++;
                }
            }
        }

        var half = sample.Length / 2;
        if (odd >= half * 0.8 || even >= half * 0.8)
        {
            throw new InputDataException(file, 1, null, "the file looks UTF-16 encoded ("
                + (odd > even ? "little-endian" : "big-endian")
                + ") without a byte-order mark: every other byte is zero; expected UTF-8 text (save or export it as CSV UTF-8).");
        }

        throw new InputDataException(file, LineAt(span, first), null, string.Create(CultureInfo.InvariantCulture,
            $"a zero byte (NUL) at byte offset {first}; this is not a text file. Expected UTF-8 text (save or export the file as CSV UTF-8)."));
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
