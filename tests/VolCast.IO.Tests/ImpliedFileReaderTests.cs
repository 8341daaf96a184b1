using System.Globalization;

namespace VolCast.IO.Tests;

// Invented files for each rule (common practice, no source); expected decimals worked out by hand.
public sealed class ImpliedFileReaderTests : IDisposable
{
    private readonly TempFolder _temp = new();

    public void Dispose() => _temp.Dispose();

    private static ImpliedLoad ReadText(string text, ImpliedUnit unit = ImpliedUnit.Infer) =>
        ImpliedFileReader.Read(new StringReader(text), "iv.csv", unit);

    [Fact]
    public void Read_DeclaredPercent_DividesByOneHundredWithoutWarning()
    {
        var load = ImpliedFileReader.Read(_temp.Write("iv.csv", "date,iv\n2024-01-02,20\n2024-01-03,21.5\n"), ImpliedUnit.Percent);

        Assert.Equal(ImpliedUnit.Percent, load.UnitUsed);
        Assert.False(load.UnitInferred);
        Assert.Empty(load.Warnings);
        Assert.Equal(0.20, load.Series.Volatility[0], 1e-15);
        Assert.Equal(0.215, load.Series.Volatility[1], 1e-15);
        Assert.Equal([new DateOnly(2024, 1, 2), new DateOnly(2024, 1, 3)], load.Series.Dates.ToArray());
        Assert.Matches("^[0-9a-f]{64}$", load.Sha256);
    }

