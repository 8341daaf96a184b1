using VolCast.Core.Backtest;

namespace VolCast.IO.Tests;

// Invented files for each rule (common practice, no source).
public sealed class EventsFileReaderTests : IDisposable
{
    private readonly TempFolder _temp = new();

    public void Dispose() => _temp.Dispose();

    private InputBytes File(string text) => InputBytes.Read(_temp.Write("events.csv", text));

    [Fact]
    public void Read_DatesKindsAndScheduled_ReadsEachRowAndTreatsAMissingScheduledAsAddedAfterTheFact()
    {
        var events = EventsFileReader.Read(File("date,kind,scheduled\n2024-01-31,central-bank,yes\n2024-02-05,earnings,true\n\n2024-03-01,crash,\n2024-03-04\n"));

        Assert.Equal(
            [
                new MarketEvent(new DateOnly(2024, 1, 31), "central-bank", true),
                new MarketEvent(new DateOnly(2024, 2, 5), "earnings", true),
                new MarketEvent(new DateOnly(2024, 3, 1), "crash", false),
                new MarketEvent(new DateOnly(2024, 3, 4), null, false),
            ],
            events.ToArray());
    }

    [Fact]
    public void Read_UnparseableDate_NamesFileLineAndColumn()
    {
        var error = Assert.Throws<InputDataException>(() => EventsFileReader.Read(File("date,kind\n2024-01-31,earnings\n31/01/2024,earnings\n")));

        Assert.EndsWith("events.csv", error.File, StringComparison.Ordinal);
        Assert.Equal(3, error.Line);
        Assert.Equal("date", error.Column);
        Assert.Contains("yyyy-MM-dd", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_BadScheduledOrNoDateColumn_IsRefused()
    {
        var scheduled = Assert.Throws<InputDataException>(() => EventsFileReader.Read(File("date,scheduled\n2024-01-31,maybe\n")));
        Assert.Equal(2, scheduled.Line);
        Assert.Equal("scheduled", scheduled.Column);

        var header = Assert.Throws<InputDataException>(() => EventsFileReader.Read(File("day,kind\n2024-01-31,earnings\n")));
        Assert.Equal(1, header.Line);
    }

    [Fact]
    public void Read_QuotedCellsAnyColumnOrderAndCase_ReadsTheKindWithItsComma()
    {
        // RFC 4180 quoting (https://www.rfc-editor.org/rfc/rfc4180, section 2, rules 5 and 6): a quoted cell may hold the delimiter.
        var events = EventsFileReader.Read(File("\uFEFFKind,Scheduled,Date\n\"central bank, rate decision\",yes,\"2024-01-31\"\n\n  \n\"earnings\",no,2024-02-05\n"));

        Assert.Equal(
            [new MarketEvent(new DateOnly(2024, 1, 31), "central bank, rate decision", true), new MarketEvent(new DateOnly(2024, 2, 5), "earnings", false)],
            events.ToArray());
    }

    [Fact]
    public void Read_TheSameEventTwice_IsOneEvent()
    {
        var events = EventsFileReader.Read(File("date,kind\n2024-01-31,earnings\n2024-02-05,earnings\n2024-01-31,earnings\n"));

        Assert.Equal([new DateOnly(2024, 1, 31), new DateOnly(2024, 2, 5)], events.Select(e => e.Date).ToArray());
    }

    [Fact]
    public void Read_TheSameDateWithAnotherKind_IsRefusedNamingBothLines()
    {
        var error = Assert.Throws<InputDataException>(() => EventsFileReader.Read(File("date,kind\n2024-01-31,earnings\n2024-02-05,earnings\n2024-01-31,central-bank\n")));

        Assert.Equal(4, error.Line);
        Assert.Equal("kind", error.Column);
        Assert.Contains("line 2", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_TheSameDateScheduledOnceAndNotOnce_IsRefusedAtTheScheduledColumn()
    {
        var error = Assert.Throws<InputDataException>(() => EventsFileReader.Read(File("date,kind,scheduled\n2024-01-31,earnings,yes\n2024-01-31,earnings,no\n")));

        Assert.Equal(3, error.Line);
        Assert.Equal("scheduled", error.Column);
    }

    [Fact]
    public void Read_ADateOutsideThePrices_IsRefusedWithItsLine()
    {
        DateOnly[] prices = [new(2024, 1, 2), new(2024, 1, 3), new(2024, 6, 28)];

        var after = Assert.Throws<InputDataException>(() => EventsFileReader.Read(File("date\n2024-03-20\n2025-03-20\n"), CsvFormat.Default, prices));
        var before = Assert.Throws<InputDataException>(() => EventsFileReader.Read(File("date\n2023-12-29\n"), CsvFormat.Default, prices));

        Assert.Equal((3, "date"), (after.Line, after.Column));
        Assert.Contains("after the prices (2024-01-02 to 2024-06-28)", after.Message, StringComparison.Ordinal);
        Assert.Equal(2, before.Line);
        Assert.Contains("before the prices", before.Message, StringComparison.Ordinal);

        // A weekend date inside the prices' span is kept: the window that covers it holds it.
        Assert.Single(EventsFileReader.Read(File("date\n2024-03-23\n"), CsvFormat.Default, prices));
    }

    [Fact]
    public void Read_AFaultOfTheFile_IsReportedBeforeADateOutsideThePrices()
    {
        DateOnly[] prices = [new(2024, 1, 2), new(2024, 6, 28)];

        var error = Assert.Throws<InputDataException>(() => EventsFileReader.Read(File("date\n2030-01-01\nMarch 18\n"), CsvFormat.Default, prices));

        Assert.Equal(3, error.Line);
    }

    [Fact]
    public void Read_ACommentLine_IsRefusedLikeInEveryOtherInputFile()
    {
        var error = Assert.Throws<InputDataException>(() => EventsFileReader.Read(File("date,kind\n# earnings dates\n2024-01-31,earnings\n")));

        Assert.Equal((2, "date"), (error.Line, error.Column));
        Assert.Contains("no comment lines", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_MalformedQuoting_NamesLineAndColumn()
    {
        var error = Assert.Throws<InputDataException>(() => EventsFileReader.Read(File("date,kind\n2024-01-31,\"earnings\n")));

        Assert.Equal(2, error.Line);
    }

    [Fact]
    public void Read_TheRunsCsvForm_ReadsSemicolonsAndDayFirstDates()
    {
        var format = CsvFormat.Parse("dd.MM.yyyy", ";", ",", key => key);

        var events = EventsFileReader.Read(File("date;kind\n31.01.2024;earnings\n"), format, []);

        Assert.Equal(new MarketEvent(new DateOnly(2024, 1, 31), "earnings", false), Assert.Single(events));
    }
}
