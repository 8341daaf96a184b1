using System.Globalization;
using ScottPlot;
using VolCast.Core.Backtest;
using VolCast.Reports.Model;

namespace VolCast.Reports.Charts;

/// <summary>
/// The small chart beside the by-year table of the answers section: for each calendar year, each main forecaster's
/// mean QLIKE minus implied's on the common dates of that year, with the years in which the Diebold-Mariano test
/// against implied rejects at 5% starred. It draws the same rows as the table (groups.csv), nothing else.
/// </summary>
internal static class GroupCharts
{
    /// <summary>The by-year chart's file name.</summary>
    public const string YearsFileName = "loss-by-year.png";

    /// <summary>The by-year chart's title.</summary>
    public const string YearsTitle = "QLIKE against implied by calendar year";

    /// <summary>How many forecasters the chart draws: the first ones of the ranking on common dates.</summary>
    public const int MaxForecasters = 3;

    /// <summary>The size of the test whose rejections are starred.</summary>
    public const double Level = 0.05;

    /// <summary>The mark above (or below) a bar whose year's test rejects at <see cref="Level"/>.</summary>
    public const string Star = "*";

    /// <summary>The sentence the report shows instead of the chart when the common dates fall in one calendar year.</summary>
    public const string OneYear = "The common dates fall in one calendar year, so there is no chart by year.";

    /// <summary>
    /// The chart of the year rows, or null when they span fewer than two calendar years (a chart of one year says nothing
    /// the table does not).
    /// </summary>
    /// <param name="rows">The grouped rows (any grouping; only <c>year</c> rows are drawn), forecasters in ranking order within each year.</param>
    /// <param name="colors">The report's colour map.</param>
    /// <returns>The chart as <see cref="YearsFileName"/>, or null.</returns>
    public static ChartImage? Years(IReadOnlyList<GroupComparisonRow> rows, SeriesColors colors)
    {
        var data = YearBars(rows);
        if (data.Years.Length < 2)
        {
            return null;
        }

        using var plot = BuildYears(data, colors);
        return new ChartImage(YearsFileName, YearsTitle,
            string.Create(CultureInfo.InvariantCulture,
                $"Each bar is one forecaster's mean QLIKE minus implied's over the common dates of a calendar year (the first {MaxForecasters} of the ranking on common dates; the numbers are in the table above and in groups.csv). Below zero the forecaster lost less than implied that year. A star marks a year in which the Diebold-Mariano test against implied rejects at 5%; a result carried by one year shows as one long or starred bar."),
            ChartStyle.Png(plot));
    }

    /// <summary>The years (in order), the forecasters drawn and, per forecaster and year, the loss difference and whether the test rejects.</summary>
    internal static YearBarData YearBars(IReadOnlyList<GroupComparisonRow> rows)
    {
        ArgumentNullException.ThrowIfNull(rows);
        var yearRows = rows.Where(r => r.Grouping == "year").ToList();
        var years = yearRows.Select(r => int.Parse(r.Group, CultureInfo.InvariantCulture)).Distinct().Order().ToArray();
        var specs = yearRows.Select(r => r.Spec).Distinct().Take(MaxForecasters).ToArray();
        var values = new double?[specs.Length, years.Length];
        var significant = new bool[specs.Length, years.Length];
        foreach (var row in yearRows)
        {
            var s = Array.IndexOf(specs, row.Spec);
            if (s < 0)
            {
                continue;
            }

            var y = Array.IndexOf(years, int.Parse(row.Group, CultureInfo.InvariantCulture));
            values[s, y] = row.Qlike - row.ImpliedQlike;
            significant[s, y] = row.Dm?.PValue is double p && p < Level;
        }

        return new YearBarData(years, specs, values, significant);
    }

    internal static Plot BuildYears(YearBarData data, SeriesColors colors)
    {
        ArgumentNullException.ThrowIfNull(data);
        ArgumentNullException.ThrowIfNull(colors);
        var plot = ChartStyle.NewPlot(YearsTitle, "Calendar year (* the DM test against implied rejects at 5% that year)", "Mean QLIKE minus implied's (below zero: beat implied)");
        for (var s = 0; s < data.Specs.Length; s++)
        {
            var color = colors.Style(data.Specs[s]).Color;
            var bars = new List<Bar>();
            for (var y = 0; y < data.Years.Length; y++)
            {
                if (data.Values[s, y] is not double value)
                {
                    continue;
                }

                var bar = ChartStyle.YearBar(data.Years[y], s, data.Specs.Length, value, color);
                bar.Label = data.Significant[s, y] ? Star : string.Empty;
                bars.Add(bar);
            }

            var plotted = plot.Add.Bars(bars);
            plotted.LegendText = data.Specs[s];
            plotted.ValueLabelStyle.FontSize = 22;
            plotted.ValueLabelStyle.Bold = true;
            plotted.ValueLabelStyle.FontName = ChartStyle.FontName;
        }

        ChartStyle.YearTicks(plot, data.Years);
        ChartStyle.ZeroLine(plot);
        plot.Axes.Margins(0.02, 0.15);
        ChartStyle.LegendBelow(plot);
        return plot;
    }

    /// <summary>What the by-year chart draws.</summary>
    /// <param name="Years">The calendar years, in order.</param>
    /// <param name="Specs">The forecasters drawn, in ranking order.</param>
    /// <param name="Values">Per forecaster and year, mean QLIKE minus implied's; null where the forecaster has no row that year.</param>
    /// <param name="Significant">Per forecaster and year, whether the year's Diebold-Mariano p-value is below <see cref="Level"/>.</param>
    internal sealed record YearBarData(int[] Years, string[] Specs, double?[,] Values, bool[,] Significant);
}
