using ScottPlot;
using ScottPlot.Plottables;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Demo;
using VolCast.Core.Scoring;
using VolCast.IO.Results;
using VolCast.Reports.Charts;
using VolCast.Reports.Html;
using VolCast.Reports.Tests.Support;

namespace VolCast.Reports.Tests.Charts;

/// <summary>
/// The by-year chart beside the by-year table: what it draws (the table's rows, nothing else), the stars of the
/// significant years, and that it is left out, with a sentence, when the common dates fall in one year. Invented
/// rows and a small backtest on invented demo data, not reference data.
/// </summary>
public sealed class GroupChartsTests
{
    private static readonly DemoScenario Scenario = new DemoScenarioGenerator(5, years: 3).Generate();

    private static readonly BacktestSettings Settings = new()
    {
        Forecasters = ["close-to-close:21", "ewma:0.94", "garch", "yang-zhang:63"],
        McsReplications = 100,
    };

    private static readonly BacktestResult Result = Backtester.Run(Scenario.Index, Scenario.Implied, Settings);

    private static readonly BacktestRunInfo Info = new(
        "0.1.0-test",
        [new InputFileInfo("prices", "prices.csv", new string('a', 64)), new InputFileInfo("implied", "implied.csv", new string('b', 64))],
        new DateTimeOffset(2025, 1, 2, 3, 4, 5, TimeSpan.Zero),
        new DateTimeOffset(2025, 1, 2, 3, 4, 7, TimeSpan.Zero),
        "decimal",
        []);

    private static BacktestRun Run(GroupedResults groups) =>
        new(Result, BacktestCalibrator.Evaluate(Result, Scenario.Index), Info, Scenario.Index, Scenario.Index.Count) { Groups = groups };

    private static DieboldMarianoResult Dm(double p) =>
        new(250, 21, 20, -0.1, 1.0, LongRunVarianceWindow.Bartlett, LongRunVarianceWindow.Bartlett, 0.95, -2.0, -1.9, p);

    private static GroupComparisonRow Row(string year, string spec, double qlike, double implied, double? p) =>
        new("year", year, spec, 250, qlike, implied, p is double value ? Dm(value) : null);

    [Fact]
    public void YearBars_AreEachForecastersQlikeMinusImpliedsWithTheSignificantYearsMarked()
    {
        // Invented rows; the bar is the row's QLIKE minus implied's QLIKE, as the table prints them, and a year is starred
        // when the row's DM p-value is below 5% (the usual 5% level of a two-sided test, common practice, no source).
        GroupComparisonRow[] rows =
        [
            Row("2020", "garch", -1.50, -1.40, 0.01),
            Row("2020", "ewma:0.94", -1.30, -1.40, 0.20),
            Row("2021", "garch", -1.60, -1.55, null),
            Row("2021", "ewma:0.94", -1.70, -1.55, 0.049),
            new("regime", "calm", "garch", 100, -2.0, -1.0, Dm(0.001)),
        ];

        var data = GroupCharts.YearBars(rows);

        Assert.Equal([2020, 2021], data.Years);
        Assert.Equal(["garch", "ewma:0.94"], data.Specs);
        Assert.Equal(-0.10, data.Values[0, 0]!.Value, 12);
        Assert.Equal(0.10, data.Values[1, 0]!.Value, 12);
        Assert.Equal(-0.05, data.Values[0, 1]!.Value, 12);
        Assert.Equal(-0.15, data.Values[1, 1]!.Value, 12);
        Assert.True(data.Significant[0, 0]);
        Assert.False(data.Significant[1, 0]);
        Assert.False(data.Significant[0, 1]);
        Assert.True(data.Significant[1, 1]);
    }

