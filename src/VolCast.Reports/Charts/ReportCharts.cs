using System.Globalization;
using ScottPlot;
using VolCast.Core.Cone;
using VolCast.Core.Data;
using VolCast.Reports.Model;

namespace VolCast.Reports.Charts;

/// <summary>
/// Builds the report's charts from plain series. Volatilities are handed in as decimals (0.20 = 20%) and drawn in
/// percent; every chart is 1200×600 pixels, uses one font and the Okabe-Ito palette, and renders the same bytes for
/// the same input.
/// </summary>
public static class ReportCharts
{
    /// <summary>Forecasts, implied and realized volatility over time.</summary>
    /// <param name="realized">The realized volatility that followed each forecast date (decimal).</param>
    /// <param name="implied">The implied volatility quoted on each date (decimal), when there is one.</param>
    /// <param name="forecasts">The leading forecasters' series (decimal), each named by its spec.</param>
    /// <returns>The chart as <c>forecast-vs-realized.png</c>.</returns>
    internal static ChartImage ForecastVsRealized(TimeSeries realized, TimeSeries? implied, IReadOnlyList<TimeSeries> forecasts)
    {
        using var plot = BuildForecastVsRealized(realized, implied, forecasts);
        return new ChartImage("forecast-vs-realized.png", "Forecast, implied and realized volatility",
            "Each line is an annualized volatility in percent on the date the forecast was made; the black line is the realized volatility that followed over the horizon.",
            ChartStyle.Png(plot));
    }

    /// <summary>Implied minus realized volatility over time, with its mean and 10th–90th percentile band.</summary>
    /// <param name="premium">Implied minus realized volatility on each date (decimal, so 0.02 = 2 vol points).</param>
    /// <returns>The chart as <c>premium.png</c>.</returns>
    internal static ChartImage Premium(TimeSeries premium)
    {
        using var plot = BuildPremium(premium);
        return new ChartImage("premium.png", "Volatility premium: implied minus realized",
            "Above zero, the implied volatility quoted on that date was higher than the volatility that followed. The dashed line is the mean; the shaded band holds the middle 80% of dates.",
            ChartStyle.Png(plot));
    }

    /// <summary>Cumulative QLIKE loss of each forecaster minus that of implied volatility.</summary>
    /// <param name="lossDifferentials">Per forecaster and date, QLIKE(forecaster) − QLIKE(implied); the chart adds them up.</param>
    /// <returns>The chart as <c>cumulative-qlike.png</c>.</returns>
    internal static ChartImage CumulativeLossDifferential(IReadOnlyList<TimeSeries> lossDifferentials)
    {
        using var plot = BuildCumulativeLossDifferential(lossDifferentials);
        return new ChartImage("cumulative-qlike.png", "Cumulative QLIKE loss against implied",
            "A falling line means the forecaster lost less than implied volatility over that stretch (it helped); a rising line means it lost more (it hurt).",
            ChartStyle.Png(plot));
    }

    /// <summary>Mean loss against lookback for each estimator family, with the out-of-sample choices marked.</summary>
    /// <param name="curves">One curve per family.</param>
    /// <returns>The chart as <c>loss-vs-lookback.png</c>.</returns>
    internal static ChartImage LossVsLookback(IReadOnlyList<LookbackCurve> curves)
    {
        using var plot = BuildLossVsLookback(curves);
        return new ChartImage("loss-vs-lookback.png", "Loss against lookback",
            "Mean QLIKE loss (lower is better) for each lookback, in sample; the open circles are the lookbacks the walk-forward selection chose out of sample on at least 2% of dates, sized by how often. EWMA decays are in the lookback table, not here.",
            ChartStyle.Png(plot));
    }

    /// <summary>Mincer-Zarnowitz scatter of realized against forecast variance, with the fitted and 45° lines.</summary>
    /// <param name="forecaster">The forecaster's spec, for the title.</param>
    /// <param name="forecastVariance">Forecast annualized variance on each date (decimal², 0.04 = 20% vol).</param>
    /// <param name="realizedVariance">Realized annualized variance that followed (decimal²), same length.</param>
    /// <param name="intercept">The fitted intercept a in RV² = a + b F².</param>
    /// <param name="slope">The fitted slope b.</param>
    /// <returns>The chart as <c>mincer-zarnowitz.png</c>.</returns>
    internal static ChartImage MincerZarnowitz(string forecaster, IReadOnlyList<double> forecastVariance, IReadOnlyList<double> realizedVariance, double intercept, double slope)
    {
        using var plot = BuildMincerZarnowitz(forecaster, forecastVariance, realizedVariance, intercept, slope);
        return new ChartImage("mincer-zarnowitz.png", "Mincer-Zarnowitz: realized against forecast variance",
            "Each point is one forecast date. An unbiased forecast scatters around the 45° line; the fitted line shows the regression of realized on forecast variance.",
            ChartStyle.Png(plot));
    }

