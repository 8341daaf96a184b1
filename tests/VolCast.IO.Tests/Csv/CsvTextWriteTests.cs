using VolCast.IO.Csv;

namespace VolCast.IO.Tests.Csv;

public sealed class CsvTextWriteTests
{
    [Theory]
    // Shortest round-trip text of doubles (IEEE 754 binary64; .NET's "R" format): subnormal, extremes, a value with
    // 17 significant digits, negative zero, a whole number; NaN and infinity are empty cells (docs/files.md).
    [InlineData(0.1)]
    [InlineData(1.0 / 3.0)]
    [InlineData(-0.0)]
    [InlineData(4.9406564584124654E-324)]
    [InlineData(double.MaxValue)]
    [InlineData(-1.2345678901234567E-5)]
    [InlineData(252.0)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void WriteNumber_WritesTheSameCharactersAsTheStringCell(double value)
    {
        // The streaming writers must not change a byte of the files: the span path writes what Number returns.
        using var writer = new StringWriter();
        CsvText.WriteNumber(writer, value);
        Assert.Equal(CsvText.Number(value), writer.ToString());
        Assert.Equal(double.IsFinite(value) ? value.ToString("R", System.Globalization.CultureInfo.InvariantCulture) : string.Empty, writer.ToString());
    }

    [Fact]
    public void WriteIntegerAndDate_WriteTheSameCharactersAsTheStringCells()
    {
        // ISO 8601 calendar date (yyyy-MM-dd) and invariant integers, as the string cells write them.
        using var writer = new StringWriter();
        CsvText.WriteInteger(writer, int.MinValue);
        writer.Write('|');
        CsvText.WriteInteger(writer, null);
        writer.Write('|');
        CsvText.WriteDate(writer, new DateOnly(1999, 1, 4));
        Assert.Equal(CsvText.Integer(int.MinValue) + "||1999-01-04", writer.ToString());
    }
}
