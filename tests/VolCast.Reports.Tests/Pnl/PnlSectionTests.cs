using System.Globalization;
using System.Net;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Demo;
using VolCast.Core.Scoring;
using VolCast.Core.Trading;
using VolCast.Core.Trading.Snooping;
using VolCast.IO.Results;
using VolCast.Reports.Charts;
using VolCast.Reports.Html;
using VolCast.Reports.Model;
using VolCast.Reports.Tests.Support;

namespace VolCast.Reports.Tests.Pnl;

/// <summary>
/// The "Would the rule have paid?" section: built from a <see cref="RulePnlReport"/> computed here by calling the Core
/// engine directly on a seeded history (geometric Brownian motion at 20% a year, implied quoted about 3 vol points
/// high, invented forecasts), then checked against the record and against the definitions the record documents.
/// The forecast backtest beside it runs on invented demo data; only the mapping to the page is under test.
/// </summary>
public sealed class PnlSectionTests : IDisposable
{
    private const string HostileSpec = "<script>alert(1)</script>";

    private static readonly DemoScenario Scenario = new DemoScenarioGenerator(5, years: 3).Generate();

    private static readonly BacktestResult Forecasts = Backtester.Run(Scenario.Index, Scenario.Implied, new BacktestSettings
    {
        Forecasters = ["close-to-close:21", "ewma:0.94"],
        Sweep = false,
        McsReplications = 200,
        Baseline = "close-to-close:21",
        Candidate = "ewma:0.94",
    });

    private static readonly BacktestRunInfo Info = new(
        "0.1.0-test",
        [new InputFileInfo("prices", "prices.csv", new string('a', 64))],
        DateTimeOffset.UnixEpoch,
        DateTimeOffset.UnixEpoch,
        "decimal",
        []);

    private static readonly RulePnlReport Report = BuildReport(seed: 17, days: 700);

    private readonly string _folder = Path.Combine(Path.GetTempPath(), "volcast-pnl-section-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        if (Directory.Exists(_folder))
        {
            Directory.Delete(_folder, recursive: true);
        }
    }

    [Fact]
    public void Build_WithRulePnl_SectionComesFirstAfterTheVerdict()
    {
        var model = ReportWriter.Build(With(Report));

        Assert.NotNull(model.Pnl);
        Assert.Null(model.Pnl!.Absence);
        var html = HtmlReport.Render(model);
        var verdict = html.IndexOf("id=\"verdict\"", StringComparison.Ordinal);
        var pnl = html.IndexOf("id=\"pnl\"", StringComparison.Ordinal);
        var metrics = html.IndexOf("id=\"metrics\"", StringComparison.Ordinal);
        Assert.True(verdict < pnl && pnl < metrics, $"verdict {verdict}, pnl {pnl}, metrics {metrics}");
        Assert.Contains("<h2>Would the rule have paid?</h2>", html, StringComparison.Ordinal);
        Assert.Equal(
            ["The rules as delta-hedged straddles", "One at a time: how much the first trade's date matters", "The tests that decide: differences of daily net P&L", "Threshold sweep", "Does the best rule survive the search?",
             "Entry at the signal's close against one trading day later (net of costs)", "Net P&L by calendar year, vol points", "The same bet as a variance swap"],
            model.Pnl.Tables.Select(t => t.Title));
    }

