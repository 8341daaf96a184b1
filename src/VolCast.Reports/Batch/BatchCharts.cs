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
    /// <summary>The title of the Diebold-Mariano chart, on the image and above its caption.</summary>
    public const string DmTitle = "Diebold-Mariano statistics against implied, every forecaster and name";

    public static ChartImage DmDistribution(IReadOnlyList<BatchAssetRow> rows)
    {
        var stats = rows.SelectMany(r => r.VersusImplied).Select(t => t.Statistic).Where(double.IsFinite).ToArray();
        using var plot = ChartStyle.NewPlot(DmTitle, "DM statistic on QLIKE (below 0: forecaster better)", "Share of tests (%)");
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
                bars.Add(new Bar { Position = low + ((i + 0.5) * width), Value = shares[i], Size = width * 0.95, FillColor = ChartStyle.Neutral });
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
            DmTitle,
            string.Create(CultureInfo.InvariantCulture, $"{stats.Length} tests of a forecaster against implied on QLIKE, one per forecaster and name; dashed lines at ±1.96 (the 5% two-sided level of one test, before any correction for many names)."),
            ChartStyle.Png(plot));
    }

    /// <summary>The title of the premium-by-name chart, on the image and above its caption.</summary>
    public const string PremiumTitle = "Mean implied minus realized volatility by name";

    /// <summary>Height in pixels of each name's row in the premium-by-name chart, so that long lists stay legible.</summary>
    public const int RowHeight = 24;

    public static ChartImage PremiumByName(IReadOnlyList<BatchAssetRow> rows)
    {
        using var plot = BuildPremiumByName(rows, out var names);
        return new ChartImage(
            "batch-premium-by-name.png",
            PremiumTitle,
            string.Create(CultureInfo.InvariantCulture, $"Mean of implied minus the realized volatility that followed, over the dates with both, for the {names} names with an implied file, highest at the top; right of 0 implied was higher on average."),
            ChartStyle.Png(plot, PremiumHeight(names)));
    }

    /// <summary>The chart's height: the report's height, or more when the names need it.</summary>
    public static int PremiumHeight(int names) => Math.Max(ChartStyle.Height, 160 + (RowHeight * names));

    /// <summary>A horizontal bar per name with an implied file, sorted by premium (highest at the top), full names on the y axis.</summary>
    internal static Plot BuildPremiumByName(IReadOnlyList<BatchAssetRow> rows, out int names)
    {
        ArgumentNullException.ThrowIfNull(rows);

        // Lowest first: ScottPlot's y axis rises, so the highest premium ends at the top. Ties keep the names in order.
        var sorted = rows.Where(r => r.MeanPremium is not null).Select((r, i) => (r, i))
            .OrderBy(p => p.r.MeanPremium!.Value).ThenByDescending(p => p.i).Select(p => p.r).ToArray();
        names = sorted.Length;
        var plot = ChartStyle.NewPlot(PremiumTitle, "Implied − realized (vol points)", string.Empty);
        var bars = new List<Bar>(sorted.Length);
        var ticks = new Tick[sorted.Length];
        for (var i = 0; i < sorted.Length; i++)
        {
            // The premium is implied's: its bars are implied's colour, as the premium line in each name's report.
            bars.Add(new Bar { Position = i, Value = sorted[i].MeanPremium!.Value * 100.0, Size = 0.7, FillColor = ChartStyle.Implied, LineWidth = 0 });
            ticks[i] = new Tick(i, sorted[i].Name);
        }

        if (bars.Count > 0)
        {
            var plotted = plot.Add.Bars(bars);
            plotted.Horizontal = true;
        }

        plot.Axes.Left.TickGenerator = new ScottPlot.TickGenerators.NumericManual(ticks);
        plot.Axes.Left.MajorTickStyle.Length = 0;
        var zero = plot.Add.VerticalLine(0);
        zero.Color = ChartStyle.Reference;
        zero.LineWidth = 1;
        plot.Axes.Margins(0.05, 0.02);
        return plot;
    }
}