    /// <summary>The volatility cone (Hodges-Tompkins adjusted percentiles) with the latest implied and forecasts overlaid.</summary>
    /// <param name="cone">The cone.</param>
    /// <param name="overlays">Points to draw on it: the latest implied volatility and forecasts at their horizons.</param>
    /// <returns>The chart as <c>cone.png</c>.</returns>
    public static ChartImage Cone(VolatilityConeResult cone, IReadOnlyList<ConeOverlay> overlays)
    {
        using var plot = BuildCone(cone, overlays);
        return new ChartImage("cone.png", "Volatility cone (overlapping-window adjusted)",
            "For each horizon, the spread of realized volatility over every window of that length in the history, adjusted for overlapping windows (Hodges-Tompkins); the markers are today's implied volatility and forecasts (markers at the same horizon are drawn 2 days apart).",
            ChartStyle.Png(plot));
    }

    /// <summary>The distribution of implied minus realized volatility on the dates a rule signalled, against all dates.</summary>
    /// <param name="allDates">IV − RV on every date (decimal).</param>
    /// <param name="signalledDates">IV − RV on the dates the rule signalled (decimal).</param>
    /// <param name="rule">The rule in words, e.g. <c>sell when implied &gt; ewma:0.94</c>, for the legend.</param>
    /// <returns>The chart as <c>rule-test.png</c>.</returns>
    internal static ChartImage RuleTest(IReadOnlyList<double> allDates, IReadOnlyList<double> signalledDates, string rule)
    {
        using var plot = BuildRuleTest(allDates, signalledDates, rule);
        return new ChartImage("rule-test.png", "Rule test: implied minus realized on signalled dates",
            "Share of dates in each band of implied minus realized volatility, for the dates the rule signalled and for all dates; dashed lines mark the means.",
            ChartStyle.Png(plot));
    }

    /// <summary>The reliability diagram: observed frequency against predicted probability per bin, with the 45° line and interval bars.</summary>
    /// <param name="curves">One curve per forecaster (implied first when there is one).</param>
    /// <param name="pooling">Which strikes the bins pool, e.g. <c>pooled over strikes 0.90–1.10 × close</c>, for the title.</param>
    /// <returns>The chart as <c>reliability.png</c>.</returns>
    internal static ChartImage Reliability(IReadOnlyList<ReliabilityCurve> curves, string pooling)
    {
        using var plot = BuildReliability(curves, pooling);
        return new ChartImage(ReliabilityFileName, "Reliability: predicted probability against what happened",
            "Each point is one bin of predicted probabilities that the close at the horizon ends above a strike: across, the mean probability the forecaster's volatility gave (N(d2)); up, the share of those dates on which it did. Points on the dashed 45° line mean the odds held; the bars are 95% Wilson intervals on n / h dates, widened for overlapping windows. Below the line in the low bins and above it in the high bins means the probabilities stayed too close to 50% (the volatility was too high); the reverse means they were too bold.",
            ChartStyle.Png(plot));
    }

    /// <summary>The reliability diagram's file name.</summary>
    internal const string ReliabilityFileName = "reliability.png";

    internal static Plot BuildReliability(IReadOnlyList<ReliabilityCurve> curves, string pooling)
    {
        ArgumentNullException.ThrowIfNull(curves);
        ArgumentNullException.ThrowIfNull(pooling);
        var plot = ChartStyle.NewPlot("Reliability of P(close at horizon > strike), " + pooling, "Predicted probability (%)", "Observed frequency (%)");
        var diagonal = plot.Add.Line(0, 0, 100, 100);
        diagonal.Color = ChartStyle.Reference;
        diagonal.LineWidth = 2;
        diagonal.LinePattern = LinePattern.Dashed;
        diagonal.LegendText = "45° line (odds held)";
        var shapes = new[] { MarkerShape.FilledCircle, MarkerShape.FilledSquare, MarkerShape.FilledTriangleUp, MarkerShape.FilledDiamond };
        for (var k = 0; k < curves.Count; k++)
        {
            var curve = curves[k];
            var n = curve.Predicted.Count;
            if (curve.Observed.Count != n || curve.Lower.Count != n || curve.Upper.Count != n)
            {
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"curve '{curve.Name}' has {n} predicted values but {curve.Observed.Count} observed, {curve.Lower.Count} lower and {curve.Upper.Count} upper; expected one of each per bin."), nameof(curves));
            }

