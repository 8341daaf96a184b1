using ScottPlot;
using ScottPlot.Plottables;
using VolCast.Reports.Charts;
using VolCast.Reports.Model;
using VolCast.Reports.Tests.Support;

namespace VolCast.Reports.Tests.Charts;

/// <summary>
/// One colour map for the whole report: each series keeps its colour in every chart, reference lines are grey, and
/// every axis says what it measures and in which unit. Checked on the plots' data, not on pixels.
/// </summary>
public sealed class ChartColourMapTests
{
    private static readonly SampleReport Sample = SampleReport.Create(days: 1500, seed: 9);

    // Okabe and Ito (2008), "Color Universal Design": orange E69F00, yellow F0E442 (the one left out), black.
    private static readonly Color Orange = Color.FromHex("#E69F00");
    private static readonly Color Yellow = Color.FromHex("#F0E442");
    private static readonly Color Black = Color.FromHex("#000000");

    private static readonly string[] Specs = ["ewma:0.94", "ewma:0.99", "garch", "gjr-garch", "yang-zhang:21", "adaptive:yang-zhang", "adaptive:close-to-close", "adaptive:parkinson"];

    /// <summary>Every chart of the sample report, built with one map, as plots.</summary>
    private static List<Plot> Plots(SeriesColors colors)
    {
        var reliability = new[]
        {
            new ReliabilityCurve("implied", [0.2, 0.7], [0.25, 0.66], [0.1, 0.5], [0.4, 0.8], [30, 30]),
            new ReliabilityCurve("garch", [0.2, 0.7], [0.22, 0.7], [0.1, 0.55], [0.35, 0.85], [30, 30]),
            new ReliabilityCurve("ewma:0.94", [0.3], [0.3], [0.2], [0.4], [60]),
        };
        return
        [
            ReportCharts.BuildForecastVsRealized(Sample.Realized, Sample.Implied, Sample.Forecasts, colors),
            ReportCharts.BuildCumulativeLossDifferential(Sample.LossDifferentials, colors),
            ReportCharts.BuildLossVsLookback(Sample.Lookbacks, colors),
            ReportCharts.BuildMincerZarnowitz("garch", Sample.ForecastVariance, Sample.RealizedVariance, 0.004, 0.92, colors),
            ReportCharts.BuildCone(Sample.Cone, Sample.Overlays, colors),
            ReportCharts.BuildRuleTest(Sample.PremiumAll, Sample.PremiumSignalled, "sell when implied > ewma:0.94 + 2 pts", "ewma:0.94", 0.03, colors),
            ReportCharts.BuildReliability(reliability, "pooled over strikes", colors),
            ReportCharts.BuildPremium(Sample.Premium),
        ];
    }

    /// <summary>The colour of every named series in a plot: lines, point sets and markers.</summary>
    private static IEnumerable<(string Name, Color Color)> Named(Plot plot)
    {
        foreach (var p in plot.GetPlottables())
        {
            switch (p)
            {
                case Scatter s when s.LegendText.Length > 0:
                    yield return (s.LegendText, s.Color.WithAlpha(1.0));
                    break;
                case Marker m when m.LegendText.Length > 0:
                    yield return (m.LegendText, m.Color.WithAlpha(1.0));
                    break;
                case ConeMarkers c:
                    foreach (var m in c.Markers)
                    {
                        yield return (m.LegendText, m.Color.WithAlpha(1.0));
                    }

                    break;
            }
        }
    }

    [Fact]
    public void EverySeries_HasOneColourInEveryChart()
    {
        var colors = new SeriesColors(Specs);
        var plots = Plots(colors);
        try
        {
            var seen = new Dictionary<string, Color>();
            var charts = new Dictionary<string, int>();
            foreach (var plot in plots)
            {
                foreach (var (name, color) in Named(plot))
                {
                    // Lookback curves are named by family and drawn in the colour of that family's adaptive forecaster.
                    var key = Sample.Lookbacks.Any(c => c.Family == name) ? "adaptive:" + name : name;
                    if (seen.TryGetValue(key, out var first))
                    {
                        Assert.True(first == color, $"'{key}' is {color.ToHex()} in one chart and {first.ToHex()} in another.");
                    }

                    seen[key] = color;
                    charts[key] = charts.GetValueOrDefault(key) + 1;
                    if (Specs.Contains(key))
                    {
                        Assert.Equal(colors.Style(key).Color, color);
                    }
                }
            }

            // The forecasters the sample draws more than once were compared across charts, not merely once.
            Assert.True(charts["ewma:0.94"] >= 4, $"ewma:0.94 appears in {charts["ewma:0.94"]} charts");
            Assert.True(charts["garch"] >= 4, $"garch appears in {charts["garch"]} charts");

            // Implied is orange and realized black wherever they are drawn (forecast chart, reliability, cone).
            Assert.All(seen.Where(p => p.Key.StartsWith("implied", StringComparison.Ordinal) && !p.Key.Contains('−', StringComparison.Ordinal)), p => Assert.Equal(Orange, p.Value));
            Assert.Equal(Black, seen[Sample.Realized.Name]);
            Assert.Equal(Black, seen[ReportCharts.ConeLatest]);
            Assert.Equal(Orange, seen[Sample.Premium.Name]);

            // No thin line or marker anywhere is yellow on white.
            Assert.DoesNotContain(Yellow, seen.Values);
        }
        finally
        {
            plots.ForEach(p => p.Dispose());
        }
    }