    [Fact]
    public void Read_DeclaredPercentButValuesLookDecimal_IsRefusedNamingTheMedianAndTheOtherUnit()
    {
        // 0.18 read as percent is 0.18% a year, far below any traded volatility (common practice, no source); a median
        // below 1.5 is the same threshold the unit is inferred with.
        var error = Assert.Throws<InputDataException>(() => ImpliedFileReader.Read(_temp.Write("iv.csv", "date,iv\n2024-01-02,0.18\n2024-01-03,0.19\n2024-01-04,0.2\n"), ImpliedUnit.Percent));

        Assert.EndsWith("iv.csv", error.File, StringComparison.Ordinal);
        Assert.Null(error.Line);
        Assert.Contains("declared percent", error.Message, StringComparison.Ordinal);
        Assert.Contains("median value is 0.19", error.Message, StringComparison.Ordinal);
        Assert.Contains("--iv-unit decimal", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_DeclaredDecimalButValuesLookPercent_IsRefusedNamingTheMedianAndTheOtherUnit()
    {
        // 21 read as a decimal is 2100% a year: a percent file (common practice, no source).
        var error = Assert.Throws<InputDataException>(() => ReadText("date,iv\n2024-01-02,20\n2024-01-03,21\n2024-01-04,22\n", ImpliedUnit.Decimal));

        Assert.Equal("iv.csv", error.File);
        Assert.Contains("declared decimal", error.Message, StringComparison.Ordinal);
        Assert.Contains("median value is 21", error.Message, StringComparison.Ordinal);
        Assert.Contains("--iv-unit percent", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_DeclaredDecimal_KeepsValues()
    {
        var load = ReadText("date,iv\n2024-01-02,0.2\n2024-01-03,0.215\n", ImpliedUnit.Decimal);

        Assert.Equal(ImpliedUnit.Decimal, load.UnitUsed);
        Assert.False(load.UnitInferred);
        Assert.Empty(load.Warnings);
        Assert.Equal([0.2, 0.215], load.Series.Volatility.ToArray());
    }

    [Fact]
    public void Read_InferredPercent_WarnsWhatWasInferredAndHowToDeclare()
    {
        var load = ReadText("date,iv\n2024-01-02,18\n2024-01-03,20\n2024-01-04,22\n");

        Assert.Equal(ImpliedUnit.Percent, load.UnitUsed);
        Assert.True(load.UnitInferred);
        var warning = Assert.Single(load.Warnings);
        Assert.Null(warning.Line);
        Assert.Contains("read as percent", warning.Message, StringComparison.Ordinal);
        Assert.Contains("median value 20", warning.Message, StringComparison.Ordinal);
        Assert.Contains("--iv-unit percent|decimal", warning.Message, StringComparison.Ordinal);
        Assert.Equal(0.18, load.Series.Volatility[0], 1e-15);
    }

    [Fact]
    public void Read_InferredDecimal_WarnsToo()
    {
        var load = ReadText("date,iv\n2024-01-02,0.18\n2024-01-03,0.2\n2024-01-04,2.5\n");

        Assert.Equal(ImpliedUnit.Decimal, load.UnitUsed);
        Assert.True(load.UnitInferred);
        Assert.Contains("read as decimal", Assert.Single(load.Warnings).Message, StringComparison.Ordinal);
        Assert.Equal([0.18, 0.2, 2.5], load.Series.Volatility.ToArray());
    }

    [Theory]
    // A median of exactly 1.5 is not above the threshold: decimal (150% vol is possible in a crisis).
    [InlineData("1.4,1.5,1.6", ImpliedUnit.Decimal)]
    // Median 1.6 is above 1.5: percent, 1.6%.
    [InlineData("1.5,1.6,1.7", ImpliedUnit.Percent)]
    // Mostly percent with a few decimal-looking values: the median decides.
    [InlineData("0.9,25,30,35,1.2", ImpliedUnit.Percent)]
    public void Read_InferredUnit_FollowsTheMedian(string values, ImpliedUnit expected)
    {
        var rows = values.Split(',').Select((v, i) => string.Create(CultureInfo.InvariantCulture, $"2024-01-{i + 2:00},{v}\n"));
        var load = ReadText("date,iv\n" + string.Concat(rows));
        Assert.Equal(expected, load.UnitUsed);
    }

    [Theory]
    // Accepted spellings of the value column.
    [InlineData("Date,IV")]
    [InlineData("date,implied")]
    [InlineData("date,Implied_Vol")]
    [InlineData("date,implied vol")]
    [InlineData("DATE,Vol")]
    public void Read_HeaderSpellings_AreAccepted(string header)
    {
        var load = ReadText(header + "\n2024-01-02,0.2\n", ImpliedUnit.Decimal);
        Assert.Equal(0.2, load.Series.Volatility[0]);
    }

    [Fact]
    public void Read_Unsorted_IsSortedWithWarning()
    {
        var load = ReadText("date,iv\n2024-01-03,0.21\n2024-01-02,0.2\n", ImpliedUnit.Decimal);

        Assert.Equal([0.2, 0.21], load.Series.Volatility.ToArray());
        var warning = Assert.Single(load.Warnings);
        Assert.Equal(3, warning.Line);
        Assert.Contains("sorted by date", warning.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_IgnoredColumns_WarnOnce()
    {
        var load = ReadText("date,tenor,iv\n2024-01-02,30d,0.2\n", ImpliedUnit.Decimal);
        Assert.Contains("'tenor'", Assert.Single(load.Warnings).Message, StringComparison.Ordinal);
    }

    [Theory]
    // 500% exactly is the upper limit and is accepted.
    [InlineData("5", ImpliedUnit.Decimal, 5.0)]
    [InlineData("500", ImpliedUnit.Percent, 5.0)]
    // Tiny but positive is accepted.
    [InlineData("0.01", ImpliedUnit.Percent, 0.0001)]
    public void Read_ValuesAtTheLimits_AreAccepted(string value, ImpliedUnit unit, double expected)
    {
        // Two ordinary values beside it keep the median in the declared unit.
        var usual = unit == ImpliedUnit.Percent ? "20" : "0.2";
        var load = ReadText("date,iv\n2024-01-02," + usual + "\n2024-01-03," + usual + "\n2024-01-04," + value + "\n", unit);
        Assert.Equal(expected, load.Series.Volatility[2], 1e-15);
    }

    [Theory]
    // Above 500% after conversion.
    [InlineData("5.01", ImpliedUnit.Decimal)]
    [InlineData("501", ImpliedUnit.Percent)]
    // Zero and negative.
    [InlineData("0", ImpliedUnit.Percent)]
    [InlineData("-0.2", ImpliedUnit.Decimal)]
    // A percent file declared as decimal: 20 would be 2000%.
    [InlineData("20", ImpliedUnit.Decimal)]
    public void Read_OutOfRange_NamesTheLine(string value, ImpliedUnit unit)
    {
        // Lines 2 and 5 hold an ordinary value in the declared unit; line 3 is blank; the offending value is on line 4.
        var usual = unit == ImpliedUnit.Percent ? "20" : "0.2";
        var error = Assert.Throws<InputDataException>(() => ReadText("date,iv\n2024-01-02," + usual + "\n\n2024-01-04," + value + "\n2024-01-05," + usual + "\n", unit));

        Assert.Equal("iv.csv", error.File);
        Assert.Equal(4, error.Line);
        Assert.Equal("iv", error.Column);
        Assert.Contains("expected above 0% and at most 500%", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_DuplicateDate_NamesBothLines()
    {
        var error = Assert.Throws<InputDataException>(() => ReadText("date,iv\n2024-01-02,0.2\n2024-01-02,0.3\n"));
        Assert.Equal(3, error.Line);
        Assert.Equal("date", error.Column);
        Assert.Contains("on line 2 and line 3", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_MissingFile_SaysFileNotFound()
    {
        var path = _temp.Combine("none.csv");
        var error = Assert.Throws<InputDataException>(() => ImpliedFileReader.Read(path));
        Assert.Equal(path, error.File);
        Assert.Contains("file not found", error.Message, StringComparison.Ordinal);
    }
}
