using ScottPlot;
using ScottPlot.Plottables;
using VolCast.Reports.Charts;
using VolCast.Reports.Model;
using VolCast.Reports.Tests.Support;

namespace VolCast.Reports.Tests.Charts;

public sealed class ReportChartsTests
{
    private static readonly SampleReport Sample = SampleReport.Create(days: 1500, seed: 9);

    private static Scatter Line(Plot plot, string legend) =>
        plot.GetPlottables().OfType<Scatter>().Single(s => s.LegendText == legend);

    private static void AssertSeries(Scatter line, double[] xs, IReadOnlyList<double> ys)
    {
        var points = line.Data.GetScatterPoints();
        Assert.Equal(xs.Length, points.Count);
        for (var i = 0; i < xs.Length; i++)
        {
            Assert.Equal(xs[i], points[i].X, 9);
            Assert.Equal(ys[i], points[i].Y, 9);
        }
    }

    [Fact]
    public void Charts_AllSeven_ArePngsOfTheFixedSize()
    {
        var charts = Sample.Charts();

        Assert.Equal(7, charts.Count);
        Assert.Equal(charts.Count, charts.Select(c => c.FileName).Distinct().Count());
        foreach (var chart in charts)
        {
            Assert.True(Png.HasSignature(chart.Png.Span), chart.FileName);
            Assert.Equal((1200, 600), Png.Size(chart.Png.Span));
        }
    }

    [Fact]
    public void ChartFont_IsInstalled_SoLabelsRender()
    {
        // Without DejaVu (Debian's fonts-dejavu-core, installed by .ci/run) SkiaSharp falls back to a font that may lack glyphs.
        using var typeface = SkiaSharp.SKTypeface.FromFamilyName("DejaVu Sans");

        Assert.Equal("DejaVu Sans", typeface.FamilyName);
    }

    [Fact]
    public void Charts_SameInput_SameBytes()
    {
        var first = ReportCharts.Cone(Sample.Cone, Sample.Overlays);
        var second = ReportCharts.Cone(Sample.Cone, Sample.Overlays);

        Assert.True(first.Png.Span.SequenceEqual(second.Png.Span));
    }

    [Fact]
    public void ForecastVsRealized_SeriesInPercentOnDates_NamedBySpec()
    {
        using var plot = ReportCharts.BuildForecastVsRealized(Sample.Realized, Sample.Implied, Sample.Forecasts);

        foreach (var series in Sample.Forecasts.Append(Sample.Implied).Append(Sample.Realized))
        {
            // The sample's daily series are longer than a line is drawn point for point, so the chart holds the thinned
            // line (each run's lowest and highest point; ChartPointsTests pins the thinning itself).
            var (xs, ys) = ChartPoints.Line(
                series.Dates.Select(d => d.ToDateTime(TimeOnly.MinValue).ToOADate()).ToArray(),
                series.Values.Select(v => v * 100).ToArray());
            Assert.True(series.Values.Count > xs.Length, "the sample should be long enough to be thinned");
            AssertSeries(Line(plot, series.Name), xs, ys);
        }
    }

    [Fact]
    public void Premium_MeanLineAndBand_MatchTheSeries()
    {
        using var plot = ReportCharts.BuildPremium(Sample.Premium);

        var points = Sample.Premium.Values.Select(v => v * 100).ToArray();
        var mean = points.Average();
        var meanLine = plot.GetPlottables().OfType<HorizontalLine>().Single(l => l.LegendText.StartsWith("mean", StringComparison.Ordinal));
        Assert.Equal(mean, meanLine.Y, 10);
        var sorted = points.Order().ToArray();
        var band = plot.GetPlottables().OfType<VerticalSpan>().Single();
        // R type 7 10th and 90th percentiles, worked out here from the order statistics.
        static double Q(double[] s, double p)
        {
            var g = (s.Length - 1) * p;
            var j = (int)g;
            return s[j] + ((g - j) * (s[j + 1] - s[j]));
        }

        Assert.Equal(Q(sorted, 0.10), band.Bottom, 10);
        Assert.Equal(Q(sorted, 0.90), band.Top, 10);
    }

