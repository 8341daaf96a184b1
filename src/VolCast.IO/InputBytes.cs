using System.Runtime.InteropServices;
using VolCast.IO.Reading;

namespace VolCast.IO;

/// <summary>
/// An input file's bytes as read once, with the SHA-256 of exactly those bytes: a caller that needs the hash before
/// parsing (to see whether earlier results are up to date) and then the data reads and hashes the file one time.
/// </summary>
/// <param name="Path">The file, as the user gave it; used as given in messages.</param>
/// <param name="Bytes">The file's bytes.</param>
/// <param name="Sha256">Lowercase hexadecimal SHA-256 of <paramref name="Bytes"/>.</param>
public sealed record InputBytes(string Path, ReadOnlyMemory<byte> Bytes, string Sha256)
{
    /// <summary>Reads a file once and hashes the bytes read.</summary>
    /// <param name="path">The file, as the user gave it.</param>
    /// <returns>The bytes and their SHA-256.</returns>
    /// <exception cref="InputDataException">The file is missing, is a folder, cannot be read, or is too large.</exception>
    public static InputBytes Read(string path)
    {
        var bytes = InputText.ReadBytes(path);
        return new InputBytes(path, bytes, InputText.Sha256Hex(bytes));
    }

    /// <summary>Decodes the bytes as the readers do (UTF-8, a byte-order mark skipped), without copying them.</summary>
    internal string Text() =>
        InputText.Decode(MemoryMarshal.TryGetArray(Bytes, out var whole) && whole.Offset == 0 && whole.Count == whole.Array!.Length ? whole.Array : Bytes.ToArray(), Path);
}
