using System.Collections.Immutable;
using System.Globalization;
using ScottPlot;
using VolCast.Core.Trading;
using VolCast.Reports.Model;

namespace VolCast.Reports.Charts;

/// <summary>
/// The charts of the "Would the rule have paid?" section, drawn from the same Core records that rule-pnl.csv and
/// trades.csv are written from: cumulative net P&amp;L with its drawdown, the trades' P&amp;L and the P&amp;L by year.
/// Each rule keeps its colour (<see cref="ChartStyle.Rule"/>) in all three.
/// </summary>
internal static class PnlCharts
{
    /// <summary>The cumulative P&amp;L chart's file name.</summary>
    public const string CumulativeFileName = "rule-pnl-cumulative.png";

    /// <summary>The trade histogram's file name.</summary>
    public const string TradesFileName = "rule-pnl-trades.png";

    /// <summary>The P&amp;L-by-year chart's file name.</summary>
    public const string YearsFileName = "rule-pnl-by-year.png";

    /// <summary>The chart of the two daily marks (quoted implied against entry implied).</summary>
    public const string MarksFileName = "rule-pnl-marks.png";

    private const int TopHeight = 370;

    private const float LeftPadding = 100;

    /// <summary>Cumulative net P&amp;L of each rule's every-signal ladder (marked daily at the quoted implied), with a drawdown panel below.</summary>
    public static ChartImage Cumulative(ImmutableArray<DateOnly> dates, IReadOnlyList<RulePnl> rules)
    {
        var (top, bottom) = BuildCumulative(dates, rules);
        using (top)
        using (bottom)
        {
            return new ChartImage(CumulativeFileName, "Cumulative net P&L of the rules",
                "Upper panel: the running sum of each rule's daily net P&L in vol points (trades on every signal, each sized 1/h, h the horizon in trading days, marked daily at the quoted implied volatility; the daily values are in rule-pnl.csv). Lower panel: how far each rule stood below its own earlier peak.",
                Stack(top, bottom));
        }
    }

    /// <summary>The distribution of each rule's net trade P&amp;L (one trade at a time), with each rule's worst trade marked.</summary>
    public static ChartImage Trades(IReadOnlyList<RulePnl> rules)
    {
        using var plot = BuildTrades(rules);
        return new ChartImage(TradesFileName, "Net P&L per trade",
            "Number of trades in each band of net P&L per trade in vol points (one trade at a time, no overlap; the trades are in trades.csv). The dashed line of each colour marks that rule's worst trade.",
            ChartStyle.Png(plot));
    }

    /// <summary>Each rule's net P&amp;L summed over each calendar year.</summary>
    public static ChartImage Years(IReadOnlyList<RulePnl> rules)
    {
        using var plot = BuildYears(rules);
        return new ChartImage(YearsFileName, "Net P&L by calendar year",
            "Each bar is one rule's daily net P&L summed over a calendar year, in vol points (the first and last years may be partial).",
            ChartStyle.Png(plot));
    }

    /// <summary>
    /// Cumulative net P&amp;L of always-sell and the proposed rule on both daily marks: at the quoted implied (a thin line)
    /// and at each trade's entry implied, the gamma-against-theta path (a wide pale band under it).
    /// </summary>
    public static ChartImage Marks(ImmutableArray<DateOnly> dates, IReadOnlyList<RulePnl> rules)
    {
        using var plot = BuildMarks(dates, rules);
        return new ChartImage(MarksFileName, "The same trades on two daily marks",
            "Running sum of the daily net P&L in vol points of always-sell and the proposed rule (trades on every signal, each sized 1/h, h the horizon in trading days). Thin line: each open trade marked at that day's quoted implied volatility (the path the drawdown, Sharpe and Sortino use). Wide pale band of the same colour: marked at the trade's own entry implied, so only the hedged moves of spot count (gamma against theta). Each trade's marks sum to its P&L at expiry on both, so the line returns to its band wherever no trade is open; where it leaves the band, implied moved mid-trade. The other rules' paths are in rule-pnl.csv (column pnl_entry_vol).",
            ChartStyle.Png(plot));
    }

    /// <summary>The rules the marks chart draws: always-sell and the proposed rule.</summary>
    internal static IEnumerable<RulePnl> MarkedRules(IReadOnlyList<RulePnl> rules) =>
        rules.Where(r => r.Rule is TradingRule.AlwaysSell or TradingRule.Proposed);