    [Fact]
    public void CumulativeLossDifferential_PlotsRunningSums()
    {
        var dates = new[] { new DateOnly(2020, 1, 2), new DateOnly(2020, 1, 3), new DateOnly(2020, 1, 6) };
        var series = new TimeSeries("ewma:0.94", dates, [0.5, -1.0, 0.25]);

        using var plot = ReportCharts.BuildCumulativeLossDifferential([series]);

        AssertSeries(Line(plot, "ewma:0.94"), dates.Select(d => d.ToDateTime(TimeOnly.MinValue).ToOADate()).ToArray(), [0.5, -0.5, -0.25]);
    }

    [Fact]
    public void CumulativeLossDifferential_EveryLineStartsOnTheFirstDateTheyShare()
    {
        var early = new DateOnly(2020, 1, 2);
        var dates = new[] { early, new DateOnly(2020, 1, 3), new DateOnly(2020, 1, 6) };
        var longer = new TimeSeries("garch", dates, [5.0, 1.0, 2.0]);
        var shorter = new TimeSeries("yang-zhang:21", dates[1..], [0.5, 0.5]);

        using var plot = ReportCharts.BuildCumulativeLossDifferential([longer, shorter]);

        // garch's value on 2 January is left out: both lines add up from 3 January, the first date yang-zhang:21 has.
        var x = dates[1..].Select(d => d.ToDateTime(TimeOnly.MinValue).ToOADate()).ToArray();
        AssertSeries(Line(plot, "garch"), x, [1.0, 3.0]);
        AssertSeries(Line(plot, "yang-zhang:21"), x, [0.5, 1.0]);
    }

    [Fact]
    public void LossVsLookback_CurvesAndOneMarkerPerDistinctChoice()
    {
        using var plot = ReportCharts.BuildLossVsLookback(Sample.Lookbacks);

        // The horizon axis is a log scale: the curves are drawn at log10 of the lookback, ticks at each lookback swept.
        foreach (var curve in Sample.Lookbacks)
        {
            AssertSeries(Line(plot, curve.Family), curve.LookbackDays.Select(d => Math.Log10(d)).ToArray(), curve.MeanLoss);
        }

        var markers = plot.GetPlottables().OfType<Marker>().ToArray();
        Assert.Equal(Sample.Lookbacks.Sum(c => c.ChosenLookbackDays.Distinct().Count()), markers.Length);
        // close-to-close chose 42 five times out of 7: its marker sits on the curve at 42 days.
        Assert.Contains(markers, m => m.Location.X == Math.Log10(42) && m.Location.Y == 0.17);
        Assert.Contains(plot.Legend.ManualItems, i => i.LabelText == ReportCharts.ChosenLegend && i.MarkerShape == MarkerShape.OpenCircle);
        _ = plot.GetImageBytes(1200, 600, ImageFormat.Png); // ticks are laid out when the plot is drawn
        var ticks = plot.Axes.Bottom.TickGenerator.Ticks;
        Assert.Equal([10, 21, 42, 63, 126, 252], ticks.Select(t => Math.Round(Math.Pow(10, t.Position))).ToArray());
        Assert.Equal(["10", "21", "42", "63", "126", "252"], ticks.Select(t => t.Label).ToArray());
    }

    [Fact]
    public void MincerZarnowitz_PointsFittedAndDiagonalLines()
    {
        double[] f = [0.01, 0.04, 0.09];
        double[] rv = [0.02, 0.03, 0.12];

        using var plot = ReportCharts.BuildMincerZarnowitz("garch", f, rv, 0.001, 1.1);

        // Variances in %² (decimal² × 10 000: 0.04 is 20% volatility, 400 %²), drawn as log10 on both axes.
        AssertSeries(Line(plot, "forecast dates"), [.. f.Select(v => Math.Log10(v * 1e4))], [.. rv.Select(v => Math.Log10(v * 1e4))]);
        var diagonal = plot.GetPlottables().OfType<LinePlot>().Single(l => l.LegendText.StartsWith("y = x", StringComparison.Ordinal));
        Assert.Equal(diagonal.Start.X, diagonal.Start.Y);
        Assert.Equal(diagonal.End.X, diagonal.End.Y);
        Assert.Equal(Math.Log10(900), diagonal.End.X, 12);
        var fitted = plot.GetPlottables().OfType<Scatter>().Single(l => l.LegendText.StartsWith("fitted", StringComparison.Ordinal));
        var ends = fitted.Data.GetScatterPoints();
        // RV² = a + b F² in %²: a = 0.001 decimal² = 10 %²; at F² = 900 %², 10 + 1.1 × 900 = 1000 %².
        Assert.Equal(Math.Log10(10 + (1.1 * 100)), ends[0].Y, 12);
        Assert.Equal(Math.Log10(1000), ends[^1].Y, 12);
        Assert.Contains("RV² = 10.0 %² + 1.100 F²", fitted.LegendText, StringComparison.Ordinal);
    }