    [Fact]
    public void Garch_AndGjrGarch_AreDifferentHues()
    {
        var colors = new SeriesColors(Specs);

        Assert.NotEqual(colors.Style("garch").Color, colors.Style("gjr-garch").Color);
    }

    [Fact]
    public void ForecastersSharingAHue_DifferInLinePatternAndMarker()
    {
        var colors = new SeriesColors(Specs);

        var styles = Specs.Select(colors.Style).ToArray();
        foreach (var group in styles.GroupBy(s => s.Color))
        {
            Assert.Equal(group.Count(), group.Select(s => s.Pattern.Name).Distinct().Count());
            Assert.Equal(group.Count(), group.Select(s => s.Marker).Distinct().Count());
        }

        // ewma:0.94 and ewma:0.99 are one family: one hue, two patterns.
        Assert.Equal(colors.Style("ewma:0.94").Color, colors.Style("ewma:0.99").Color);
        Assert.NotEqual(colors.Style("ewma:0.94").Pattern.Name, colors.Style("ewma:0.99").Pattern.Name);
    }

    [Fact]
    public void ReferenceLines_AreGrey()
    {
        var plots = Plots(new SeriesColors(Specs));
        try
        {
            foreach (var plot in plots)
            {
                foreach (var line in plot.GetPlottables().OfType<LinePlot>().Where(l => l.LegendText.StartsWith("y = x", StringComparison.Ordinal)))
                {
                    Assert.Equal(ChartStyle.Reference, line.Color);
                }

                foreach (var zero in plot.GetPlottables().OfType<AxisLine>())
                {
                    if (zero is HorizontalLine { Y: 0 } or VerticalLine { X: 0 })
                    {
                        Assert.Equal(ChartStyle.Reference, zero.Color);
                    }
                }
            }
        }
        finally
        {
            plots.ForEach(p => p.Dispose());
        }
    }

    [Fact]
    public void EveryAxis_NamesItsQuantityAndUnit()
    {
        var plots = Plots(new SeriesColors(Specs));
        try
        {
            foreach (var plot in plots)
            {
                foreach (var axis in new IAxis[] { plot.Axes.Bottom, plot.Axes.Left })
                {
                    var label = axis.Label.Text;
                    Assert.False(string.IsNullOrWhiteSpace(label), $"an axis of '{plot.Axes.Title.Label.Text}' has no label");
                    Assert.DoesNotContain("decimal²", label, StringComparison.Ordinal);
                    Assert.DoesNotContain("vol points, %", label, StringComparison.Ordinal);

                    // A date axis names the dates; every other axis gives its unit in parentheses.
                    Assert.True(label.Contains("date", StringComparison.OrdinalIgnoreCase) || label.Contains('(', StringComparison.Ordinal), $"'{label}' gives no unit");
                }
            }

            Assert.Equal("Forecast variance F² (annualized, %², log scale)", plots[3].Axes.Bottom.Label.Text);
            Assert.Equal("Realized variance RV² (annualized, %², log scale)", plots[3].Axes.Left.Label.Text);
            Assert.Equal("Horizon (trading days, log scale)", plots[4].Axes.Bottom.Label.Text);
            Assert.Equal("Lookback (trading days, log scale)", plots[2].Axes.Bottom.Label.Text);
            Assert.Equal("Implied − realized (vol points)", plots[5].Axes.Bottom.Label.Text);
        }
        finally
        {
            plots.ForEach(p => p.Dispose());
        }
    }

    [Fact]
    public void ImageTitle_IsTheCaptionTitle()
    {
        var charts = Sample.Charts();
        var titles = new[]
        {
            ReportCharts.ForecastTitle, ReportCharts.PremiumTitle, ReportCharts.CumulativeTitle, ReportCharts.LookbackTitle,
            ReportCharts.MincerZarnowitzTitle("ewma:0.94"), ReportCharts.ConeTitle, ReportCharts.RuleTestTitle,
        };

        Assert.Equal(titles, charts.Select(c => c.Title));
        using var plot = ReportCharts.BuildCone(Sample.Cone, Sample.Overlays);
        Assert.Equal(ReportCharts.ConeTitle, plot.Axes.Title.Label.Text);
        using var mz = ReportCharts.BuildMincerZarnowitz("ewma:0.94", Sample.ForecastVariance, Sample.RealizedVariance, 0.004, 0.92);
        Assert.Equal(ReportCharts.MincerZarnowitzTitle("ewma:0.94"), mz.Axes.Title.Label.Text);
    }
}
