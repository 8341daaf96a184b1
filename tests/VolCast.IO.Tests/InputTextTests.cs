using System.Text;
using VolCast.IO.Reading;

namespace VolCast.IO.Tests;

public sealed class InputTextTests
{
    [Fact]
    public void Sha256Hex_Abc_MatchesTheStandardExample()
    {
        // FIPS 180-2, Appendix B.1 test vector SHA-256("abc") [M]; the same value was printed by coreutils `printf abc | sha256sum` on this machine.
        Assert.Equal("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad", InputText.Sha256Hex("abc"u8));
    }

    [Fact]
    public void Decode_InvalidUtf8_NamesTheLineOfTheBadByte()
    {
        var bytes = Encoding.UTF8.GetBytes("a,b\r\n1,2\n3,").Concat(new byte[] { 0xC3, 0x28 }).ToArray();
        var error = Assert.Throws<InputDataException>(() => InputText.Decode(bytes, "f.csv"));
        Assert.Equal(3, error.Line);
        Assert.Contains("0xC3", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Decode_Utf8WithBom_DropsTheBom()
    {
        var bytes = Encoding.UTF8.GetPreamble().Concat(Encoding.UTF8.GetBytes("date,é")).ToArray();
        Assert.Equal("date,é", InputText.Decode(bytes, "f.csv"));
    }
}