    [Fact]
    public void Cone_PlotsAdjustedPercentilesInPercentAndOverlays()
    {
        using var plot = ReportCharts.BuildCone(Sample.Cone, Sample.Overlays);

        // A log horizon axis: every series sits at log10 of the horizon, with a tick labelled at each horizon.
        var horizons = Sample.Cone.Horizons.Select(h => Math.Log10(h.HorizonDays)).ToArray();
        AssertSeries(Line(plot, "median"), horizons, Sample.Cone.Horizons.Select(h => h.Adjusted.Median * 100).ToArray());
        AssertSeries(Line(plot, ReportCharts.ConeLatest), horizons, Sample.Cone.Horizons.Select(h => h.Latest * 100).ToArray());
        _ = plot.GetImageBytes(1200, 600, ImageFormat.Png); // ticks are laid out when the plot is drawn
        Assert.Equal(Sample.Cone.Horizons.Select(h => h.HorizonDays.ToString(System.Globalization.CultureInfo.InvariantCulture)), plot.Axes.Bottom.TickGenerator.Ticks.Select(t => t.Label));

        // Two shaded bands (10th–90th, 25th–75th) and one thin whisker per horizon from min to max.
        var bands = ReportCharts.ConeBands(Sample.Cone);
        Assert.Equal(Sample.Cone.Horizons.Select(h => h.Adjusted.P10 * 100), bands[0].Lower);
        Assert.Equal(Sample.Cone.Horizons.Select(h => h.Adjusted.P90 * 100), bands[0].Upper);
        Assert.Equal(Sample.Cone.Horizons.Select(h => h.Adjusted.P25 * 100), bands[1].Lower);
        Assert.Equal(Sample.Cone.Horizons.Select(h => h.Adjusted.P75 * 100), bands[1].Upper);
        Assert.Equal(bands.Select(b => b.Label), plot.GetPlottables().OfType<FillY>().Select(f => f.LegendText));
        var whiskers = plot.GetPlottables().OfType<LinePlot>().ToArray();
        Assert.Equal(horizons.Length, whiskers.Length);
        for (var i = 0; i < horizons.Length; i++)
        {
            Assert.Equal((horizons[i], Sample.Cone.Horizons[i].Adjusted.Min * 100, Sample.Cone.Horizons[i].Adjusted.Max * 100), (whiskers[i].Start.X, whiskers[i].Start.Y, whiskers[i].End.Y));
        }

        // The three overlays share the 21-day horizon, and each keeps it as its location.
        var today = plot.GetPlottables().OfType<ConeMarkers>().Single();
        Assert.Equal(Sample.Overlays.Select(o => o.Name), today.Markers.Select(m => m.LegendText));
        Assert.Equal(Sample.Overlays.Select(o => o.AnnualizedVolatility * 100), today.Markers.Select(m => m.Location.Y));
        Assert.All(today.Markers, m => Assert.Equal(Math.Log10(21), m.Location.X));
        Assert.Equal(Sample.Overlays.Select(o => o.Name), plot.GetPlottables().SelectMany(p => p.LegendItems).Select(l => l.LabelText).Where(t => Sample.Overlays.Any(o => o.Name == t)));
    }

