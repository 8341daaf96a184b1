using System.Globalization;
using ScottPlot;
using VolCast.Core.Numerics;
using VolCast.IO.Results;
using VolCast.Reports.Charts;
using VolCast.Reports.Model;

namespace VolCast.Reports.Batch;

/// <summary>The summary's charts: the distribution of Diebold-Mariano statistics against implied, and the volatility premium by name.</summary>
internal static class BatchCharts
{
    public static ChartImage DmDistribution(IReadOnlyList<BatchAssetRow> rows)
    {
        var stats = rows.SelectMany(r => r.VersusImplied).Select(t => t.Statistic).Where(double.IsFinite).ToArray();
        var plot = ChartStyle.NewPlot("Diebold-Mariano statistics against implied, every forecaster and name", "DM statistic on QLIKE (below 0: forecaster better)", "Share of tests (%)");
        if (stats.Length > 0)
        {
            var low = Math.Min(stats.Min(), -2.5);
            var high = Math.Max(stats.Max(), 2.5);
            const int bins = 24;
            var width = (high - low) / bins;
            var shares = new double[bins];
            foreach (var s in stats)
            {
                shares[Math.Clamp((int)Math.Floor((s - low) / width), 0, bins - 1)] += 100.0 / stats.Length;
            }

            var bars = new List<Bar>(bins);
            for (var i = 0; i < bins; i++)
            {
                bars.Add(new Bar { Position = low + ((i + 0.5) * width), Value = shares[i], Size = width * 0.95, FillColor = ChartStyle.Series(0) });
            }

            plot.Add.Bars(bars);
        }

        foreach (var x in new[] { -StandardNormal.Z95, StandardNormal.Z95 })
        {
            var line = plot.Add.VerticalLine(x);
            line.Color = ChartStyle.Reference;
            line.LinePattern = LinePattern.Dashed;
            line.LineWidth = 1.5f;
        }

        plot.Axes.Margins(0.02, 0.05);
        return new ChartImage(
            "batch-dm-distribution.png",
            "Distribution of Diebold-Mariano statistics",
            string.Create(CultureInfo.InvariantCulture, $"{stats.Length} tests of a forecaster against implied on QLIKE, one per forecaster and name; dashed lines at ±1.96 (the 5% two-sided level of one test, before any correction for many names)."),
            ChartStyle.Png(plot));
    }

    public static ChartImage PremiumByName(IReadOnlyList<BatchAssetRow> rows)
    {
        var withPremium = rows.Where(r => r.MeanPremium is not null).ToArray();
        var plot = ChartStyle.NewPlot("Mean implied minus realized volatility by name", "Name", "Implied − realized (vol points, %)");
        var bars = new List<Bar>(withPremium.Length);
        var ticks = new Tick[withPremium.Length];
        for (var i = 0; i < withPremium.Length; i++)
        {
            var value = withPremium[i].MeanPremium!.Value * 100.0;
            bars.Add(new Bar { Position = i, Value = value, FillColor = value >= 0 ? ChartStyle.Series(1) : ChartStyle.Series(4) });
            ticks[i] = new Tick(i, withPremium[i].Name);
        }

        if (bars.Count > 0)
        {
            plot.Add.Bars(bars);
        }

        plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericManual(ticks);
        plot.Axes.Bottom.TickLabelStyle.Rotation = withPremium.Length > 12 ? 60 : 0;
        plot.Axes.Bottom.TickLabelStyle.Alignment = withPremium.Length > 12 ? Alignment.MiddleLeft : Alignment.UpperCenter;
        var zero = plot.Add.HorizontalLine(0);
        zero.Color = ChartStyle.Reference;
        zero.LineWidth = 1;
        plot.Axes.Margins(0.02, 0.08);
        return new ChartImage(
            "batch-premium-by-name.png",
            "Volatility premium by name",
            string.Create(CultureInfo.InvariantCulture, $"Mean of implied minus the realized volatility that followed, over the dates with both, for the {withPremium.Length} names with an implied file; above 0 implied was higher on average."),
            ChartStyle.Png(plot));
    }
}
