using VolCast.IO.Csv;
using VolCast.IO.Results;

namespace VolCast.IO.Tests.Csv;

/// <summary>
/// Cells a spreadsheet would run as a formula. The rule and the prefix are OWASP's advice on CSV injection (from
/// memory: a cell that begins with =, +, -, @, tab or carriage return is prefixed with an apostrophe so that it is
/// shown as text); numbers must stay numbers.
/// </summary>
public sealed class CsvInjectionTests
{
    /// <summary>The hostile names of the adversarial pass: a link, a shell call through DDE, a function, and the other first characters.</summary>
    public static TheoryData<string, string> Hostile => new()
    {
        { "=HYPERLINK(\"http://example.invalid\",\"x\")", "\"'=HYPERLINK(\"\"http://example.invalid\"\",\"\"x\"\")\"" },
        { "+cmd|' /C calc'!A0", "'+cmd|' /C calc'!A0" },
        { "@SUM(1+1)*cmd|' /C calc'!A0", "'@SUM(1+1)*cmd|' /C calc'!A0" },
        { "-2+3+cmd|' /C calc'!A0", "'-2+3+cmd|' /C calc'!A0" },
        { "\t=1+1", "'\t=1+1" },
        { "\r=1+1", "\"'\r=1+1\"" },
        { "=1+1,more", "\"'=1+1,more\"" },
    };

    [Theory]
    [MemberData(nameof(Hostile))]
    public void Text_BeginsLikeAFormula_IsPrefixedWithAnApostrophe(string text, string expected) =>
        Assert.Equal(expected, CsvText.Text(text));

    [Theory]
    [InlineData("-0.5")]
    [InlineData("+1")]
    [InlineData("-1e-5")]
    [InlineData("garch")]
    [InlineData("yang-zhang:21")]
    [InlineData("ewma:0.94")]
    public void Text_PlainNumberOrOrdinaryName_IsLeftAsItIs(string text) => Assert.Equal(text, CsvText.Text(text));

    [Fact]
    public void Number_Negative_StaysANumber()
    {
        Assert.Equal("-0.5", CsvText.Number(-0.5));
        Assert.Equal("-3", CsvText.Integer(-3));
    }

    [Theory]
    [MemberData(nameof(Hostile))]
    public void BatchSummary_HostileAssetName_FirstCellIsNeutralised(string name, string expected)
    {
        var row = new BatchAssetRow { Name = name, Succeeded = false, HasImplied = false, Error = name, MeanPremium = -0.5 };
        using var writer = new StringWriter();

        BatchSummaryCsv.Write(writer, [row]);

        var body = writer.ToString()[(writer.ToString().IndexOf('\n', StringComparison.Ordinal) + 1)..];
        Assert.StartsWith(expected + ",failed,", body, StringComparison.Ordinal);
        // The error column repeats the name (a text cell), and the premium stays the number -0.5.
        Assert.EndsWith(",-0.5," + expected + "\n", body, StringComparison.Ordinal);
    }

    [Fact]
    public void History_HostileValueColumnName_IsNeutralisedInTheHeader()
    {
        using var writer = new StringWriter();

        HistoryCsv.WriteSeries(writer, "=cmd|' /C calc'!A0", [new DateOnly(2024, 1, 2)], [-0.5]);

        Assert.Equal("date,'=cmd|' /C calc'!A0\n2024-01-02,-0.5\n", writer.ToString());
    }
}