    [Fact]
    public void Cone_TodaysMarkers_AreDrawnOnTheirHorizonAndAsideOnlyByWholeMarkerWidthsWithoutCoveringEachOther()
    {
        // Two markers at one value and horizon must part; one far above everything stays on its horizon, and one at
        // another horizon, clear of the rest, stays on that one.
        var latest = Sample.Cone.Horizons.Single(h => h.HorizonDays == 21).Latest;
        ConeOverlay[] overlays =
        [
            new("implied", 21, latest + 0.30),
            new("garch", 21, latest + 0.05),
            new("gjr-garch", 21, latest + 0.05),
            new("ewma:0.94", 63, latest + 0.40),
        ];
        using var plot = ReportCharts.BuildCone(Sample.Cone, overlays);
        var today = plot.GetPlottables().OfType<ConeMarkers>().Single();

        _ = ChartStyle.Png(plot);

        var step = today.Markers[0].MarkerSize + (2 * ConeMarkers.Pad);
        var onHorizon = overlays.Select(o => today.Axes.GetPixelX(Math.Log10(o.HorizonDays))).ToArray();
        Assert.Equal(onHorizon[0], today.Drawn[0].X, 3);
        Assert.Equal(onHorizon[3], today.Drawn[3].X, 3);
        for (var i = 0; i < overlays.Length; i++)
        {
            var steps = (today.Drawn[i].X - onHorizon[i]) / step;
            Assert.Equal(Math.Round(steps), steps, 3);
            Assert.InRange(Math.Abs(steps), 0, ConeMarkers.MaxSteps);
            Assert.Equal(today.Axes.GetPixelY(overlays[i].AnnualizedVolatility * 100), today.Drawn[i].Y, 3);
            for (var j = 0; j < i; j++)
            {
                var apart = Math.Max(Math.Abs(today.Drawn[i].X - today.Drawn[j].X), Math.Abs(today.Drawn[i].Y - today.Drawn[j].Y));
                Assert.True(apart >= step - 0.01, $"markers {j} and {i} are {apart} px apart");
            }
        }

        // The two at one value could not both stay on the horizon: exactly one moved, by one marker width.
        Assert.Equal(1, Math.Abs(Math.Round((today.Drawn[1].X - onHorizon[1]) / step) - Math.Round((today.Drawn[2].X - onHorizon[2]) / step)), 3);
    }

    [Fact]
    public void ConeMarkers_Offsets_AreTheHorizonThenAlternatelyRightAndLeft()
    {
        var offsets = ConeMarkers.Offsets(16);

        Assert.Equal([0f, 16f, -16f, 32f, -32f], offsets.Take(5));
        Assert.Equal((2 * ConeMarkers.MaxSteps) + 1, offsets.Count);
    }

    [Fact]
    public void RuleTest_SharesAddToHundredAndCountEveryValue()
    {
        double[] values = [-1, 0, 0, 1, 2, 3];
        var (edges, width) = ReportCharts.Bins(values, 4);

        var shares = ReportCharts.Shares(values, edges, width);

        // Bins of width 1 from −1: [−1,0) holds −1; [0,1) holds 0, 0; [1,2) holds 1; [2,3] holds 2 and 3 (top edge inclusive).
        Assert.Equal([100.0 / 6, 200.0 / 6, 100.0 / 6, 200.0 / 6], shares, new ToleranceComparer(1e-12));
    }

    [Fact]
    public void RuleTest_BracketRunsFromTheMeanOfAllDatesToTheMeanOfSignalledDates()
    {
        double[] all = [-0.02, 0.0, 0.01, 0.03];
        double[] signalled = [0.01, 0.03];

        using var plot = ReportCharts.BuildRuleTest(all, signalled, "sell when implied > garch", "garch", differenceP: 0.0004);

        // Means by hand: all (−2 + 0 + 1 + 3) / 4 = 0.5 vol points, signalled (1 + 3) / 2 = 2; the difference is 1.5.
        var means = plot.GetPlottables().OfType<Marker>().Where(l => l.LegendText.StartsWith("mean", StringComparison.Ordinal)).Select(l => l.Location.X).ToArray();
        Assert.Equal([0.5, 2.0], means, new ToleranceComparer(1e-12));
        var bracket = plot.GetPlottables().OfType<LinePlot>().Single();
        Assert.Equal((0.5, 2.0), (bracket.Start.X, bracket.End.X));
        Assert.Equal("signalled − all dates = +1.50 vol points (p < 0.001)", bracket.LegendText);
        Assert.Equal("signalled − all dates = −0.25 vol points (p = 0.412)", ReportCharts.DifferenceLegend(-0.25, 0.412));
    }

    private sealed class ToleranceComparer(double tolerance) : IEqualityComparer<double>
    {
        public bool Equals(double x, double y) => Math.Abs(x - y) <= tolerance;

        public int GetHashCode(double obj) => 0;
    }

