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
    /// <summary>The title of the forecast chart, on the image and above its caption.</summary>
    internal const string ForecastTitle = "Forecast, implied and realized volatility";

    /// <summary>The title of the premium chart.</summary>
    internal const string PremiumTitle = "Implied minus realized volatility (the volatility premium)";

    /// <summary>The title of the cumulative-loss chart.</summary>
    internal const string CumulativeTitle = "Cumulative QLIKE loss against implied";

    /// <summary>The title of the lookback chart.</summary>
    internal const string LookbackTitle = "Mean QLIKE loss against lookback";

    /// <summary>The title of the cone.</summary>
    internal const string ConeTitle = "Volatility cone (Hodges-Tompkins adjusted)";

    /// <summary>The title of the rule-test chart.</summary>
    internal const string RuleTestTitle = "Implied minus realized: signalled dates against all dates";

    /// <summary>Forecasts, implied and realized volatility over time.</summary>
    /// <param name="realized">The realized volatility that followed each forecast date (decimal).</param>
    /// <param name="implied">The implied volatility quoted on each date (decimal), when there is one.</param>
    /// <param name="forecasts">The leading forecasters' series (decimal), each named by its spec.</param>
    /// <param name="colors">The report's colour map, or null for one made from these series.</param>
    /// <returns>The chart as <c>forecast-vs-realized.png</c>.</returns>
    internal static ChartImage ForecastVsRealized(TimeSeries realized, TimeSeries? implied, IReadOnlyList<TimeSeries> forecasts, SeriesColors? colors = null)
    {
        using var plot = BuildForecastVsRealized(realized, implied, forecasts, colors);
        return new ChartImage("forecast-vs-realized.png", ForecastTitle,
            "Each line is an annualized volatility in percent on the date the forecast was made; the black line is the realized volatility that followed over the horizon.",
            ChartStyle.Png(plot));
    }

    /// <summary>Implied minus realized volatility over time, with its mean and 10th–90th percentile band.</summary>
    /// <param name="premium">Implied minus realized volatility on each date (decimal, so 0.02 = 2 vol points).</param>
    /// <returns>The chart as <c>premium.png</c>.</returns>
    internal static ChartImage Premium(TimeSeries premium)
    {
        using var plot = BuildPremium(premium);
        return new ChartImage("premium.png", PremiumTitle,
            "Above zero, the implied volatility quoted on that date was higher than the volatility that followed. The dashed line is the mean; the shaded band holds the middle 80% of dates.",
            ChartStyle.Png(plot));
    }

    /// <summary>Cumulative QLIKE loss of each forecaster minus that of implied volatility, from the first date they all share.</summary>
    /// <param name="lossDifferentials">Per forecaster and date, QLIKE(forecaster) − QLIKE(implied); the chart adds them up.</param>
    /// <param name="colors">The report's colour map, or null for one made from these series.</param>
    /// <returns>The chart as <c>cumulative-qlike.png</c>.</returns>
    internal static ChartImage CumulativeLossDifferential(IReadOnlyList<TimeSeries> lossDifferentials, SeriesColors? colors = null)
    {
        using var plot = BuildCumulativeLossDifferential(lossDifferentials, colors);
        return new ChartImage("cumulative-qlike.png", CumulativeTitle,
            "Each line adds up the forecaster's daily QLIKE loss minus implied's, from the first date every line has. A falling line means the forecaster lost less than implied volatility over that stretch (it helped); a rising line means it lost more (it hurt).",
            ChartStyle.Png(plot));
    }

    /// <summary>Mean loss against lookback for each estimator family, with the out-of-sample choices marked.</summary>
    /// <param name="curves">One curve per family.</param>
    /// <param name="colors">The report's colour map, or null for one made from these families.</param>
    /// <returns>The chart as <c>loss-vs-lookback.png</c>.</returns>
    internal static ChartImage LossVsLookback(IReadOnlyList<LookbackCurve> curves, SeriesColors? colors = null)
    {
        using var plot = BuildLossVsLookback(curves, colors);
        return new ChartImage("loss-vs-lookback.png", LookbackTitle,
            "Mean QLIKE loss (lower is better) for each lookback, in sample, on a log scale of lookbacks; each family is drawn in the colour of its adaptive forecaster. The open circles are the lookbacks the walk-forward selection chose out of sample on at least 2% of dates, sized by how often. EWMA decays are in the lookback table, not here.",
            ChartStyle.Png(plot));
    }

    /// <summary>Mincer-Zarnowitz scatter of realized against forecast variance on log-log axes, with the fitted line and y = x.</summary>
    /// <param name="forecaster">The forecaster's spec, for the title.</param>
    /// <param name="forecastVariance">Forecast annualized variance on each date (decimal², 0.04 = 20% vol).</param>
    /// <param name="realizedVariance">Realized annualized variance that followed (decimal²), same length.</param>
    /// <param name="intercept">The fitted intercept a in RV² = a + b F² (decimal²).</param>
    /// <param name="slope">The fitted slope b.</param>
    /// <param name="colors">The report's colour map, or null for one made from this forecaster.</param>
    /// <returns>The chart as <c>mincer-zarnowitz.png</c>.</returns>
    internal static ChartImage MincerZarnowitz(string forecaster, IReadOnlyList<double> forecastVariance, IReadOnlyList<double> realizedVariance, double intercept, double slope, SeriesColors? colors = null)
    {
        using var plot = BuildMincerZarnowitz(forecaster, forecastVariance, realizedVariance, intercept, slope, colors);
        return new ChartImage("mincer-zarnowitz.png", MincerZarnowitzTitle(forecaster),
            "Each point is one forecast date, variances in %² (20% volatility is 400 %²) on log scales on both axes. An unbiased forecast scatters around the line y = x; the fitted line is the regression of realized on forecast variance (a straight line in variance, curved on log axes).",
            ChartStyle.Png(plot));
    }

    /// <summary>The Mincer-Zarnowitz chart's title for a forecaster.</summary>
    internal static string MincerZarnowitzTitle(string forecaster) => $"Mincer-Zarnowitz: realized against forecast variance, {forecaster}";

    /// <summary>The volatility cone (Hodges-Tompkins adjusted percentiles) with today's realized, implied and forecasts on it.</summary>
    /// <param name="cone">The cone.</param>
    /// <param name="overlays">Points to draw on it: the latest implied volatility and forecasts at their horizons.</param>
    /// <returns>The chart as <c>cone.png</c>.</returns>
    public static ChartImage Cone(VolatilityConeResult cone, IReadOnlyList<ConeOverlay> overlays) => Cone(cone, overlays, null);

    /// <summary>The volatility cone with the report's colour map.</summary>
    internal static ChartImage Cone(VolatilityConeResult cone, IReadOnlyList<ConeOverlay> overlays, SeriesColors? colors)
    {
        using var plot = BuildCone(cone, overlays, colors);
        return new ChartImage("cone.png", ConeTitle,
            "For each horizon (log scale), the spread of realized volatility over every window of that length in the history, adjusted for overlapping windows (Hodges-Tompkins): the dark band holds the middle half of windows, the light band the middle 80%, the line is the median and the thin whiskers reach the lowest and highest. The black circles are the latest window's realized volatility at each horizon; the filled markers are today's implied volatility and forecasts, each on its own horizon, except that a marker that would cover another or the black circle there is set aside by whole marker widths, right or left.",
            ChartStyle.Png(plot));
    }

    /// <summary>The distribution of implied minus realized volatility on the dates a rule signalled, against all dates, with the difference of their means.</summary>
    /// <param name="allDates">IV − RV on every date (decimal).</param>
    /// <param name="signalledDates">IV − RV on the dates the rule signalled (decimal).</param>
    /// <param name="rule">The rule in words, e.g. <c>sell when implied &gt; ewma:0.94</c>, for the legend.</param>
    /// <param name="forecastSpec">The forecaster the rule uses: the signalled dates are drawn in its colour.</param>
    /// <param name="differenceP">The p-value of the test that the signalled dates' mean differs from all dates', or null when there is none.</param>
    /// <param name="colors">The report's colour map, or null for one made from the rule's forecaster.</param>
    /// <returns>The chart as <c>rule-test.png</c>.</returns>
    internal static ChartImage RuleTest(IReadOnlyList<double> allDates, IReadOnlyList<double> signalledDates, string rule, string forecastSpec, double? differenceP = null, SeriesColors? colors = null)
    {
        using var plot = BuildRuleTest(allDates, signalledDates, rule, forecastSpec, differenceP, colors);
        return new ChartImage("rule-test.png", RuleTestTitle,
            "Share of dates in each band of implied minus realized volatility, for the dates the rule signalled and for all dates. The bracket above runs from the mean of all dates (grey circle) to the mean of the signalled dates (the difference the rule test is about); the legend gives it in vol points with the p-value of a Newey-West test that it is zero (delta method, allowing for overlapping windows).",
            ChartStyle.Png(plot));
    }

    /// <summary>The reliability diagram: observed frequency against predicted probability per bin, with the y = x line, interval bars and bin counts.</summary>
    /// <param name="curves">One curve per forecaster (implied first when there is one).</param>
    /// <param name="pooling">Which strikes the bins pool, e.g. <c>pooled over strikes 0.90–1.10 × close</c>, for the title.</param>
    /// <param name="colors">The report's colour map, or null for one made from these curves.</param>
    /// <returns>The chart as <c>reliability.png</c>.</returns>
    internal static ChartImage Reliability(IReadOnlyList<ReliabilityCurve> curves, string pooling, SeriesColors? colors = null)
    {
        using var plot = BuildReliability(curves, pooling, colors);
        return new ChartImage(ReliabilityFileName, ReliabilityTitle(pooling),
            "Each point is one bin of predicted probabilities that the close at the horizon ends above a strike: across, the mean probability the forecaster's volatility gave (N(d2)); up, the share of those dates on which it did; the small number on each bar's line (just above it, or below it or a little further along where another count is in the way) is the bin's count of dates. Forecasters are set a little apart across so that their bars do not overlap. Points on the dashed line y = x mean the odds held; the bars are 95% Wilson intervals on n / h dates, widened for overlapping windows. Below the line in the low bins and above it in the high bins means the probabilities stayed too close to 50% (the volatility was too high); the reverse means they were too bold.",
            ChartStyle.Png(plot));
    }

    /// <summary>The reliability diagram's file name.</summary>
    internal const string ReliabilityFileName = "reliability.png";

    /// <summary>The reliability diagram's title for a pooling.</summary>
    internal static string ReliabilityTitle(string pooling) => "Reliability of P(close at horizon > strike), " + pooling;

    /// <summary>How far apart, in percentage points of predicted probability, the reliability curves of different forecasters are drawn.</summary>
    internal const double ReliabilityOffset = 1.2;

    internal static Plot BuildReliability(IReadOnlyList<ReliabilityCurve> curves, string pooling, SeriesColors? colors = null)
    {
        ArgumentNullException.ThrowIfNull(curves);
        ArgumentNullException.ThrowIfNull(pooling);
        colors ??= new SeriesColors(curves.Select(c => c.Name));
        var plot = ChartStyle.NewPlot(ReliabilityTitle(pooling), "Predicted probability (%)", "Observed frequency (%)");
        var diagonal = plot.Add.Line(0, 0, 100, 100);
        diagonal.Color = ChartStyle.Reference;
        diagonal.LineWidth = 2;
        diagonal.LinePattern = LinePattern.Dashed;
        diagonal.LegendText = "y = x (odds held)";

        // The counts are placed together once the chart is drawn, so that where bins of different forecasters meet no
        // count is written over another.
        var counts = new CountLabels();
        for (var k = 0; k < curves.Count; k++)
        {
            var curve = curves[k];
            var n = curve.Predicted.Count;
            if (curve.Observed.Count != n || curve.Lower.Count != n || curve.Upper.Count != n || curve.Counts.Count != n)
            {
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"curve '{curve.Name}' has {n} predicted values but {curve.Observed.Count} observed, {curve.Lower.Count} lower, {curve.Upper.Count} upper and {curve.Counts.Count} counts; expected one of each per bin."), nameof(curves));
            }

            var style = colors.Style(curve.Name);
            var offset = ReliabilityOffset * (k - ((curves.Count - 1) / 2.0));
            var xs = new double[n];
            var ys = new double[n];
            for (var i = 0; i < n; i++)
            {
                xs[i] = (curve.Predicted[i] * 100.0) + offset;
                ys[i] = curve.Observed[i] * 100.0;
                var bar = plot.Add.Line(xs[i], curve.Lower[i] * 100.0, xs[i], curve.Upper[i] * 100.0);
                bar.Color = style.Color.WithAlpha(0.7);
                bar.LineWidth = 2;
                bar.LegendText = string.Empty;
                counts.Add(new CountLabel(curve.Counts[i].ToString(CultureInfo.InvariantCulture), xs[i], curve.Upper[i] * 100.0, curve.Lower[i] * 100.0, style.Color));
            }

            var line = plot.Add.Scatter(xs, ys);
            line.Color = style.Color;
            line.LineWidth = 2;
            line.LinePattern = style.Pattern;
            line.MarkerSize = 9;
            line.MarkerShape = style.Marker;
            line.LegendText = curve.Name;
        }

        plot.Add.Plottable(counts);
        plot.Axes.SetLimits(-3, 103, -2, 106);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    internal static Plot BuildForecastVsRealized(TimeSeries realized, TimeSeries? implied, IReadOnlyList<TimeSeries> forecasts, SeriesColors? colors = null)
    {
        ArgumentNullException.ThrowIfNull(realized);
        ArgumentNullException.ThrowIfNull(forecasts);
        colors ??= new SeriesColors(forecasts.Select(f => f.Name));
        var plot = ChartStyle.NewPlot(ForecastTitle, "Forecast date", "Annualized volatility (%)");
        foreach (var forecast in forecasts)
        {
            AddLine(plot, forecast, 100.0, colors.Style(forecast.Name), 1.5f, forecast.Name);
        }

        if (implied is not null)
        {
            AddLine(plot, implied, 100.0, colors.Style(ImpliedSeries.Name), 1.5f, implied.Name);
        }

        AddLine(plot, realized, 100.0, colors.Style("realized"), 1.5f, realized.Name);
        ChartStyle.DateAxis(plot, "Forecast date");
        plot.Axes.Margins(0.01, 0.05);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    internal static Plot BuildPremium(TimeSeries premium)
    {
        ArgumentNullException.ThrowIfNull(premium);
        var plot = ChartStyle.NewPlot(PremiumTitle, "Forecast date", "Implied − realized (vol points)");
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
            band.FillColor = ChartStyle.Band.WithAlpha(0.45);
            band.LineColor = Colors.Transparent;
            band.LegendText = string.Create(CultureInfo.InvariantCulture, $"10th–90th percentile ({low:0.0} to {high:0.0})");
        }

        ChartStyle.ZeroLine(plot);

        // The premium is implied's: it is drawn in implied's colour.
        AddLine(plot, premium, 100.0, new SeriesStyle(ChartStyle.Implied, LinePattern.Solid, MarkerShape.FilledCircle), 1.2f, premium.Name);
        if (points.Length > 0)
        {
            var mean = points.Average();
            var meanLine = plot.Add.HorizontalLine(mean);
            meanLine.Color = ChartStyle.Realized;
            meanLine.LineWidth = 2.5f;
            meanLine.LinePattern = LinePattern.Dashed;
            meanLine.LegendText = string.Create(CultureInfo.InvariantCulture, $"mean {mean:0.00}");
        }

        ChartStyle.DateAxis(plot, "Forecast date");
        plot.Axes.Margins(0.01, 0.05);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    /// <summary>The first date on which every series has a value (the latest of their first dates), or null when there are none.</summary>
    internal static DateOnly? CommonStart(IReadOnlyList<TimeSeries> series)
    {
        DateOnly? start = null;
        foreach (var s in series)
        {
            if (s.Dates.Count == 0)
            {
                continue;
            }

            start = start is DateOnly d && d >= s.Dates[0] ? d : s.Dates[0];
        }

        return start;
    }

    internal static Plot BuildCumulativeLossDifferential(IReadOnlyList<TimeSeries> lossDifferentials, SeriesColors? colors = null)
    {
        ArgumentNullException.ThrowIfNull(lossDifferentials);
        colors ??= new SeriesColors(lossDifferentials.Select(f => f.Name));
        var plot = ChartStyle.NewPlot(CumulativeTitle, "Forecast date", "Cumulative QLIKE, forecaster − implied (loss units)");
        ChartStyle.ZeroLine(plot);

        // Every line starts on the first date all of them have, so that they add up over the same stretch.
        var start = CommonStart(lossDifferentials);
        foreach (var series in lossDifferentials)
        {
            var xs = new List<double>(series.Dates.Count);
            var ys = new List<double>(series.Dates.Count);
            var sum = 0.0;
            for (var i = 0; i < series.Dates.Count; i++)
            {
                if (series.Dates[i] < start)
                {
                    continue;
                }

                sum += series.Values[i];
                xs.Add(ChartStyle.X(series.Dates[i]));
                ys.Add(sum);
            }

            var (drawnX, drawnY) = ChartPoints.Line([.. xs], [.. ys]);
            var style = colors.Style(series.Name);
            var line = plot.Add.ScatterLine(drawnX, drawnY);
            line.Color = style.Color;
            line.LinePattern = style.Pattern;
            line.LineWidth = 2;
            line.LegendText = series.Name;
        }

        ChartStyle.DateAxis(plot, "Forecast date");
        plot.Axes.Margins(0.01, 0.05);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    /// <summary>The legend text of the out-of-sample marks on the lookback chart.</summary>
    internal const string ChosenLegend = "chosen out of sample (circle size: share of dates)";

    internal static Plot BuildLossVsLookback(IReadOnlyList<LookbackCurve> curves, SeriesColors? colors = null)
    {
        ArgumentNullException.ThrowIfNull(curves);
        colors ??= new SeriesColors(curves.Select(c => "adaptive:" + c.Family));
        var plot = ChartStyle.NewPlot(LookbackTitle, "Lookback (trading days, log scale)", "Mean QLIKE loss, in sample (lower is better)");
        var swept = new SortedSet<double>();
        foreach (var curve in curves)
        {
            // The family is drawn in the colour of the adaptive forecaster that chooses among its lookbacks.
            var style = colors.Style("adaptive:" + curve.Family);
            var xs = new double[curve.LookbackDays.Count];
            var ys = new double[xs.Length];
            for (var i = 0; i < xs.Length; i++)
            {
                xs[i] = Math.Log10(curve.LookbackDays[i]);
                ys[i] = curve.MeanLoss[i];
                swept.Add(curve.LookbackDays[i]);
            }

            var line = plot.Add.Scatter(xs, ys);
            line.Color = style.Color;
            line.LinePattern = style.Pattern;
            line.LineWidth = 2;
            line.MarkerSize = 7;
            line.MarkerShape = style.Marker;
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

                var marker = plot.Add.Marker(Math.Log10(lookback), curve.MeanLoss[index]);
                marker.Color = style.Color;
                marker.MarkerShape = MarkerShape.OpenCircle;
                marker.MarkerLineWidth = 2.5f;
                marker.Size = 10 + (30f * times / curve.ChosenLookbackDays.Count);
            }
        }

        plot.Legend.ManualItems.Add(new LegendItem
        {
            LabelText = ChosenLegend,
            MarkerShape = MarkerShape.OpenCircle,
            MarkerColor = ChartStyle.Reference,
            MarkerSize = 14,
            MarkerLineWidth = 2.5f,
            LineWidth = 0,
        });
        ChartStyle.LogTicksBottom(plot, swept);
        plot.Axes.Margins(0.05, 0.1);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    /// <summary>How many points draw the fitted Mincer-Zarnowitz line, which bends on log axes.</summary>
    private const int FittedPoints = 60;

    internal static Plot BuildMincerZarnowitz(string forecaster, IReadOnlyList<double> forecastVariance, IReadOnlyList<double> realizedVariance, double intercept, double slope, SeriesColors? colors = null)
    {
        ArgumentNullException.ThrowIfNull(forecaster);
        ArgumentNullException.ThrowIfNull(forecastVariance);
        ArgumentNullException.ThrowIfNull(realizedVariance);
        if (forecastVariance.Count != realizedVariance.Count)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"realizedVariance has {realizedVariance.Count} values but forecastVariance has {forecastVariance.Count}; expected one pair per date."), nameof(realizedVariance));
        }

        colors ??= new SeriesColors([forecaster]);
        var style = colors.Style(forecaster);
        var plot = ChartStyle.NewPlot(MincerZarnowitzTitle(forecaster), "Forecast variance F² (annualized, %², log scale)", "Realized variance RV² (annualized, %², log scale)");

        // Variances in %² (decimal² × 10 000) on log axes: the cloud spreads out instead of sitting in one corner.
        var xs = new List<double>(forecastVariance.Count);
        var ys = new List<double>(forecastVariance.Count);
        double low = double.PositiveInfinity, high = 0, lowY = double.PositiveInfinity, highY = 0;
        for (var i = 0; i < forecastVariance.Count; i++)
        {
            var f = forecastVariance[i] * 1e4;
            var r = realizedVariance[i] * 1e4;
            if (f > 0 && r > 0 && double.IsFinite(f) && double.IsFinite(r))
            {
                xs.Add(Math.Log10(f));
                ys.Add(Math.Log10(r));
                low = Math.Min(low, f);
                high = Math.Max(high, f);
                lowY = Math.Min(lowY, r);
                highY = Math.Max(highY, r);
            }
        }

        var (drawnX, drawnY) = ChartPoints.Scatter([.. xs], [.. ys]);
        var points = plot.Add.ScatterPoints(drawnX, drawnY);
        points.Color = style.Color.WithAlpha(0.4);
        points.MarkerShape = style.Marker;
        points.MarkerSize = 4;
        points.LegendText = "forecast dates";

        if (xs.Count > 0)
        {
            var diagonal = plot.Add.Line(Math.Log10(low), Math.Log10(low), Math.Log10(high), Math.Log10(high));
            diagonal.Color = ChartStyle.Reference;
            diagonal.LineWidth = 2;
            diagonal.LinePattern = LinePattern.Dashed;
            diagonal.LegendText = "y = x (unbiased)";

            var fx = new List<double>(FittedPoints);
            var fy = new List<double>(FittedPoints);
            for (var i = 0; i < FittedPoints; i++)
            {
                var x = Math.Log10(low) + ((Math.Log10(high) - Math.Log10(low)) * i / (FittedPoints - 1));
                var y = (intercept * 1e4) + (slope * Math.Pow(10, x));
                if (y > 0)
                {
                    fx.Add(x);
                    fy.Add(Math.Log10(y));
                }
            }

            var fitted = plot.Add.ScatterLine(fx.ToArray(), fy.ToArray());
            fitted.Color = ChartStyle.Realized;
            fitted.LineWidth = 2.5f;
            fitted.LegendText = string.Create(CultureInfo.InvariantCulture, $"fitted: RV² = {intercept * 1e4:0.0} %² + {slope:0.000} F²");
            ChartStyle.LogTicksBottom(plot, ChartStyle.RoundLogValues(low, high));
            ChartStyle.LogTicksLeft(plot, ChartStyle.RoundLogValues(Math.Min(low, lowY), Math.Max(high, highY)));
        }

        plot.Axes.Margins(0.02, 0.05);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    /// <summary>The shaded bands of the cone: the 10th–90th and 25th–75th percentiles at each horizon, in percent.</summary>
    internal static IReadOnlyList<(string Label, double[] Lower, double[] Upper)> ConeBands(VolatilityConeResult cone)
    {
        ArgumentNullException.ThrowIfNull(cone);
        var h = cone.Horizons;
        return
        [
            ("10th–90th percentile", [.. h.Select(x => x.Adjusted.P10 * 100.0)], [.. h.Select(x => x.Adjusted.P90 * 100.0)]),
            ("25th–75th percentile", [.. h.Select(x => x.Adjusted.P25 * 100.0)], [.. h.Select(x => x.Adjusted.P75 * 100.0)]),
        ];
    }

    /// <summary>The legend text of the cone's current realized volatility.</summary>
    internal const string ConeLatest = "realized, latest window";

    internal static Plot BuildCone(VolatilityConeResult cone, IReadOnlyList<ConeOverlay> overlays, SeriesColors? colors = null)
    {
        ArgumentNullException.ThrowIfNull(cone);
        ArgumentNullException.ThrowIfNull(overlays);
        colors ??= new SeriesColors(overlays.Select(o => o.Name));
        var plot = ChartStyle.NewPlot(ConeTitle, "Horizon (trading days, log scale)", "Annualized realized volatility (%)");
        var xs = new double[cone.Horizons.Count];
        for (var i = 0; i < xs.Length; i++)
        {
            xs[i] = Math.Log10(cone.Horizons[i].HorizonDays);
        }

        // Min and max as thin whiskers, one per horizon, under the bands.
        for (var i = 0; i < xs.Length; i++)
        {
            var whisker = plot.Add.Line(xs[i], cone.Horizons[i].Adjusted.Min * 100.0, xs[i], cone.Horizons[i].Adjusted.Max * 100.0);
            whisker.Color = ChartStyle.Neutral;
            whisker.LineWidth = 1.2f;
            whisker.LegendText = i == 0 ? "min to max" : string.Empty;
            foreach (var end in new[] { cone.Horizons[i].Adjusted.Min, cone.Horizons[i].Adjusted.Max })
            {
                var cap = plot.Add.Marker(xs[i], end * 100.0);
                cap.MarkerShape = MarkerShape.HorizontalBar;
                cap.Size = 12;
                cap.MarkerLineWidth = 1.2f;
                cap.Color = ChartStyle.Neutral;
                cap.LegendText = string.Empty;
            }
        }

        var shades = new[] { ChartStyle.Band.WithAlpha(0.55), ChartStyle.Neutral.WithAlpha(0.6) };
        var bands = ConeBands(cone);
        for (var b = 0; b < bands.Count; b++)
        {
            var (label, lower, upper) = bands[b];
            var fill = plot.Add.FillY(xs, lower, upper);
            fill.FillColor = shades[b];
            fill.LineColor = Colors.Transparent;
            fill.LineWidth = 0;
            fill.LegendText = label;
        }

        var median = plot.Add.Scatter(xs, [.. cone.Horizons.Select(h => h.Adjusted.Median * 100.0)]);
        median.Color = ChartStyle.Reference;
        median.LineWidth = 3;
        median.MarkerSize = 0;
        median.LegendText = "median";

        // Today's realized volatility at every horizon, under implied and the forecasts.
        var latest = plot.Add.Scatter(xs, [.. cone.Horizons.Select(h => h.Latest * 100.0)]);
        var realized = colors.Style("realized");
        latest.Color = realized.Color;
        latest.LineWidth = 1.5f;
        latest.LinePattern = LinePattern.Dashed;
        latest.MarkerShape = MarkerShape.OpenCircle;
        latest.MarkerSize = 11;
        latest.MarkerLineWidth = 2;
        latest.LegendText = ConeLatest;

        // Each of today's markers stands on its own horizon; only one that would cover another marker or the latest
        // realized circle there is moved aside, by the least that clears it (set in pixels when the chart is drawn).
        var today = new ConeMarkers();
        for (var i = 0; i < xs.Length; i++)
        {
            today.Avoid(xs[i], cone.Horizons[i].Latest * 100.0, latest.MarkerSize + latest.MarkerLineWidth);
        }

        foreach (var overlay in overlays)
        {
            var style = colors.Style(overlay.Name);
            var marker = today.Add(Math.Log10(overlay.HorizonDays), overlay.AnnualizedVolatility * 100.0);
            marker.MarkerShape = style.Marker;
            marker.Size = 14;
            marker.Color = style.Color;
            marker.LegendText = overlay.Name;
        }

        plot.Add.Plottable(today);

        ChartStyle.LogTicksBottom(plot, cone.Horizons.Select(h => (double)h.HorizonDays));
        plot.Axes.Margins(0.04, 0.08);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    /// <summary>The legend text of the rule-test chart's difference bracket.</summary>
    internal static string DifferenceLegend(double difference, double? p) => p is double value
        ? string.Create(CultureInfo.InvariantCulture, $"signalled − all dates = {difference:+0.00;−0.00;0.00} vol points ({PValue(value)})")
        : string.Create(CultureInfo.InvariantCulture, $"signalled − all dates = {difference:+0.00;−0.00;0.00} vol points");

    internal static Plot BuildRuleTest(IReadOnlyList<double> allDates, IReadOnlyList<double> signalledDates, string rule, string forecastSpec, double? differenceP = null, SeriesColors? colors = null)
    {
        ArgumentNullException.ThrowIfNull(allDates);
        ArgumentNullException.ThrowIfNull(signalledDates);
        ArgumentNullException.ThrowIfNull(rule);
        ArgumentNullException.ThrowIfNull(forecastSpec);
        colors ??= new SeriesColors([forecastSpec]);
        var color = colors.Style(forecastSpec).Color;
        var plot = ChartStyle.NewPlot(RuleTestTitle, "Implied − realized (vol points)", "Share of dates (%)");
        var all = Scale(allDates, 100.0);
        var signalled = Scale(signalledDates, 100.0);
        var zero = plot.Add.VerticalLine(0);
        zero.Color = ChartStyle.Reference;
        zero.LineWidth = 1;
        if (all.Length > 0)
        {
            var (edges, width) = Bins(all, 40);
            var top = AddHistogram(plot, all, edges, width, ChartStyle.Neutral, $"all dates (n = {all.Length.ToString(CultureInfo.InvariantCulture)})", filled: true);
            top = Math.Max(top, AddHistogram(plot, signalled, edges, width, color, $"{rule} (n = {signalled.Length.ToString(CultureInfo.InvariantCulture)})", filled: false));
            if (signalled.Length > 0)
            {
                // The difference the test is about, as a bracket above the bars from one mean to the other.
                var meanAll = all.Average();
                var meanSignalled = signalled.Average();
                var y = top * 1.12;
                var bracket = plot.Add.Line(meanAll, y, meanSignalled, y);
                bracket.Color = color;
                bracket.LineWidth = 3;
                bracket.LegendText = DifferenceLegend(meanSignalled - meanAll, differenceP);
                var from = plot.Add.Marker(meanAll, y);
                from.MarkerShape = MarkerShape.FilledCircle;
                from.Size = 11;
                from.Color = ChartStyle.Neutral;
                from.LegendText = string.Create(CultureInfo.InvariantCulture, $"mean, all dates {meanAll:0.00}");
                var to = plot.Add.Marker(meanSignalled, y);
                to.MarkerShape = MarkerShape.FilledTriangleUp;
                to.Size = 13;
                to.Color = color;
                to.LegendText = string.Create(CultureInfo.InvariantCulture, $"mean, signalled {meanSignalled:0.00}");
            }
        }

        plot.Axes.Margins(0.02, 0.08);
        ChartStyle.LegendBelow(plot);
        return plot;
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

    /// <summary>Draws a histogram's outline and returns its highest share (0 when there are no values).</summary>
    private static double AddHistogram(Plot plot, double[] values, double[] edges, double width, Color color, string label, bool filled)
    {
        if (values.Length == 0)
        {
            return 0;
        }

        var shares = Shares(values, edges, width);
        var (xs, ys) = StepOutline(edges, shares);
        var fill = plot.Add.ScatterLine(xs, ys);
        fill.Color = color;
        fill.LineWidth = 2.5f;
        fill.FillY = filled;
        fill.FillYColor = color.WithAlpha(0.2);
        fill.LegendText = label;
        return shares.Max();
    }

    private static void AddLine(Plot plot, TimeSeries series, double scale, SeriesStyle style, float width, string label)
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
        line.Color = style.Color;
        line.LinePattern = style.Pattern;
        line.LineWidth = width;
        line.LegendText = label;
    }

    private static string PValue(double p) => p < 0.001 ? "p < 0.001" : string.Create(CultureInfo.InvariantCulture, $"p = {p:0.000}");

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
