using System.Buffers.Binary;

namespace VolCast.Reports.Tests.Support;

/// <summary>Reads what a test needs from PNG bytes: the signature and the IHDR size.</summary>
public static class Png
{
    private static readonly byte[] Signature = [0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A];

    public static bool HasSignature(ReadOnlySpan<byte> bytes) => bytes.Length > 24 && bytes[..8].SequenceEqual(Signature);

    /// <summary>Width and height from the IHDR chunk, which the PNG specification puts first, at bytes 16..23.</summary>
    public static (int Width, int Height) Size(ReadOnlySpan<byte> bytes) =>
        (BinaryPrimitives.ReadInt32BigEndian(bytes[16..20]), BinaryPrimitives.ReadInt32BigEndian(bytes[20..24]));
}
