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
            AssertSeries(
                Line(plot, series.Name),
                series.Dates.Select(d => d.ToDateTime(TimeOnly.MinValue).ToOADate()).ToArray(),
                series.Values.Select(v => v * 100).ToArray());
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
    public void LossVsLookback_CurvesAndOneMarkerPerDistinctChoice()
    {
        using var plot = ReportCharts.BuildLossVsLookback(Sample.Lookbacks);

        foreach (var curve in Sample.Lookbacks)
        {
            AssertSeries(Line(plot, curve.Family), curve.LookbackDays.Select(d => (double)d).ToArray(), curve.MeanLoss);
        }

        var markers = plot.GetPlottables().OfType<Marker>().ToArray();
        Assert.Equal(Sample.Lookbacks.Sum(c => c.ChosenLookbackDays.Distinct().Count()), markers.Length);
        // close-to-close chose 42 five times out of 7: its marker sits on the curve at 42 days.
        Assert.Contains(markers, m => m.Location.X == 42 && m.Location.Y == 0.17);
    }

    [Fact]
    public void MincerZarnowitz_PointsFittedAndDiagonalLines()
    {
        double[] f = [0.01, 0.04, 0.09];
        double[] rv = [0.02, 0.03, 0.12];

        using var plot = ReportCharts.BuildMincerZarnowitz("garch", f, rv, 0.001, 1.1);

        AssertSeries(plot.GetPlottables().OfType<Scatter>().Single(), f, rv);
        var lines = plot.GetPlottables().OfType<LinePlot>().ToArray();
        var diagonal = lines.Single(l => l.LegendText.StartsWith("45", StringComparison.Ordinal));
        Assert.Equal(diagonal.Start.X, diagonal.Start.Y);
        Assert.Equal(diagonal.End.X, diagonal.End.Y);
        Assert.Equal(0.09, diagonal.End.X);
        var fitted = lines.Single(l => l.LegendText.StartsWith("fitted", StringComparison.Ordinal));
        Assert.Equal(0.001, fitted.Start.Y, 12);
        Assert.Equal(0.001 + (1.1 * 0.09), fitted.End.Y, 12);
    }

    [Fact]
    public void Cone_PlotsAdjustedPercentilesInPercentAndOverlays()
    {
        using var plot = ReportCharts.BuildCone(Sample.Cone, Sample.Overlays);

        var horizons = Sample.Cone.Horizons.Select(h => (double)h.HorizonDays).ToArray();
        AssertSeries(Line(plot, "median"), horizons, Sample.Cone.Horizons.Select(h => h.Adjusted.Median * 100).ToArray());
        AssertSeries(Line(plot, "max"), horizons, Sample.Cone.Horizons.Select(h => h.Adjusted.Max * 100).ToArray());
        AssertSeries(Line(plot, "p10"), horizons, Sample.Cone.Horizons.Select(h => h.Adjusted.P10 * 100).ToArray());
        var implied = plot.GetPlottables().OfType<Marker>().Single(m => m.LegendText == "implied 30d");
        Assert.Equal(Sample.Overlays[0].AnnualizedVolatility * 100, implied.Location.Y, 10);
        Assert.True(Math.Abs(implied.Location.X - 21) <= 2);
    }

    [Theory]
    // One overlay: no shift. Two at one horizon: −1 and +1. Three: −2, 0, +2. Others at other horizons do not count.
    [InlineData(new[] { 21 }, 0, 0.0)]
    [InlineData(new[] { 21, 21 }, 0, -1.0)]
    [InlineData(new[] { 21, 21 }, 1, 1.0)]
    [InlineData(new[] { 21, 63, 21, 21 }, 2, 0.0)]
    [InlineData(new[] { 21, 63, 21, 21 }, 1, 0.0)]
    public void OverlayOffset_SpreadsPointsAtOneHorizon(int[] horizons, int index, double expected)
    {
        var overlays = horizons.Select(h => new ConeOverlay("x", h, 0.2)).ToArray();

        Assert.Equal(expected, ReportCharts.OverlayOffset(overlays, index));
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
    public void RuleTest_MeansOfBothSamples()
    {
        double[] all = [-0.02, 0.0, 0.01, 0.03];
        double[] signalled = [0.01, 0.03];

        using var plot = ReportCharts.BuildRuleTest(all, signalled, "sell when implied > garch");

        var means = plot.GetPlottables().OfType<VerticalLine>().Where(l => l.LegendText.StartsWith("mean", StringComparison.Ordinal)).Select(l => l.X).ToArray();
        Assert.Equal([0.5, 2.0], means, new ToleranceComparer(1e-12));
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

        AssertSeries(Line(plot, "implied"), [5, 50, 90], [2, 55, 97]);
        AssertSeries(Line(plot, "garch"), [10, 60], [12, 58]);
        var lines = plot.GetPlottables().OfType<LinePlot>().ToArray();
        var diagonal = lines.Single(l => l.LegendText.StartsWith("45", StringComparison.Ordinal));
        Assert.Equal((0.0, 0.0, 100.0, 100.0), (diagonal.Start.X, diagonal.Start.Y, diagonal.End.X, diagonal.End.Y));
        var bars = lines.Where(l => l.LegendText.Length == 0).ToArray();
        Assert.Equal(5, bars.Length);
        Assert.Contains(bars, b => b.Start.X == 50 && b.End.X == 50 && Math.Abs(b.Start.Y - 40) < 1e-9 && Math.Abs(b.End.Y - 70) < 1e-9);
        Assert.Equal("reliability.png", ReportCharts.Reliability(curves, "pooled").FileName);
    }
}
