using ScottPlot.Plottables;
using VolCast.IO.Results;
using VolCast.Reports.Batch;
using VolCast.Reports.Charts;
using VolCast.Reports.Tests.Support;

namespace VolCast.Reports.Tests.Batch;

public sealed class BatchChartsTests
{
    private static BatchAssetRow Row(string name, double? premium) => new()
    {
        Name = name,
        Succeeded = true,
        HasImplied = premium is not null,
        Dates = 700,
        MeanPremium = premium,
    };

    [Fact]
    public void PremiumByName_HorizontalBarsSortedByPremium_WithFullNamesOnTheYAxis()
    {
        BatchAssetRow[] rows =
        [
            Row("aspen-hollow", 0.0165),
            Row("cedar-falls-long-name", -0.003),
            Row("no-implied", null),
            Row("granite-peak", 0.081),
            Row("basalt-cove", 0.0335),
        ];

        using var plot = BatchCharts.BuildPremiumByName(rows, out var names);

        // Lowest at the bottom (position 0), highest at the top; the name without implied is left out.
        Assert.Equal(4, names);
        var bars = Assert.Single(plot.GetPlottables().OfType<BarPlot>());
        Assert.All(bars.Bars, b => Assert.Equal(ScottPlot.Orientation.Horizontal, b.Orientation));
        Assert.Equal([-0.3, 1.65, 3.35, 8.1], bars.Bars.OrderBy(b => b.Position).Select(b => Math.Round(b.Value, 9)).ToArray());
        _ = plot.GetImageBytes(1200, 600, ScottPlot.ImageFormat.Png); // ticks are laid out when the plot is drawn
        var ticks = plot.Axes.Left.TickGenerator.Ticks.OrderBy(t => t.Position).Select(t => t.Label).ToArray();
        Assert.Equal(["cedar-falls-long-name", "aspen-hollow", "basalt-cove", "granite-peak"], ticks);
        Assert.Equal("Implied − realized (vol points)", plot.Axes.Bottom.Label.Text);
        Assert.All(bars.Bars, b => Assert.Equal(ChartStyle.Implied, b.FillColor));
    }

    [Fact]
    public void PremiumByName_ManyNames_GrowsTallerSoEachNameKeepsItsRow()
    {
        var rows = Enumerable.Range(0, 60).Select(i => Row($"name-{i:00}", i / 1000.0)).ToArray();

        var chart = BatchCharts.PremiumByName(rows);

        Assert.Equal((1200, BatchCharts.PremiumHeight(60)), Png.Size(chart.Png.Span));
        Assert.True(BatchCharts.PremiumHeight(60) >= 60 * BatchCharts.RowHeight);
        Assert.Equal(600, BatchCharts.PremiumHeight(5));
    }
}
