using System.Security.Cryptography;
using System.Text;

namespace VolCast.IO.Tests;

// Every file here is invented for the check it makes (common practice, no source); expected numbers are
// worked out by hand in the comments.
public sealed class PriceFileReaderTests : IDisposable
{
    private const string Ohlc =
        "date,open,high,low,close\n" +
        "2024-01-02,100,101,99,100.5\n" +
        "2024-01-03,100.5,102,100,101\n" +
        "2024-01-04,101,103,100.5,102\n";

    private readonly TempFolder _temp = new();

    public void Dispose() => _temp.Dispose();

    private static PriceLoad ReadText(string text, string name = "prices.csv") =>
        PriceFileReader.Read(new StringReader(text), name);

    private static InputDataException Refuse(string text, string name = "prices.csv") =>
        Assert.Throws<InputDataException>(() => ReadText(text, name));

    [Fact]
    public void Read_ValidOhlcFile_LoadsEveryColumnAsWritten()
    {
        var load = PriceFileReader.Read(_temp.Write("p.csv", Ohlc));

        var h = load.History;
        Assert.True(h.HasRange);
        Assert.Equal(3, load.RowsRead);
        Assert.False(load.AdjustedCloseApplied);
        Assert.Empty(load.Warnings);
        Assert.Equal([new DateOnly(2024, 1, 2), new DateOnly(2024, 1, 3), new DateOnly(2024, 1, 4)], h.Dates.ToArray());
        Assert.Equal([100, 100.5, 101], h.Open.ToArray());
        Assert.Equal([101, 102, 103], h.High.ToArray());
        Assert.Equal([99, 100, 100.5], h.Low.ToArray());
        Assert.Equal([100.5, 101, 102], h.Close.ToArray());
    }

    [Fact]
    public void Read_BomAndCrlf_GivesTheSameNumbersAsThePlainFile()
    {
        var plain = PriceFileReader.Read(_temp.Write("plain.csv", Ohlc));
        var bomCrlf = Encoding.UTF8.GetPreamble().Concat(Encoding.UTF8.GetBytes(Ohlc.Replace("\n", "\r\n", StringComparison.Ordinal))).ToArray();
        var windows = PriceFileReader.Read(_temp.WriteBytes("windows.csv", bomCrlf));

        Assert.Equal(plain.History.Dates.ToArray(), windows.History.Dates.ToArray());
        Assert.Equal(plain.History.Open.ToArray(), windows.History.Open.ToArray());
        Assert.Equal(plain.History.High.ToArray(), windows.History.High.ToArray());
        Assert.Equal(plain.History.Low.ToArray(), windows.History.Low.ToArray());
        Assert.Equal(plain.History.Close.ToArray(), windows.History.Close.ToArray());
        Assert.Empty(windows.Warnings);
        Assert.NotEqual(plain.Sha256, windows.Sha256); // different bytes, different fingerprint
    }

    [Fact]
    public void Read_BomAndCrlfThroughTextReader_Works()
    {
        var load = ReadText("\uFEFF" + Ohlc.Replace("\n", "\r\n", StringComparison.Ordinal));
        Assert.Equal([100.5, 101, 102], load.History.Close.ToArray());
    }