    internal static Plot BuildMarks(ImmutableArray<DateOnly> dates, IReadOnlyList<RulePnl> rules)
    {
        ArgumentNullException.ThrowIfNull(rules);
        var xs = new double[dates.Length];
        for (var i = 0; i < xs.Length; i++)
        {
            xs[i] = ChartStyle.X(dates[i]);
        }

        var plot = ChartStyle.NewPlot("Cumulative net P&L: marked at quoted implied and at entry implied", "Date", "Cumulative P&L (vol points)");
        ChartStyle.ZeroLine(plot);
        foreach (var rule in MarkedRules(rules))
        {
            if (rule.DailyPnl.Length != xs.Length || rule.DailyPnlEntryVol.Length != xs.Length)
            {
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"The {RuleNames.Name(rule.Rule)} rule's daily paths have {rule.DailyPnl.Length} and {rule.DailyPnlEntryVol.Length} values but there are {xs.Length} dates; expected one per date."), nameof(rules));
            }

            // The two marks of one rule mostly coincide: the entry-implied path is drawn first as a wide pale band and the
            // quoted-implied path on it as a thin line, so the line leaving its band is where implied moved mid-trade.
            var color = ChartStyle.Rule(rule.Rule);
            foreach (var (daily, band, label) in new[] { (rule.DailyPnlEntryVol, true, "marked at entry implied (pale band)"), (rule.DailyPnl, false, "marked at quoted implied (line)") })
            {
                var (cx, cy) = ChartPoints.Line(xs, CumulativeSum(daily));
                var line = plot.Add.ScatterLine(cx, cy);
                line.Color = band ? color.WithAlpha(0.3) : color;
                line.LineWidth = band ? 7f : 1.6f;
                line.LegendText = RuleNames.Name(rule.Rule) + ", " + label;
            }
        }

        ChartStyle.DateAxis(plot, "Date");
        plot.Axes.Margins(0.01, 0.05);
        if (xs.Length > 1)
        {
            plot.Axes.SetLimitsX(xs[0], xs[^1]);
        }

        ChartStyle.LegendBelow(plot);
        return plot;
    }

    /// <summary>The running sum of a daily path.</summary>
    public static double[] CumulativeSum(IReadOnlyList<double> daily)
    {
        var sums = new double[daily.Count];
        var sum = 0.0;
        for (var i = 0; i < sums.Length; i++)
        {
            sum += daily[i];
            sums[i] = sum;
        }

        return sums;
    }

    /// <summary>The cumulative path minus its running peak (the start counts as a peak of 0): 0 or below.</summary>
    public static double[] Drawdown(IReadOnlyList<double> cumulative)
    {
        var drawdown = new double[cumulative.Count];
        var peak = 0.0;
        for (var i = 0; i < drawdown.Length; i++)
        {
            peak = Math.Max(peak, cumulative[i]);
            drawdown[i] = cumulative[i] - peak;
        }

        return drawdown;
    }

    internal static (Plot Top, Plot Bottom) BuildCumulative(ImmutableArray<DateOnly> dates, IReadOnlyList<RulePnl> rules)
    {
        ArgumentNullException.ThrowIfNull(rules);
        var xs = new double[dates.Length];
        for (var i = 0; i < xs.Length; i++)
        {
            xs[i] = ChartStyle.X(dates[i]);
        }

        var top = ChartStyle.NewPlot("Cumulative net P&L (marked daily at quoted implied)", string.Empty, "Cumulative P&L (vol points)");
        var bottom = ChartStyle.NewPlot(string.Empty, string.Empty, "Drawdown (vol points)");
        bottom.Axes.Left.Label.FontSize = 15;
        foreach (var plot in new[] { top, bottom })
        {
            ChartStyle.ZeroLine(plot);
        }

        foreach (var rule in rules)
        {
            if (rule.DailyPnl.Length != xs.Length)
            {
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"The {RuleNames.Name(rule.Rule)} rule's daily path has {rule.DailyPnl.Length} values but there are {xs.Length} dates; expected one per date."), nameof(rules));
            }

            var cumulative = CumulativeSum(rule.DailyPnl);
            var color = ChartStyle.Rule(rule.Rule);
            var width = rule.Rule == TradingRule.Proposed ? 2.5f : 1.8f;
            var (cx, cy) = ChartPoints.Line(xs, cumulative);
            var line = top.Add.ScatterLine(cx, cy);
            line.Color = color;
            line.LineWidth = width;
            line.LegendText = RuleNames.Name(rule.Rule);
            var (dx, dy) = ChartPoints.Line(xs, Drawdown(cumulative));
            var fall = bottom.Add.ScatterLine(dx, dy);
            fall.Color = color;
            fall.LineWidth = width;
        }

        top.Axes.DateTimeTicksBottom();
        top.Axes.Bottom.TickLabelStyle.FontSize = 16;
        top.Axes.Bottom.TickLabelStyle.FontName = ChartStyle.FontName;
        ChartStyle.DateAxis(bottom, "Date");
        top.Axes.Margins(0.01, 0.05);
        bottom.Axes.Margins(0.01, 0.08);
        if (xs.Length > 1)
        {
            top.Axes.SetLimitsX(xs[0], xs[^1]);
            bottom.Axes.SetLimitsX(xs[0], xs[^1]);
        }

        top.Legend.FontName = ChartStyle.FontName;
        top.Legend.Alignment = Alignment.UpperLeft;
        top.ShowLegend();
        top.Layout.Fixed(new PixelPadding(LeftPadding, 20, 40, 50));
        bottom.Layout.Fixed(new PixelPadding(LeftPadding, 20, 60, 10));
        return (top, bottom);
    }

    internal static Plot BuildTrades(IReadOnlyList<RulePnl> rules)
    {
        ArgumentNullException.ThrowIfNull(rules);
        var plot = ChartStyle.NewPlot("Net P&L per trade (one trade at a time)", "Net P&L per trade (vol points)", "Number of trades");
        var all = rules.SelectMany(r => r.Trades.Select(t => t.PnlVolPoints)).ToArray();
        if (all.Length > 0)
        {
            var (edges, width) = ReportCharts.Bins(all, 40);
            foreach (var rule in rules)
            {
                var values = rule.Trades.Select(t => t.PnlVolPoints).ToArray();
                if (values.Length == 0)
                {
                    continue;
                }

                var color = ChartStyle.Rule(rule.Rule);
                var (xs, ys) = ReportCharts.StepOutline(edges, Counts(values, edges, width));
                var step = plot.Add.ScatterLine(xs, ys);
                step.Color = color;
                step.LineWidth = rule.Rule == TradingRule.Proposed ? 2.5f : 1.8f;
                step.LegendText = string.Create(CultureInfo.InvariantCulture, $"{RuleNames.Name(rule.Rule)} (n = {values.Length})");
                if (rule.TradeStatisticsNet is { WorstVolPoints: double worst, WorstEntryDate: DateOnly date })
                {
                    // One legend entry per rule keeps the legend inside the image: the worst trade goes into it.
                    step.LegendText = string.Create(CultureInfo.InvariantCulture, $"{RuleNames.Name(rule.Rule)} (n = {values.Length}; worst {worst:0.00}, {date:yyyy-MM-dd})");
                    var mark = plot.Add.VerticalLine(worst);
                    mark.Color = color;
                    mark.LineWidth = 2;
                    mark.LinePattern = LinePattern.Dashed;
                    mark.LegendText = string.Empty;
                }
            }
        }

        var zero = plot.Add.VerticalLine(0);
        zero.Color = ChartStyle.Reference;
        zero.LineWidth = 1;
        plot.Axes.Margins(0.02, 0.08);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    internal static Plot BuildYears(IReadOnlyList<RulePnl> rules)
    {
        ArgumentNullException.ThrowIfNull(rules);
        var plot = ChartStyle.NewPlot("Net P&L by calendar year", "Calendar year", "Net P&L (vol points)");
        var years = rules.SelectMany(r => r.PathNet.ByYear.Select(y => y.Year)).Distinct().Order().ToArray();
        for (var k = 0; k < rules.Count; k++)
        {
            var rule = rules[k];
            var color = ChartStyle.Rule(rule.Rule);
            var bars = new List<Bar>();
            foreach (var year in rule.PathNet.ByYear)
            {
                bars.Add(ChartStyle.YearBar(year.Year, k, rules.Count, year.Pnl, color));
            }

            var plotted = plot.Add.Bars(bars);
            plotted.LegendText = RuleNames.Name(rule.Rule);
        }

        if (years.Length > 0)
        {
            ChartStyle.YearTicks(plot, years);
        }

        ChartStyle.ZeroLine(plot);
        plot.Axes.Margins(0.02, 0.08);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    /// <summary>The number of values in each bin; the top edge is inclusive.</summary>
    internal static double[] Counts(double[] values, double[] edges, double width)
    {
        var bins = edges.Length - 1;
        var counts = new double[bins];
        foreach (var value in values)
        {
            var bin = Math.Clamp((int)Math.Floor((value - edges[0]) / width), 0, bins - 1);
            counts[bin]++;
        }

        return counts;
    }

    /// <summary>Draws the two panels one above the other onto one canvas of the report's size, their data areas aligned, and encodes it once.</summary>
    private static byte[] Stack(Plot top, Plot bottom) => ChartStyle.Png(ChartStyle.Height, canvas =>
    {
        Panel(canvas, top, new PixelRect(0, ChartStyle.Width, TopHeight, 0));
        Panel(canvas, bottom, new PixelRect(0, ChartStyle.Width, ChartStyle.Height, TopHeight));
    });

    /// <summary>Draws a plot into its rectangle only: ScottPlot clears the canvas before it draws, and the clip keeps that clear off the other panel.</summary>
    private static void Panel(SkiaSharp.SKCanvas canvas, Plot plot, PixelRect rect)
    {
        canvas.Save();
        canvas.ClipRect(new SkiaSharp.SKRect(rect.Left, rect.Top, rect.Right, rect.Bottom));
        plot.Render(canvas, rect);
        canvas.Restore();
    }
}