    [Fact]
    public void BuildYears_DrawsOneBarPerForecasterAndYearAndStarsOnlyTheSignificantOnes()
    {
        GroupComparisonRow[] rows =
        [
            Row("2019", "garch", -1.50, -1.40, 0.01),
            Row("2019", "ewma:0.94", -1.30, -1.40, 0.20),
            Row("2020", "garch", -1.60, -1.55, 0.30),
            Row("2020", "ewma:0.94", -1.70, -1.55, 0.02),
        ];
        var data = GroupCharts.YearBars(rows);

        using var plot = GroupCharts.BuildYears(data, new SeriesColors(data.Specs));

        var barPlots = plot.GetPlottables().OfType<BarPlot>().ToList();
        Assert.Equal(["garch", "ewma:0.94"], barPlots.Select(b => b.LegendText));
        var bars = barPlots.SelectMany(b => b.Bars).ToList();
        Assert.Equal(4, bars.Count);
        Assert.Equal(2, bars.Count(b => b.Label == GroupCharts.Star));
        Assert.All(barPlots[0].Bars, b => Assert.InRange(b.Position, 2018.5, 2020.5));
    }

    [Fact]
    public void YearBars_DrawOnlyTheFirstThreeForecastersOfTheRanking()
    {
        GroupComparisonRow[] rows =
        [
            Row("2020", "a", -1, -1, null), Row("2020", "b", -1, -1, null), Row("2020", "c", -1, -1, null), Row("2020", "d", -1, -1, null),
            Row("2021", "a", -1, -1, null), Row("2021", "b", -1, -1, null), Row("2021", "c", -1, -1, null), Row("2021", "d", -1, -1, null),
        ];

        Assert.Equal(["a", "b", "c"], GroupCharts.YearBars(rows).Specs);
    }

    [Fact]
    public void Report_SeveralYears_DrawsTheYearChartUnderTheByYearTable()
    {
        var groups = GroupedScores.Compute(Result, Scenario.Index);
        Assert.True(groups.Rows.Where(r => r.Grouping == "year").Select(r => r.Group).Distinct().Count() >= 2);

        var model = ReportWriter.Build(Run(groups));

        var chart = Assert.IsType<Model.ChartImage>(model.YearChart);
        Assert.Equal(GroupCharts.YearsFileName, chart.FileName);
        Assert.True(Png.HasSignature(chart.Png.Span));
        Assert.Equal((1200, 600), Png.Size(chart.Png.Span));
        Assert.Contains(GroupCharts.YearsFileName, ReportWriter.FileNames);
        var html = HtmlReport.Render(model);
        var table = html.IndexOf("<h3>By calendar year</h3>", StringComparison.Ordinal);
        var figure = html.IndexOf("<strong>" + GroupCharts.YearsTitle + "</strong>", StringComparison.Ordinal);
        var next = html.IndexOf("<h3>", table + 1, StringComparison.Ordinal);
        Assert.True(table > 0 && figure > table && (next < 0 || figure < next), "the chart sits right under the by-year table");
        Assert.DoesNotContain(GroupCharts.OneYear, html, StringComparison.Ordinal);
    }

    [Fact]
    public void Report_OneYear_LeavesTheChartOutAndSaysWhy()
    {
        var groups = GroupedScores.Compute(Result, Scenario.Index);
        var firstYear = groups.Rows.First(r => r.Grouping == "year").Group;
        var oneYear = groups with { Rows = [.. groups.Rows.Where(r => r.Grouping != "year" || r.Group == firstYear)] };

        var model = ReportWriter.Build(Run(oneYear));

        Assert.Null(model.YearChart);
        var table = model.Answers.Single(t => t.Title == ReportAnswers.YearTitle);
        Assert.Contains(GroupCharts.OneYear, table.Note, StringComparison.Ordinal);
    }

    [Fact]
    public void ReportFiles_WriteTheYearChartBesideTheReport()
    {
        using var temp = new VolCast.TestSupport.TempFolder();
        var model = ReportWriter.Build(Run(GroupedScores.Compute(Result, Scenario.Index)));

        var written = ReportFiles.Write(model, temp.Path, overwrite: false).Select(Path.GetFileName).ToList();

        Assert.Contains(GroupCharts.YearsFileName, written);
    }
}