    [Fact]
    public void Read_File_Sha256IsOfTheFileBytes()
    {
        var bytes = Encoding.UTF8.GetBytes(Ohlc);
        var load = PriceFileReader.Read(_temp.WriteBytes("p.csv", bytes));

        // Independent of the reader: the platform's SHA-256 of the same bytes, lowercase hex.
        Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(bytes)), load.Sha256);
        Assert.Matches("^[0-9a-f]{64}$", load.Sha256);
    }

    [Fact]
    public void Read_File_IsNotModifiedAndCanBeReadWhileOthersReadIt()
    {
        var path = _temp.Write("p.csv", Ohlc);
        var before = File.ReadAllBytes(path);
        var stamp = File.GetLastWriteTimeUtc(path);

        using (var other = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read))
        {
            PriceFileReader.Read(path);
        }

        Assert.Equal(before, File.ReadAllBytes(path));
        Assert.Equal(stamp, File.GetLastWriteTimeUtc(path));
        Assert.Single(Directory.GetFiles(_temp.Path)); // nothing written beside the input
    }

    [Theory]
    // Typical export header: capitalised, "Adj Close" with a space, volume.
    [InlineData("Date,Open,High,Low,Close,Adj Close,Volume")]
    // snake_case.
    [InlineData("date,open,high,low,close,adj_close,volume")]
    // Pascal case, upper case and spaces around names.
    [InlineData(" DATE , Open ,HIGH, low ,Close,AdjClose , VOLUME")]
    // Spelled out, with a hyphen.
    [InlineData("date,open,high,low,close,Adjusted-Close,volume")]
    // Columns in another order.
    [InlineData("volume,close,low,high,open,adj_close,date")]
    public void Read_HeaderSpellingsAndOrders_AreAccepted(string header)
    {
        string[] names = [.. header.Split(',').Select(n => HeaderKey(n))];
        var rows = new[]
        {
            ("2024-01-02", "100", "101", "99", "100.5", "100.5", "1000"),
            ("2024-01-03", "100.5", "102", "100", "101", "101", "1200"),
        };
        var sb = new StringBuilder(header).Append('\n');
        foreach (var r in rows)
        {
            var cells = names.Select(n => n switch
            {
                "date" => r.Item1,
                "open" => r.Item2,
                "high" => r.Item3,
                "low" => r.Item4,
                "close" => r.Item5,
                "adjclose" or "adjustedclose" => r.Item6,
                _ => r.Item7,
            });
            sb.Append(string.Join(',', cells)).Append('\n');
        }

        var load = ReadText(sb.ToString());

        Assert.True(load.AdjustedCloseApplied);
        Assert.Empty(load.Warnings);
        Assert.Equal([100, 100.5], load.History.Open.ToArray());
        Assert.Equal([101, 102], load.History.High.ToArray());
        Assert.Equal([99, 100], load.History.Low.ToArray());
        Assert.Equal([100.5, 101], load.History.Close.ToArray());
    }

    private static string HeaderKey(string name) =>
        new([.. name.Trim().ToLowerInvariant().Where(c => c is not (' ' or '_' or '-'))]);

    [Fact]
    public void Read_QuotedCellsAndSpacesAroundValues_AreAccepted()
    {
        var load = ReadText("\"date\",\"close\"\n\"2024-01-02\", 100.5 \n 2024-01-03 ,\"101\"\n");
        Assert.Equal([100.5, 101], load.History.Close.ToArray());
    }

    [Fact]
    public void Read_ExponentNotation_IsAccepted()
    {
        var load = ReadText("date,close\n2024-01-02,1.005e2\n2024-01-03,1E2\n");
        Assert.Equal([100.5, 100], load.History.Close.ToArray());
    }

    [Fact]
    public void Read_OtherColumns_AreIgnoredWithOneWarningListingThem()
    {
        var load = ReadText("date,symbol,open,high,low,close,note\n2024-01-02,XYZ,100,101,99,100.5,hello\n2024-01-03,XYZ,100.5,102,100,101,\n");

        var warning = Assert.Single(load.Warnings);
        Assert.Equal(1, warning.Line);
        Assert.Contains("'symbol', 'note'", warning.Message, StringComparison.Ordinal);
        Assert.Equal([100.5, 101], load.History.Close.ToArray());
    }

    [Fact]
    public void Read_TrailingCommasInHeader_AreCountedAsUnnamedColumns()
    {
        var load = ReadText("date,close,,\n2024-01-02,100,,\n");
        Assert.Equal("ignored column(s) not used by VolCast: 2 unnamed column(s).", Assert.Single(load.Warnings).Message);
    }

    [Fact]
    public void Read_OneRow_IsAValidHistory()
    {
        var load = ReadText("date,open,high,low,close\n2024-01-02,100,101,99,100.5\n");
        Assert.Equal(1, load.History.Count);
    }

    [Fact]
    public void Read_HundredYearHistory_LoadsEveryWeekday()
    {
        // 1925-01-01 .. 2024-12-31, weekdays only: about 26,000 rows (a 100-year history).
        var sb = new StringBuilder("date,open,high,low,close,adj_close,volume\n");
        var count = 0;
        foreach (var d in Weekdays.Between(new DateOnly(1925, 1, 1), new DateOnly(2024, 12, 31)))
        {
            var c = 100 + (count % 17);
            sb.Append(System.Globalization.CultureInfo.InvariantCulture, $"{d:yyyy-MM-dd},{c},{c + 1},{c - 1},{c},{c * 0.5},1000\n");
            count++;
        }

        var load = ReadText(sb.ToString());

        Assert.Equal(count, load.RowsRead);
        Assert.Equal(count, load.History.Count);
        Assert.Empty(load.Warnings);
        Assert.Equal(new DateOnly(2024, 12, 31), load.History.Dates[^1]);
    }

    [Fact]
    public void Read_AdjClose_ScalesOpenHighLowCloseByAdjOverClose()
    {
        // Hand-computed. Row 1: f = 25.5 / 51 = 0.5 exactly, so O,H,L,C = 50,52,49,51 → 25, 26, 24.5, 25.5.
        // Row 2: f = 20 / 40 = 0.5 → 20.5, 21, 19.5, 20. Row 3: f = 1 (no adjustment) → as written.
        const string text =
            "date,open,high,low,close,adj_close\n" +
            "2024-01-02,50,52,49,51,25.5\n" +
            "2024-01-03,41,42,39,40,20\n" +
            "2024-01-04,40,41,39.5,40.5,40.5\n";

        var load = ReadText(text);

        Assert.True(load.AdjustedCloseApplied);
        Assert.Equal([25, 20.5, 40], load.History.Open.ToArray());
        Assert.Equal([26, 21, 41], load.History.High.ToArray());
        Assert.Equal([24.5, 19.5, 39.5], load.History.Low.ToArray());
        Assert.Equal([25.5, 20, 40.5], load.History.Close.ToArray());
    }

    [Fact]
    public void Read_AdjCloseWithInexactFactor_MatchesHandComputedValues()
    {
        // Hand-computed: f = 10 / 30 = 1/3; O = 33 → 11, H = 36 → 12, L = 27 → 9, C = 30 → 10 (to rounding).
        var load = ReadText("date,open,high,low,close,adj_close\n2024-01-02,33,36,27,30,10\n");

        Assert.Equal(11, load.History.Open[0], 1e-12);
        Assert.Equal(12, load.History.High[0], 1e-12);
        Assert.Equal(9, load.History.Low[0], 1e-12);
        Assert.Equal(10, load.History.Close[0], 1e-12);
    }

    [Fact]
    public void Read_BarTouchingItsRangeWithAdjClose_StaysConsistentAfterScaling()
    {
        // low == open == close and high == close: scaling by one factor must keep low <= close <= high exactly.
        var load = ReadText("date,open,high,low,close,adj_close\n2024-01-02,7.3,7.3,7.3,7.3,2.9\n2024-01-03,7.1,7.3,7.1,7.3,2.9\n");
        Assert.Equal(load.History.Low[0], load.History.Close[0]);
        Assert.Equal(load.History.High[1], load.History.Close[1]);
    }

    [Fact]
    public void Read_CloseOnlyFile_GivesACloseOnlyHistory()
    {
        var load = ReadText("Date,Close\n2024-01-02,100.5\n2024-01-03,101\n");

        Assert.False(load.History.HasRange);
        Assert.Equal([100.5, 101], load.History.Close.ToArray());
        Assert.Throws<InvalidOperationException>(() => load.History.Open.Length);
    }

    [Fact]
    public void Read_CloseOnlyWithAdjClose_UsesTheAdjustedClose()
    {
        // Hand-computed: close × (adj / close) = adj: 50, 51.
        var load = ReadText("date,close,adj_close\n2024-01-02,100,50\n2024-01-03,102,51\n");

        Assert.True(load.AdjustedCloseApplied);
        Assert.Equal([50, 51], load.History.Close.ToArray());
    }

    [Fact]
    public void Read_UnsortedRows_AreSortedWithOneCountedWarning()
    {
        const string text =
            "date,close\n" +
            "2024-01-04,102\n" + // line 2
            "2024-01-02,100\n" + // line 3: before the row above
            "2024-01-03,101\n" +
            "2024-01-08,104\n" +
            "2024-01-05,103\n";  // line 6: before the row above
        var load = ReadText(text);

        Assert.Equal(
            [new DateOnly(2024, 1, 2), new DateOnly(2024, 1, 3), new DateOnly(2024, 1, 4), new DateOnly(2024, 1, 5), new DateOnly(2024, 1, 8)],
            load.History.Dates.ToArray());
        Assert.Equal([100, 101, 102, 103, 104], load.History.Close.ToArray());
        var warning = Assert.Single(load.Warnings);
        Assert.Equal(3, warning.Line);
        Assert.Contains("2 row(s) dated before the row above them", warning.Message, StringComparison.Ordinal);
        Assert.Contains("sorted by date", warning.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_GapsOfMoreThanTenCalendarDays_OneWarningPerGap()
    {
        const string text =
            "date,close\n" +
            "2024-01-02,100\n" +
            "2024-01-12,101\n" + // 10 days: no warning
            "2024-01-23,102\n" + // 11 days: warning, line 4
            "2024-01-24,103\n" +
            "2024-03-01,104\n";  // 37 days: warning, line 6
        var load = ReadText(text);

        Assert.Equal(2, load.Warnings.Count);
        Assert.Equal(4, load.Warnings[0].Line);
        Assert.Contains("gap of 11 calendar days between 2024-01-12 (line 3) and 2024-01-23 (line 4)", load.Warnings[0].Message, StringComparison.Ordinal);
        Assert.Equal(6, load.Warnings[1].Line);
        Assert.Contains("gap of 37 calendar days", load.Warnings[1].Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_FiveIdenticalClosesInARow_WarnsStale()
    {
        var rows = string.Concat(Enumerable.Range(2, 5).Select(d => $"2024-01-0{d},100\n"));
        var load = ReadText("date,close\n2024-01-01,99\n" + rows + "2024-01-09,101\n");

        var warning = Assert.Single(load.Warnings);
        Assert.Equal(3, warning.Line);
        Assert.Contains("stays at 100 for 5 rows in a row", warning.Message, StringComparison.Ordinal);
        Assert.Contains("(line 3) to 2024-01-06 (line 7)", warning.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_FourIdenticalClosesInARow_NoWarning()
    {
        var rows = string.Concat(Enumerable.Range(2, 4).Select(d => $"2024-01-0{d},100\n"));
        var load = ReadText("date,close\n2024-01-01,99\n" + rows + "2024-01-08,101\n");
        Assert.Empty(load.Warnings);
    }

    [Fact]
    public void Read_BlankLinesAnywhere_AreSkippedAndLinesStayPhysical()
    {
        var load = ReadText("\ndate,close\n2024-01-02,100\n\n,\n   \n2024-01-03,101\n\n\n\n");
        Assert.Equal(2, load.RowsRead);
        Assert.Equal([100, 101], load.History.Close.ToArray());

        var error = Refuse("\ndate,close\n2024-01-02,100\n\n\n2024-01-03,abc\n");
        Assert.Equal(6, error.Line); // physical line, blank lines counted
    }

    [Fact]
    public void Read_TrailingEmptyCells_AreAccepted()
    {
        var load = ReadText("date,close\n2024-01-02,100,\n2024-01-03,101,,\n");
        Assert.Equal([100, 101], load.History.Close.ToArray());
    }

    [Fact]
    public void Read_VolumeBlankOrFractional_IsAccepted()
    {
        var load = ReadText("date,close,volume\n2024-01-02,100,\n2024-01-03,101,1.5e6\n");
        Assert.Equal(2, load.RowsRead);
    }

    [Fact]
    public void Read_MissingFile_SaysFileNotFoundWithThePath()
    {
        var path = _temp.Combine("nope.csv");
        var error = Assert.Throws<InputDataException>(() => PriceFileReader.Read(path));

        Assert.Equal(path, error.File);
        Assert.Null(error.Line);
        Assert.Contains(path, error.Message, StringComparison.Ordinal);
        Assert.Contains("file not found", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_Folder_IsRefusedAsNotAFile()
    {
        var error = Assert.Throws<InputDataException>(() => PriceFileReader.Read(_temp.Path));
        Assert.Contains("folder, not a file", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_EmptyPath_IsAnInputError()
    {
        var error = Assert.Throws<InputDataException>(() => PriceFileReader.Read(" "));
        Assert.Contains("file not found", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_Error_MessageNamesFileLineColumnValueAndExpectation()
    {
        var error = Refuse(Ohlc + "2024-01-05,102,104,101,1o3\n", "my prices.csv");

        Assert.Equal("my prices.csv", error.File);
        Assert.Equal(5, error.Line);
        Assert.Equal("close", error.Column);
        Assert.Equal("my prices.csv, line 5, column 'close': '1o3' is not a number; expected a price above zero, such as 101.25, written with '.' as the decimal point and no thousands separators.", error.Message);
    }

    [Fact]
    public void Read_SeveralBadCellsInARow_ReportsTheFirstInOpenHighLowCloseOrder()
    {
        var error = Refuse("date,close,open,high,low\n2024-01-02,bad,worse,101,99\n");
        Assert.Equal("open", error.Column);
    }

    [Fact]
    public void Read_ErrorColumn_IsTheHeaderNameAsWritten()
    {
        var error = Refuse("Date,Open,High,Low,Close\n2024-01-02,100,101,99,x\n");
        Assert.Equal("Close", error.Column);
    }

    [Fact]
    public void Read_DuplicateDateAfterSortingWouldBeAdjacent_StillNamesBothLines()
    {
        var error = Refuse("date,close\n2024-01-03,100\n2024-01-02,101\n2024-01-03,102\n");
        Assert.Equal(4, error.Line);
        Assert.Contains("on line 2 and line 4", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_HostileCellText_IsShortenedAndControlCharactersEscaped()
    {
        var error = Refuse("date,close\n2024-01-02,\u001b[31m" + new string('9', 100) + "x\n");
        Assert.DoesNotContain("\u001b", error.Message, StringComparison.Ordinal);
        Assert.Contains("\\u001B", error.Message, StringComparison.Ordinal);
        Assert.Contains("(106 characters)", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_InvisibleOrDirectionChangingCharacters_AreEscapedInMessages()
    {
        // U+202E (right-to-left override) and U+200B (zero-width space) would hide or reorder text in a terminal.
        var error = Refuse("date,close\n2024-01-02,1\u202e00\u200b\n");
        Assert.Contains("'1\\u202E00\\u200B'", error.Message, StringComparison.Ordinal);
    }
}
