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
}