    [Fact]
    public void Build_WithoutRulePnl_SaysWhyAndDrawsNoPnlChart()
    {
        var run = new BacktestRun(Forecasts, BacktestCalibrator.Evaluate(Forecasts, Scenario.Index), Info, Scenario.Index, Scenario.Index.Count)
        {
            RulePnlAbsence = "no implied series was given",
        };

        var model = ReportWriter.Build(run);
        var html = HtmlReport.Render(model);

        Assert.Equal("The rule was not backtested as option trades: no implied series was given.", model.Pnl!.Absence);
        Assert.Empty(model.Pnl.Charts);
        Assert.Contains("id=\"pnl\"", html, StringComparison.Ordinal);
        Assert.Contains("no implied series was given", html, StringComparison.Ordinal);
        Assert.DoesNotContain(PnlCharts.CumulativeFileName, model.Charts.Select(c => c.FileName));
        Assert.DoesNotContain("switching from the current rule", model.Verdict.Headline, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void SweepRules_AreNamedInWords_ThresholdInVolPoints()
    {
        // The compact key stays in the files; the page and summary.txt say the rule in words, the threshold in vol
        // points (0.02 decimal volatility is 2 vol points: common practice, no source).
        var row = new ThresholdSweepRow("yang-zhang:21|sell-only|0.02", TradingRule.Current, "yang-zhang:21", RuleSides.SellOnly, 0.02, 10, 1, 1, null, null);
        Assert.Equal("yang-zhang:21, sell only, threshold 2.0 vol points", VolCast.IO.Results.RulePnlAnswer.Readable(row));
        Assert.Equal("garch, sell and buy, threshold 0.5 vol points", VolCast.IO.Results.RulePnlAnswer.Readable(row with { ForecastSpec = "garch", Sides = RuleSides.Both, Threshold = 0.005 }));
    }

    [Fact]
    public void Verdict_RulePointEndsWithTheSwitchPerYear_NumbersFromTheDailyPaths()
    {
        var model = ReportWriter.Build(With(Report));
        var close = Report.AtClose;
        var proposed = close[TradingRule.Proposed];
        var current = close[TradingRule.Current];

        // The gain per year by its definition (RuleComparison): the mean daily difference of the two net paths times
        // the trading days per year; recomputed here from the paths, not read from the comparison.
        var gain = 0.0;
        for (var t = 0; t < proposed.DailyPnl.Length; t++)
        {
            gain += proposed.DailyPnl[t] - current.DailyPnl[t];
        }

        gain = gain / proposed.DailyPnl.Length * close.Settings.AnnualizationDays;
        Assert.Equal(gain, close.ProposedVersusCurrent.DifferencePerYear, 9);

        // The worst drawdown by its definition (PathStatistics): the largest fall of the running sum from its peak,
        // the start counting as a peak of 0.
        double sum = 0, peak = 0, fall = 0;
        foreach (var x in proposed.DailyPnl)
        {
            sum += x;
            peak = Math.Max(peak, sum);
            fall = Math.Max(fall, peak - sum);
        }

        var c = CultureInfo.InvariantCulture;
        // The rule's P&L answer closes the verdict's rule point.
        var headline = model.Verdict.Points.Single(p => p.Contains("switching from", StringComparison.Ordinal));
        var test = close.ProposedVersusCurrent.Test;
        Assert.Contains("switching from the current rule to the proposed one would have earned " + Math.Abs(gain).ToString("0.00", c) + " vol points per year " + (gain >= 0 ? "more" : "less"), headline, StringComparison.Ordinal);
        Assert.Contains($"t = {test.TStatistic!.Value.ToString("0.00", c)}, {PValueText.Clause(test.PValue!.Value)}", headline, StringComparison.Ordinal);
        Assert.Contains($"the proposed rule's worst drawdown was {fall.ToString("0.00", c)} vol points (the current rule's {current.PathNet.MaxDrawdown.ToString("0.00", c)})", headline, StringComparison.Ordinal);
        Assert.Contains($"SPA {PValueText.Clause(Report.Means.Spa.Consistent)}", headline, StringComparison.Ordinal);
        // A best rule behind always-sell has no edge to survive the search: the clause must say so (Hansen 2005's null is
        // that no rule searched beats the benchmark).
        var bestPerYear = Report.Means.Estimates[Report.Means.BestRule] * close.Settings.AnnualizationDays;
        Assert.Contains(
            bestPerYear <= 0 ? "no rule searched beat always-sell" : Report.Means.Spa.Consistent < 0.05 ? " survives the data-snooping test" : " does not survive the data-snooping test",
            headline,
            StringComparison.Ordinal);
        Assert.Contains($"the walk-forward threshold earned {close[TradingRule.WalkForwardThreshold].PathNet.PnlPerYear.ToString("0.00", c)} vol points per year", headline, StringComparison.Ordinal);
        Assert.Contains("half-spread", headline, StringComparison.Ordinal);
        Assert.DoesNotContain("per trade", headline, StringComparison.Ordinal);

        // The answer about implied leads; the P&L closes the rule's point, the last one.
        Assert.Contains("implied", model.Verdict.Headline, StringComparison.OrdinalIgnoreCase);
        Assert.StartsWith("Rule test", model.Verdict.Points[^1], StringComparison.Ordinal);
        Assert.Contains("In option trades: switching from", model.Verdict.Points[^1], StringComparison.Ordinal);
    }

    [Fact]
    public void PnlPerYear_BothFigures_AreLabelledByTheirPositionAndTheirDifferenceIsSaidWhereBothShow()
    {
        // The daily path (a ladder: a trade on every signal sized 1/h) and the trades one at a time are different
        // positions, so their P&L per year differ; a reader who sees both must be told which is which, and why.
        var section = ReportWriter.Build(With(Report)).Pnl!;
        var rules = section.Tables[0];
        var offsets = section.Tables[1];

        Assert.Contains(rules.Rows, r => r[0] == "P&L per year, vol points (daily path, every signal)");
        Assert.DoesNotContain(rules.Rows, r => r[0] == "P&L per year, vol points");
        Assert.Contains(offsets.Rows, r => r[0] == "P&L per year, vol points (sum of trades one at a time)");
        var h = Report.AtClose.HorizonDays.ToString(CultureInfo.InvariantCulture);
        Assert.Contains("The two P&L per year differ because they hold different positions: the daily path is a ladder of a trade on every signal, each sized 1/" + h, offsets.Note, StringComparison.Ordinal);
        Assert.Contains("one at a time holds one full-size trade from each entry to its expiry", offsets.Note, StringComparison.Ordinal);
    }

    [Theory]
    // The edge is linear in the half-spread s: edge(s) = edge(0.25) + change·(s − 0.25), zero at the break-even.
    // Proposed trading less than always-sell: the edge grows with the spread, so it is positive only above the break-even.
    [InlineData(-11.95, 5.0, "the proposed rule beats always-sell only at a half-spread wider than 2.64 vol points (0.25 assumed)")]
    // The mirror: an edge that shrinks with the spread lasts only below it.
    [InlineData(3.0, -2.0, "the proposed rule beats always-sell only at a half-spread narrower than 1.75 vol points (0.25 assumed)")]
    public void BreakEvenWords_SayOnWhichSideOfTheBreakEvenTheRuleBeatsAlwaysSell(double edge, double change, string expected)
    {
        var breakEven = new BreakEvenSpread(edge, change, 0.25 - (edge / change), null);

        Assert.Equal(expected, VolCast.IO.Results.RulePnlAnswer.BreakEvenWords(breakEven, 0.25));
    }

    [Fact]
    public void RulesTable_Cells_MatchTheTradesByTheirDefinitions()
    {
        var section = ReportWriter.Build(With(Report)).Pnl!;
        var table = section.Tables[0];
        var close = Report.AtClose;
        var c = CultureInfo.InvariantCulture;
        string Cell(string label, TradingRule rule, bool net) =>
            table.Rows.Single(r => r[0] == label)[1 + (2 * close.Rules.IndexOf(close[rule])) + (net ? 0 : 1)];

        Assert.Equal(11, table.Headers.Count);
        Assert.Equal("proposed, net", table.Headers[3]);
        Assert.Equal("proposed, zero cost", table.Headers[4]);
        foreach (var rule in close.Rules)
        {
            var pnl = rule.Trades.Select(t => t.PnlVolPoints).ToArray();
            var gross = rule.Trades.Select(t => t.GrossPnlVolPoints).ToArray();
            Assert.Equal(pnl.Length.ToString(c), Cell("Trades (one at a time)", rule.Rule, true));

            // Mean, hit rate (share above zero) and worst trade, from the trades themselves.
            Assert.Equal(pnl.Average().ToString("0.00", c), Cell("Mean P&L per trade, vol points", rule.Rule, true));
            Assert.Equal(gross.Average().ToString("0.00", c), Cell("Mean P&L per trade, vol points", rule.Rule, false));
            Assert.Equal((pnl.Count(x => x > 0) / (double)pnl.Length).ToString("0.0%", c), Cell("Hit rate (trades above zero)", rule.Rule, true));
            Assert.Equal(pnl.Min().ToString("0.00", c), Cell("Worst trade, vol points", rule.Rule, true));

            // P&L per year of the daily path: its sum over its length in years of trading days.
            var perYear = rule.DailyPnl.Sum() / (rule.DailyPnl.Length / close.Settings.AnnualizationDays);
            Assert.Equal(perYear.ToString("0.00", c), Cell("P&L per year, vol points (daily path, every signal)", rule.Rule, true));
            var perYearGross = rule.DailyPnlZeroCost.Sum() / (rule.DailyPnlZeroCost.Length / close.Settings.AnnualizationDays);
            Assert.Equal(perYearGross.ToString("0.00", c), Cell("P&L per year, vol points (daily path, every signal)", rule.Rule, false));
        }

        // Costs only take away: with a half-spread and hedge costs every trade nets less than gross.
        Assert.All(close.Rules.SelectMany(r => r.Trades), t => Assert.True(t.PnlVolPoints < t.GrossPnlVolPoints));

        // The sweep lists every row searched, and the snooping table names the best by its label.
        Assert.Equal(close.Sweep.Length, section.Tables[3].Rows.Count);
        Assert.Equal(VolCast.IO.Results.RulePnlAnswer.Readable(close.Sweep[Report.Means.BestRule]), section.Tables[4].Rows[0][1]);
        Assert.Equal(PValueText.Value(Report.Means.RealityCheckPValue), section.Tables[4].Rows[0][3]);
        Assert.Equal(PValueText.Value(Report.Sharpe.Spa.Consistent), section.Tables[4].Rows[1][4]);
        var tradedRows = close.Sweep.Where(r => r.Trades > 0).ToArray();
        Assert.Equal(VolCast.IO.Results.RulePnlAnswer.Readable(tradedRows[Report.Sharpe.BestRule]), section.Tables[4].Rows[1][1]);

        // The start-offset table gives each figure's lowest and highest value over the h first entries, and the
        // first entry's own figure (the table above) lies inside it.
        var ranges = section.Tables[1];
        Assert.Equal(close.Rules.Length * 2, ranges.Headers.Count - 1);
        for (var k = 0; k < close.Rules.Length; k++)
        {
            var rule = close.Rules[k];
            var range = rule.OneAtATimeRangeNet;
            var trades = ranges.Rows.Single(r => r[0] == "Trades")[1 + (2 * k)];
            Assert.Equal(string.Create(c, $"{range.Trades.Low:0} to {range.Trades.High:0}"), trades);
            Assert.InRange(rule.TradeStatisticsNet.Count, range.Trades.Low, range.Trades.High);
            if (rule.TradeStatisticsNet.MeanVolPoints is double mean)
            {
                Assert.InRange(mean, range.MeanVolPoints!.Low, range.MeanVolPoints.High);
                Assert.Equal(string.Create(c, $"{range.MeanVolPoints.Low:0.00} to {range.MeanVolPoints.High:0.00}"), ranges.Rows.Single(r => r[0] == "Mean P&L per trade, vol points")[1 + (2 * k)]);
            }
        }

        // P&L by year adds up to the path's total.
        var proposed = close[TradingRule.Proposed];
        Assert.Equal(proposed.DailyPnl.Sum(), proposed.PathNet.ByYear.Sum(y => y.Pnl), 9);
    }

    [Fact]
    public void Write_DrawsEveryPnlChart_NonEmptyAtTheReportSize()
    {
        var written = ReportWriter.Write(_folder, With(Report));

        foreach (var name in new[] { PnlCharts.CumulativeFileName, PnlCharts.MarksFileName, PnlCharts.TradesFileName, PnlCharts.YearsFileName })
        {
            Assert.Contains(name, written);
            Assert.Contains(name, ReportWriter.FileNames);
            var bytes = File.ReadAllBytes(Path.Combine(_folder, name));
            Assert.True(Png.HasSignature(bytes), name);
            Assert.Equal((1200, 600), Png.Size(bytes));
        }
    }

    [Fact]
    public void CumulativeChart_Drawdown_AgreesWithTheCoreMaximumDrawdown()
    {
        var close = Report.AtClose;
        foreach (var rule in close.Rules)
        {
            var drawdown = PnlCharts.Drawdown(PnlCharts.CumulativeSum(rule.DailyPnl));
            Assert.Equal(rule.PathNet.MaxDrawdown, -drawdown.Min(), 9);
        }

        // A worked example: daily 1, −2, 3, −5 sums to 1, −1, 2, −3; the peaks are 1, 1, 2, 2.
        Assert.Equal([0.0, -2.0, 0.0, -5.0], PnlCharts.Drawdown(PnlCharts.CumulativeSum([1.0, -2.0, 3.0, -5.0])));
    }

    [Fact]
    public void Charts_EachRuleKeepsOneColourInAllThree()
    {
        var close = Report.AtClose;
        var (top, bottom) = PnlCharts.BuildCumulative(close.Dates, close.Rules);
        using var trades = PnlCharts.BuildTrades(close.Rules);
        using var years = PnlCharts.BuildYears(close.Rules);
        using (top)
        using (bottom)
        {
            var colours = close.Rules.Select(r => ChartStyle.Rule(r.Rule)).ToArray();
            Assert.Equal(colours.Length, colours.Distinct().Count());
            foreach (var rule in close.Rules)
            {
                var name = RuleNames.Name(rule.Rule);
                var colour = ChartStyle.Rule(rule.Rule);
                Assert.Equal(colour, top.GetPlottables().OfType<ScottPlot.Plottables.Scatter>().Single(p => p.LegendText == name).Color);
                Assert.Equal(colour, trades.GetPlottables().OfType<ScottPlot.Plottables.Scatter>().Single(p => p.LegendText.StartsWith(name + " (n = ", StringComparison.Ordinal)).Color);
                Assert.Equal(colour, years.GetPlottables().OfType<ScottPlot.Plottables.BarPlot>().Single(p => p.LegendText == name).Bars[0].FillColor);
            }
        }
    }

    [Fact]
    public void MarksChart_PlotsEachPathsRunningSumInTheRulesColour_ThinQuotedLineOverAPaleEntryBand()
    {
        // The plot data, against the record: always-sell and the proposed rule, each on both marks; the last point of a
        // line is the path's total, summed here independently; the thin line is the quoted-implied mark the drawdown
        // uses, drawn over the entry-implied (gamma-against-theta) mark as a wide pale band of the same hue.
        var close = Report.AtClose;
        using var plot = PnlCharts.BuildMarks(close.Dates, close.Rules);
        var lines = plot.GetPlottables().OfType<ScottPlot.Plottables.Scatter>().ToArray();
        Assert.Equal(4, lines.Length);
        foreach (var rule in close.Rules.Where(r => r.Rule is TradingRule.AlwaysSell or TradingRule.Proposed))
        {
            var name = RuleNames.Name(rule.Rule);
            var quoted = lines.Single(l => l.LegendText == name + ", marked at quoted implied (line)");
            var entry = lines.Single(l => l.LegendText == name + ", marked at entry implied (pale band)");
            Assert.Equal(ChartStyle.Rule(rule.Rule), quoted.Color);
            Assert.Equal(ChartStyle.Rule(rule.Rule).WithAlpha(0.3), entry.Color);
            Assert.True(entry.LineWidth > 3 * quoted.LineWidth);
            Assert.True(Array.IndexOf(lines, entry) < Array.IndexOf(lines, quoted), "the band is drawn first, under the line");
            var quotedPoints = quoted.Data.GetScatterPoints();
            var entryPoints = entry.Data.GetScatterPoints();
            Assert.Equal(close.Dates.Length, quotedPoints.Count);
            Assert.Equal(rule.DailyPnl.Sum(), quotedPoints[^1].Y, 9);
            Assert.Equal(rule.DailyPnlEntryVol.Sum(), entryPoints[^1].Y, 9);
            Assert.Equal(rule.DailyPnl.Take(10).Sum(), quotedPoints[9].Y, 9);
        }

        // The caption names the file and column that hold the entry-implied paths of every rule.
        var image = PnlCharts.Marks(close.Dates, close.Rules);
        Assert.Contains("rule-pnl.csv (column pnl_entry_vol)", image.Description, StringComparison.Ordinal);
        Assert.Contains("pnl_entry_vol", VolCast.IO.Tables.RulePnlTables.Paths.Names);
    }

    [Fact]
    public void Render_HostileForecasterName_IsEscaped()
    {
        var report = BuildReport(seed: 5, days: 400, proposedSpec: HostileSpec);

        var html = HtmlReport.Render(ReportWriter.Build(With(report)));

        Assert.DoesNotContain(HostileSpec, html, StringComparison.Ordinal);
        Assert.Contains(WebUtility.HtmlEncode(HostileSpec), html, StringComparison.Ordinal);
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void Render_CautionsStandBesideTheSection()
    {
        var html = HtmlReport.Render(ReportWriter.Build(With(Report)));
        var section = html[html.IndexOf("id=\"pnl\"", StringComparison.Ordinal)..html.IndexOf("id=\"metrics\"", StringComparison.Ordinal)];

        // The four cautions the trade calls for: unbounded loss of short options, what the simulation leaves out, past
        // P&L, and the rules of the firm and jurisdiction.
        Assert.Contains("can lose far more than the premium received", section, StringComparison.Ordinal);
        Assert.Contains("ignores the smile", section, StringComparison.Ordinal);
        Assert.Contains("early assignment, margin and liquidity", section, StringComparison.Ordinal);
        Assert.Contains("Past P&amp;L does not predict future P&amp;L", section, StringComparison.Ordinal);
        Assert.Contains("rules of your firm and of your jurisdiction", section, StringComparison.Ordinal);
        foreach (var caution in ReportText.PnlCautions)
        {
            Assert.Contains(HtmlReport.E(caution), section, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Settings_StateTheConventions()
    {
        var settings = ReportWriter.Build(With(Report)).Pnl!.Settings.ToDictionary(s => s.Name, s => s.Value);

        Assert.Contains("at-the-money straddle", settings["Instrument"], StringComparison.Ordinal);
        Assert.Contains("one vol point", settings["Size"], StringComparison.Ordinal);
        Assert.Contains("10 trading days after entry", settings["Expiry"], StringComparison.Ordinal);
        Assert.Contains("entry implied volatility", settings["Hedge"], StringComparison.Ordinal);
        Assert.Contains("half-spread 0.25 vol points", settings["Costs"], StringComparison.Ordinal);
        Assert.Contains("1 basis point of", settings["Costs"], StringComparison.Ordinal);
        Assert.Contains("one at a time", settings["Entries"], StringComparison.Ordinal);
        Assert.Contains("r = 0, q = 0", settings["Rate and dividend"], StringComparison.Ordinal);
        Assert.Contains("spot −10% and implied +10 vol points", settings["Stress shock"], StringComparison.Ordinal);
    }

    /// <summary>A run of the invented demo backtest carrying <paramref name="report"/>.</summary>
    internal static BacktestRun RunWith(RulePnlReport report) => With(report);

    private static BacktestRun With(RulePnlReport report) =>
        new(Forecasts, BacktestCalibrator.Evaluate(Forecasts, Scenario.Index), Info, Scenario.Index, Scenario.Index.Count)
        {
            RulePnl = report,
        };

    /// <summary>Runs the trading backtest at the close and one day later, and both data-snooping tests, as a run would.</summary>
    internal static RulePnlReport BuildReport(int seed, int days, string proposedSpec = "candidate")
    {
        // 20% a year: 0.20 / √252 a day.
        var prices = Some.GbmBars(seed, days, dailyVolatility: 0.20 / Math.Sqrt(252), stepsPerDay: 4);
        var random = new Random(seed + 1);
        var implied = new double?[days];
        var proposed = new double?[days];
        var current = new double?[days];
        var historical = new double?[days];
        for (var i = 0; i < days; i++)
        {
            implied[i] = 0.23 + (0.02 * (random.NextDouble() - 0.5));
            proposed[i] = 0.20 + (0.03 * (random.NextDouble() - 0.5));
            current[i] = 0.21 + (0.03 * (random.NextDouble() - 0.5));
            historical[i] = 0.21;
        }

        var horizon = BacktestHorizon.Days(10);
        RuleForecast p = new(proposedSpec, proposed), c = new("baseline", current), h = new("close-to-close:21", historical);
        var close = RuleBacktest.Run(prices, implied, horizon, p, c, h, new TradingSettings());
        var next = RuleBacktest.Run(prices, implied, horizon, p, c, h, new TradingSettings { EntryTiming = EntryTiming.NextClose });
        var options = new DataSnoopingOptions(close.HorizonDays, seed, replications: 200);
        var draws = DataSnooping.Draw(close.Dates.Length, options);
        var always = close[TradingRule.AlwaysSell].DailyPnl.ToArray();

        // A sweep row that never traded has a flat path and no Sharpe ratio: the Sharpe test leaves it out.
        var paths = close.SnoopingDifferences.Where((_, k) => close.Sweep[k].Trades > 0).Select(d => d.Select((x, t) => x + always[t]).ToArray()).ToArray();
        return new RulePnlReport(
            close,
            next,
            DataSnooping.TestMeans(close.SnoopingDifferences, draws, options.Level),
            DataSnooping.TestSharpeRatios(paths, always, draws, options.Level));
    }
}
