using Microsoft.Data.Analysis;
using VolCast.Core.Data;

namespace VolCast.IO.Tests;

public sealed class DataFrameViewsTests
{
    [Fact]
    public void ToDataFrame_OhlcHistory_HasDateAndFourPriceColumns()
    {
        var h = PriceHistory.FromBars(
            [new DateOnly(2024, 1, 2), new DateOnly(2024, 1, 3)],
            [100, 100.5], [101, 102], [99, 100], [100.5, 101]);

        var frame = DataFrameViews.ToDataFrame(h);

        Assert.Equal(["date", "open", "high", "low", "close"], frame.Columns.Select(c => c.Name).ToArray());
        Assert.Equal(2, frame.Rows.Count);
        Assert.Equal(new DateTime(2024, 1, 3), frame.Columns["date"][1]);
        Assert.Equal(102.0, frame.Columns["high"][1]);
        Assert.Equal(100.5, frame.Columns["close"][0]);
    }

    [Fact]
    public void ToDataFrame_CloseOnlyHistory_HasDateAndClose()
    {
        var h = PriceHistory.FromCloses([new DateOnly(2024, 1, 2)], [100.5]);
        var frame = DataFrameViews.ToDataFrame(h);
        Assert.Equal(["date", "close"], frame.Columns.Select(c => c.Name).ToArray());
    }

    [Fact]
    public void ToDataFrame_ImpliedSeries_HasDateAndIv()
    {
        var s = new ImpliedSeries([new DateOnly(2024, 1, 2)], [0.2]);
        var frame = DataFrameViews.ToDataFrame(s);
        Assert.Equal(["date", "iv"], frame.Columns.Select(c => c.Name).ToArray());
        Assert.Equal(0.2, frame.Columns["iv"][0]);
        Assert.IsType<DateTimeDataFrameColumn>(frame.Columns["date"]);
    }
}