            // Implied keeps the palette's first colour, as in the other charts; forecasters follow.
            var color = ChartStyle.Series(curve.Name == ImpliedSeries.Name ? 0 : k + (curves[0].Name == ImpliedSeries.Name ? 0 : 1));
            var xs = new double[n];
            var ys = new double[n];
            for (var i = 0; i < n; i++)
            {
                xs[i] = curve.Predicted[i] * 100.0;
                ys[i] = curve.Observed[i] * 100.0;
                var bar = plot.Add.Line(xs[i], curve.Lower[i] * 100.0, xs[i], curve.Upper[i] * 100.0);
                bar.Color = color.WithAlpha(0.7);
                bar.LineWidth = 2;
                bar.LegendText = string.Empty;
            }

            var line = plot.Add.Scatter(xs, ys);
            line.Color = color;
            line.LineWidth = 2;
            line.MarkerSize = 9;
            line.MarkerShape = shapes[k % shapes.Length];
            line.LegendText = curve.Name;
        }

        plot.Axes.SetLimits(-2, 102, -2, 102);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    internal static Plot BuildForecastVsRealized(TimeSeries realized, TimeSeries? implied, IReadOnlyList<TimeSeries> forecasts)
    {
        ArgumentNullException.ThrowIfNull(realized);
        ArgumentNullException.ThrowIfNull(forecasts);
        var plot = ChartStyle.NewPlot("Forecast, implied and realized volatility", "Forecast date", "Annualized volatility (%)");
        var colour = 0;
        foreach (var forecast in forecasts)
        {
            AddLine(plot, forecast, 100.0, ChartStyle.Series(colour++ + 1), 1.5f, forecast.Name);
        }

        if (implied is not null)
        {
            AddLine(plot, implied, 100.0, ChartStyle.Series(0), 1.5f, implied.Name);
        }

        AddLine(plot, realized, 100.0, ChartStyle.Realized, 1.5f, realized.Name);
        ChartStyle.DateAxis(plot, "Forecast date");
        plot.Axes.Margins(0.01, 0.05);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    internal static Plot BuildPremium(TimeSeries premium)
    {
        ArgumentNullException.ThrowIfNull(premium);
        var plot = ChartStyle.NewPlot("Implied minus realized volatility", "Date", "Implied − realized (vol points, %)");
        var points = new double[premium.Values.Count];
        for (var i = 0; i < points.Length; i++)
        {
            points[i] = premium.Values[i] * 100.0;
        }

        if (points.Length > 0)
        {
            var sorted = (double[])points.Clone();
            Array.Sort(sorted);
            var low = Quantile.Type7(sorted, 0.10);
            var high = Quantile.Type7(sorted, 0.90);
            var band = plot.Add.VerticalSpan(low, high);
            band.FillColor = ChartStyle.Series(1).WithAlpha(0.25);
            band.LineColor = Colors.Transparent;
            band.LegendText = string.Create(CultureInfo.InvariantCulture, $"10th–90th percentile ({low:0.0} to {high:0.0})");
        }

        var zero = plot.Add.HorizontalLine(0);
        zero.Color = ChartStyle.Reference;
        zero.LineWidth = 1;
        AddLine(plot, premium, 100.0, ChartStyle.Series(3), 1.2f, premium.Name);
        if (points.Length > 0)
        {
            var mean = points.Average();
            var meanLine = plot.Add.HorizontalLine(mean);
            meanLine.Color = ChartStyle.Series(4);
            meanLine.LineWidth = 2.5f;
            meanLine.LinePattern = LinePattern.Dashed;
            meanLine.LegendText = string.Create(CultureInfo.InvariantCulture, $"mean {mean:0.00}");
        }

        ChartStyle.DateAxis(plot, "Date");
        plot.Axes.Margins(0.01, 0.05);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    internal static Plot BuildCumulativeLossDifferential(IReadOnlyList<TimeSeries> lossDifferentials)
    {
        ArgumentNullException.ThrowIfNull(lossDifferentials);
        var plot = ChartStyle.NewPlot("Cumulative QLIKE loss minus implied's (below 0: forecaster better)", "Date", "Cumulative QLIKE, forecaster − implied");
        var zero = plot.Add.HorizontalLine(0);
        zero.Color = ChartStyle.Reference;
        zero.LineWidth = 1;
        var colour = 1;
        foreach (var series in lossDifferentials)
        {
            var xs = new double[series.Dates.Count];
            var ys = new double[series.Values.Count];
            var sum = 0.0;
            for (var i = 0; i < xs.Length; i++)
            {
                sum += series.Values[i];
                xs[i] = ChartStyle.X(series.Dates[i]);
                ys[i] = sum;
            }

            var (drawnX, drawnY) = ChartPoints.Line(xs, ys);
            var line = plot.Add.ScatterLine(drawnX, drawnY);
            line.Color = ChartStyle.Series(colour++);
            line.LineWidth = 2;
            line.LegendText = series.Name;
        }

        ChartStyle.DateAxis(plot, "Date");
        plot.Axes.Margins(0.01, 0.05);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    internal static Plot BuildLossVsLookback(IReadOnlyList<LookbackCurve> curves)
    {
        ArgumentNullException.ThrowIfNull(curves);
        var plot = ChartStyle.NewPlot("Mean QLIKE against lookback (circles: chosen out of sample, by share)", "Lookback (trading days)", "Mean QLIKE loss (lower is better)");
        var colour = 1;
        foreach (var curve in curves)
        {
            var color = ChartStyle.Series(colour++);
            var xs = new double[curve.LookbackDays.Count];
            var ys = new double[xs.Length];
            for (var i = 0; i < xs.Length; i++)
            {
                xs[i] = curve.LookbackDays[i];
                ys[i] = curve.MeanLoss[i];
            }

            var line = plot.Add.Scatter(xs, ys);
            line.Color = color;
            line.LineWidth = 2;
            line.MarkerSize = 6;
            line.LegendText = curve.Family;

            // One marker per distinct chosen lookback, its size growing with how often it was chosen.
            var counts = new SortedDictionary<int, int>();
            foreach (var chosen in curve.ChosenLookbackDays)
            {
                counts[chosen] = counts.GetValueOrDefault(chosen) + 1;
            }

            foreach (var (lookback, times) in counts)
            {
                var index = IndexOf(curve.LookbackDays, lookback);

                // A lookback picked on under 2% of dates is noise on this chart; the table lists every choice.
                if (index < 0 || times < 0.02 * curve.ChosenLookbackDays.Count)
                {
                    continue;
                }

                var marker = plot.Add.Marker(lookback, curve.MeanLoss[index]);
                marker.Color = color;
                marker.MarkerShape = MarkerShape.OpenCircle;
                marker.MarkerLineWidth = 2.5f;
                marker.Size = 10 + (30f * times / curve.ChosenLookbackDays.Count);
            }
        }

        plot.Axes.Margins(0.05, 0.1);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    internal static Plot BuildMincerZarnowitz(string forecaster, IReadOnlyList<double> forecastVariance, IReadOnlyList<double> realizedVariance, double intercept, double slope)
    {
        ArgumentNullException.ThrowIfNull(forecaster);
        ArgumentNullException.ThrowIfNull(forecastVariance);
        ArgumentNullException.ThrowIfNull(realizedVariance);
        if (forecastVariance.Count != realizedVariance.Count)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"realizedVariance has {realizedVariance.Count} values but forecastVariance has {forecastVariance.Count}; expected one pair per date."), nameof(realizedVariance));
        }

        var plot = ChartStyle.NewPlot($"Mincer-Zarnowitz: {forecaster}", "Forecast variance F² (annualized, decimal²)", "Realized variance RV² (annualized, decimal²)");
        var xs = forecastVariance.ToArray();
        var ys = realizedVariance.ToArray();
        var (drawnX, drawnY) = ChartPoints.Scatter(xs, ys);
        var points = plot.Add.ScatterPoints(drawnX, drawnY);
        points.Color = ChartStyle.Series(3).WithAlpha(0.45);
        points.MarkerSize = 4;
        points.LegendText = "forecast dates";

        var top = 0.0;
        for (var i = 0; i < xs.Length; i++)
        {
            top = Math.Max(top, xs[i]);
        }

        var diagonal = plot.Add.Line(0, 0, top, top);
        diagonal.Color = ChartStyle.Reference;
        diagonal.LineWidth = 2;
        diagonal.LinePattern = LinePattern.Dashed;
        diagonal.LegendText = "45° line (unbiased)";

        var fitted = plot.Add.Line(0, intercept, top, intercept + (slope * top));
        fitted.Color = ChartStyle.Series(4);
        fitted.LineWidth = 2.5f;
        fitted.LegendText = string.Create(CultureInfo.InvariantCulture, $"fitted: RV² = {intercept:0.0000} + {slope:0.000} F²");
        plot.Axes.Margins(0.02, 0.05);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    internal static Plot BuildCone(VolatilityConeResult cone, IReadOnlyList<ConeOverlay> overlays)
    {
        ArgumentNullException.ThrowIfNull(cone);
        ArgumentNullException.ThrowIfNull(overlays);
        var plot = ChartStyle.NewPlot("Volatility cone (Hodges-Tompkins adjusted)", "Horizon (trading days)", "Annualized realized volatility (%)");
        var xs = new double[cone.Horizons.Count];
        for (var i = 0; i < xs.Length; i++)
        {
            xs[i] = cone.Horizons[i].HorizonDays;
        }

        // Percentile lines: the extremes thin and grey, the quartiles coloured, the median heavy.
        var styles = new (Color Color, float Width, LinePattern Pattern)[]
        {
            (ChartStyle.Reference, 1.5f, LinePattern.Dotted),
            (ChartStyle.Series(1), 2f, LinePattern.Dashed),
            (ChartStyle.Series(3), 2f, LinePattern.Solid),
            (ChartStyle.Realized, 3f, LinePattern.Solid),
            (ChartStyle.Series(3), 2f, LinePattern.Solid),
            (ChartStyle.Series(1), 2f, LinePattern.Dashed),
            (ChartStyle.Reference, 1.5f, LinePattern.Dotted),
        };
        for (var level = ConePercentiles.Levels.Count - 1; level >= 0; level--)
        {
            var ys = new double[xs.Length];
            for (var i = 0; i < xs.Length; i++)
            {
                ys[i] = cone.Horizons[i].Adjusted.ToArray()[level] * 100.0;
            }

            var line = plot.Add.Scatter(xs, ys);
            line.Color = styles[level].Color;
            line.LineWidth = styles[level].Width;
            line.LinePattern = styles[level].Pattern;
            line.MarkerSize = 5;
            line.LegendText = ConePercentiles.Labels[level];
        }

        var shapes = new[] { MarkerShape.FilledDiamond, MarkerShape.FilledTriangleUp, MarkerShape.FilledSquare, MarkerShape.FilledTriangleDown };
        var index = 0;
        foreach (var overlay in overlays)
        {
            // Points at the same horizon are spread 2 days apart so none hides another; the caption says so.
            var marker = plot.Add.Marker(overlay.HorizonDays + OverlayOffset(overlays, index), overlay.AnnualizedVolatility * 100.0);
            marker.MarkerShape = shapes[index % shapes.Length];
            marker.Size = 16;
            marker.Color = index == 0 ? ChartStyle.Series(0) : ChartStyle.Series(4 + ((index - 1) % 3));
            marker.LegendText = overlay.Name;
            index++;
        }

        plot.Axes.Margins(0.03, 0.08);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    internal static Plot BuildRuleTest(IReadOnlyList<double> allDates, IReadOnlyList<double> signalledDates, string rule)
    {
        ArgumentNullException.ThrowIfNull(allDates);
        ArgumentNullException.ThrowIfNull(signalledDates);
        ArgumentNullException.ThrowIfNull(rule);
        var plot = ChartStyle.NewPlot("Implied minus realized: signalled dates against all dates", "Implied − realized (vol points, %)", "Share of dates (%)");
        var all = Scale(allDates, 100.0);
        var signalled = Scale(signalledDates, 100.0);
        if (all.Length > 0)
        {
            var (edges, width) = Bins(all, 40);
            AddHistogram(plot, all, edges, width, ChartStyle.Series(1), $"all dates (n = {all.Length.ToString(CultureInfo.InvariantCulture)})", filled: true);
            AddHistogram(plot, signalled, edges, width, ChartStyle.Series(4), $"{rule} (n = {signalled.Length.ToString(CultureInfo.InvariantCulture)})", filled: false);
            AddMean(plot, all, ChartStyle.Series(1), "mean, all dates");
            if (signalled.Length > 0)
            {
                AddMean(plot, signalled, ChartStyle.Series(4), "mean, signalled");
            }
        }

        var zero = plot.Add.VerticalLine(0);
        zero.Color = ChartStyle.Reference;
        zero.LineWidth = 1;
        plot.Axes.Margins(0.02, 0.08);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    /// <summary>How far to shift the i-th overlay along the horizon axis: 2 days per earlier overlay at the same horizon, centred.</summary>
    internal static double OverlayOffset(IReadOnlyList<ConeOverlay> overlays, int index)
    {
        var before = 0;
        var same = 0;
        for (var i = 0; i < overlays.Count; i++)
        {
            if (overlays[i].HorizonDays == overlays[index].HorizonDays)
            {
                same++;
                if (i < index)
                {
                    before++;
                }
            }
        }

        return 2.0 * (before - ((same - 1) / 2.0));
    }

    /// <summary>Equal-width bins over the sample's range: the left edges and the width.</summary>
    internal static (double[] Edges, double Width) Bins(double[] values, int count)
    {
        var low = values.Min();
        var high = values.Max();
        var width = high > low ? (high - low) / count : 1.0;
        var edges = new double[count + 1];
        for (var i = 0; i <= count; i++)
        {
            edges[i] = low + (i * width);
        }

        return (edges, width);
    }

    /// <summary>The share of <paramref name="values"/> (percent) in each bin; the top edge is inclusive.</summary>
    internal static double[] Shares(double[] values, double[] edges, double width)
    {
        var bins = edges.Length - 1;
        var shares = new double[bins];
        foreach (var value in values)
        {
            var bin = (int)Math.Floor((value - edges[0]) / width);
            bin = Math.Clamp(bin, 0, bins - 1);
            shares[bin] += 100.0 / values.Length;
        }

        return shares;
    }

    /// <summary>A histogram's step outline: each bin's height held flat across its width, closed to zero at both ends.</summary>
    /// <param name="edges">The bin edges (one more than the heights).</param>
    /// <param name="heights">The height of each bin.</param>
    /// <returns>The outline's points.</returns>
    internal static (double[] Xs, double[] Ys) StepOutline(double[] edges, double[] heights)
    {
        var xs = new double[(heights.Length * 2) + 2];
        var ys = new double[xs.Length];
        xs[0] = edges[0];
        for (var i = 0; i < heights.Length; i++)
        {
            xs[(2 * i) + 1] = edges[i];
            ys[(2 * i) + 1] = heights[i];
            xs[(2 * i) + 2] = edges[i + 1];
            ys[(2 * i) + 2] = heights[i];
        }

        xs[^1] = edges[^1];
        return (xs, ys);
    }

    private static void AddHistogram(Plot plot, double[] values, double[] edges, double width, Color color, string label, bool filled)
    {
        if (values.Length == 0)
        {
            return;
        }

        var (xs, ys) = StepOutline(edges, Shares(values, edges, width));
        var fill = plot.Add.ScatterLine(xs, ys);
        fill.Color = color;
        fill.LineWidth = 2.5f;
        fill.FillY = filled;
        fill.FillYColor = color.WithAlpha(0.2);
        fill.LegendText = label;
    }

    private static void AddMean(Plot plot, double[] values, Color color, string label)
    {
        var mean = values.Average();
        var line = plot.Add.VerticalLine(mean);
        line.Color = color;
        line.LineWidth = 2.5f;
        line.LinePattern = LinePattern.Dashed;
        line.LegendText = string.Create(CultureInfo.InvariantCulture, $"{label} {mean:0.00}");
    }

    private static void AddLine(Plot plot, TimeSeries series, double scale, Color color, float width, string label)
    {
        var xs = new double[series.Dates.Count];
        var ys = new double[xs.Length];
        for (var i = 0; i < xs.Length; i++)
        {
            xs[i] = ChartStyle.X(series.Dates[i]);
            ys[i] = series.Values[i] * scale;
        }

        var (drawnX, drawnY) = ChartPoints.Line(xs, ys);
        var line = plot.Add.ScatterLine(drawnX, drawnY);
        line.Color = color;
        line.LineWidth = width;
        line.LegendText = label;
    }

    private static double[] Scale(IReadOnlyList<double> values, double factor)
    {
        var result = new double[values.Count];
        for (var i = 0; i < result.Length; i++)
        {
            result[i] = values[i] * factor;
        }

        return result;
    }

    private static int IndexOf(IReadOnlyList<int> values, int value)
    {
        for (var i = 0; i < values.Count; i++)
        {
            if (values[i] == value)
            {
                return i;
            }
        }

        return -1;
    }
}