    [Fact]
    public void Reliability_SeriesAreTheBinsInPercentWithDiagonalAndIntervalBars()
    {
        var curves = new[]
        {
            new ReliabilityCurve("implied", [0.05, 0.5, 0.9], [0.02, 0.55, 0.97], [0.0, 0.4, 0.9], [0.1, 0.7, 1.0], [40, 20, 40]),
            new ReliabilityCurve("garch", [0.1, 0.6], [0.12, 0.58], [0.05, 0.45], [0.2, 0.7], [50, 50]),
        };

        using var plot = ReportCharts.BuildReliability(curves, "pooled over strikes");

        // Two curves are set 1.2 points apart across, centred: implied 0.6 left, garch 0.6 right of the bins' predicted means.
        AssertSeries(Line(plot, "implied"), [4.4, 49.4, 89.4], [2, 55, 97]);
        AssertSeries(Line(plot, "garch"), [10.6, 60.6], [12, 58]);
        var lines = plot.GetPlottables().OfType<LinePlot>().ToArray();
        var diagonal = lines.Single(l => l.LegendText.StartsWith("y = x", StringComparison.Ordinal));
        Assert.Equal((0.0, 0.0, 100.0, 100.0), (diagonal.Start.X, diagonal.Start.Y, diagonal.End.X, diagonal.End.Y));
        var bars = lines.Where(l => l.LegendText.Length == 0).ToArray();
        Assert.Equal(5, bars.Length);
        Assert.Contains(bars, b => Math.Abs(b.Start.X - 49.4) < 1e-9 && b.End.X == b.Start.X && Math.Abs(b.Start.Y - 40) < 1e-9 && Math.Abs(b.End.Y - 70) < 1e-9);

        // Each bin's count is written beside its bar.
        var counts = plot.GetPlottables().OfType<CountLabels>().Single().Labels;
        Assert.Equal(["40", "20", "40", "50", "50"], counts.Select(c => c.Text));
        Assert.Equal([4.4, 49.4, 89.4, 10.6, 60.6], counts.Select(c => Math.Round(c.X, 9)));
        Assert.Equal([10.0, 70, 100, 20, 70], counts.Select(c => Math.Round(c.Top, 9)));
        Assert.Equal("reliability.png", ReportCharts.Reliability(curves, "pooled").FileName);
    }

    [Fact]
    public void Reliability_CountsThatWouldCollide_AreWrittenApartInsideTheDataArea()
    {
        // Three forecasters with the same bins: their counts would stand side by side at one height, and the wide
        // counts of neighbouring bars cross; the labels near the top have no room above.
        var curves = new[]
        {
            new ReliabilityCurve("implied", [0.05, 0.15, 0.5, 0.97], [0.05, 0.15, 0.5, 0.97], [0.0, 0.1, 0.4, 0.93], [0.1, 0.2, 0.6, 1.0], [123456, 98765, 4321, 5552]),
            new ReliabilityCurve("garch", [0.05, 0.15, 0.5, 0.97], [0.05, 0.15, 0.5, 0.97], [0.0, 0.1, 0.4, 0.93], [0.1, 0.2, 0.6, 1.0], [123456, 98765, 4321, 5534]),
            new ReliabilityCurve("gjr-garch", [0.05, 0.15, 0.5, 0.97], [0.05, 0.15, 0.5, 0.97], [0.0, 0.1, 0.4, 0.93], [0.1, 0.2, 0.6, 1.0], [123456, 98765, 4321, 4935]),
        };
        using var plot = ReportCharts.BuildReliability(curves, "pooled over strikes");
        var counts = plot.GetPlottables().OfType<CountLabels>().Single();

        _ = ChartStyle.Png(plot);

        Assert.Equal(12, counts.Placed.Count);
        var area = counts.Axes.DataRect;
        for (var i = 0; i < counts.Placed.Count; i++)
        {
            // Each count stays on its own bar's line, inside the data area, and covers no other count.
            Assert.Equal(counts.Axes.GetPixelX(counts.Labels[i].X), counts.Placed[i].HorizontalCenter, 3);
            Assert.True(BoxPlacement.Inside(counts.Placed[i], area), $"{counts.Labels[i].Text} at {counts.Placed[i]} outside {area}");
            for (var j = 0; j < i; j++)
            {
                Assert.False(BoxPlacement.Overlap(counts.Placed[i], counts.Placed[j]), $"{counts.Labels[j].Text} and {counts.Labels[i].Text} overlap");
            }
        }
    }
}
