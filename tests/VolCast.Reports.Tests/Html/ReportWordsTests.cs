using System.Text.RegularExpressions;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Demo;
using VolCast.IO.Results;
using VolCast.Reports.Html;

namespace VolCast.Reports.Tests.Html;

/// <summary>
/// The words of the report as a reader sees them, checked on the HTML produced: one meaning per symbol, the verdict's
/// order, the horizon stated once, p-values written one way, our own labels. Invented demo data (3 years, 30-day tenor).
/// </summary>
public sealed partial class ReportWordsTests
{
    private static readonly DemoScenario Scenario = new DemoScenarioGenerator(7, years: 3).Generate();

    private static readonly BacktestSettings Settings = new()
    {
        Forecasters = ["close-to-close:21", "ewma:0.94", "garch"],
        SweepEstimators = [Core.Estimators.Estimator.YangZhang],
        SweepLookbacks = [10, 21, 63],
        EwmaLambdas = [0.94, 0.97],
        SelectionWindowDays = 126,
        McsReplications = 200,
        Baseline = "close-to-close:21",
        Candidate = "garch",
        Horizon = BacktestHorizon.Tenor(30),
    };

    private static readonly BacktestResult Result = Backtester.Run(Scenario.Index, Scenario.Implied, Settings);

    private static readonly BacktestRunInfo Info = new(
        "0.1.0-test",
        [new InputFileInfo("prices", "index.csv", new string('a', 64)), new InputFileInfo("implied", "implied.csv", new string('b', 64))],
        new DateTimeOffset(2025, 1, 2, 3, 4, 5, TimeSpan.Zero),
        new DateTimeOffset(2025, 1, 2, 3, 4, 7, TimeSpan.Zero),
        "decimal",
        ["implied.csv: a real warning"]);

    private static readonly Model.ReportModel Model = ReportWriter.Build(new BacktestRun(Result, BacktestCalibrator.Evaluate(Result, Scenario.Index), Info, Scenario.Index, Scenario.Index.Count)
    {
        Groups = GroupedScores.Compute(Result, Scenario.Index),
    });

    private static readonly string Html = HtmlReport.Render(Model);

    [Fact]
    public void Verdict_HoldsFivePointsInTheIssuedOrder_WithoutAdaptiveChoices()
    {
        // Headline: the answer about implied; then head to head, confidence set, premium, rule.
        Assert.Contains("implied", Model.Verdict.Headline, StringComparison.OrdinalIgnoreCase);
        Assert.Equal(4, Model.Verdict.Points.Count);
        Assert.StartsWith("Head to head on ", Model.Verdict.Points[0], StringComparison.Ordinal);
        Assert.Contains("model confidence set", Model.Verdict.Points[1], StringComparison.Ordinal);
        Assert.StartsWith("Implied was above the realized volatility", Model.Verdict.Points[2], StringComparison.Ordinal);
        Assert.StartsWith("Rule test", Model.Verdict.Points[3], StringComparison.Ordinal);
        Assert.DoesNotContain(Model.Verdict.Points, p => p.StartsWith("Adaptive", StringComparison.Ordinal));
        Assert.Contains(Model.Tables, t => t.Title.StartsWith("Lookback", StringComparison.Ordinal) && t.Columns.Any(c => c.Header == "Chosen at the end"));
    }

    [Fact]
    public void Verdict_HeadToHead_NamesTheWinnerOnEachLoss()
    {
        var h = Result.CandidateVersusBaseline;
        var qlikeWinner = h.FirstLosses!.Qlike <= h.SecondLosses!.Qlike ? "the candidate garch" : "the baseline close-to-close:21";
        var mseWinner = h.FirstLosses.MseVariance <= h.SecondLosses.MseVariance ? "the candidate garch" : "the baseline close-to-close:21";

        Assert.Contains("on QLIKE " + qlikeWinner, Model.Verdict.Points[0], StringComparison.Ordinal);
        Assert.Contains("on MSE of variance " + mseWinner, Model.Verdict.Points[0], StringComparison.Ordinal);
    }

    [Theory]
    // The issue's own example: QLIKE 0.1659 against 0.1964 is 16% lower, a gap worth "much" (common practice, no source).
    [InlineData(0.1659, 0.1964, "much lower (16% below)")]
    [InlineData(0.190, 0.200, "lower (5% below)")]
    [InlineData(0.199, 0.200, "slightly lower (1% below)")]
    public void GapWords_GrowWithTheGap(double lower, double higher, string expected) =>
        Assert.Equal(expected, ReportVerdict.Lower(lower, higher));

    [Fact]
    public void GapWords_NeverSayMuchWhenTheTestFindsNoDifference()
    {
        // The same 16% gap with a DM p-value above 5%: the words must not claim more than the test (common practice, no source).
        Assert.Equal("lower (16% below)", ReportVerdict.Lower(0.1659, 0.1964, significant: false));
        Assert.Equal("slightly lower (1% below)", ReportVerdict.Lower(0.199, 0.200, significant: false));
    }

    [Fact]
    public void Stars_OnlyOnTheComparisonsWithImpliedOrTheBaseline()
    {
        // In the loss table, the only starred column is DM vs implied; Mincer-Zarnowitz and encompassing show p-values.
        var losses = Model.Tables.Single(t => t.Title.StartsWith("Forecast losses", StringComparison.Ordinal));
        var starred = losses.Columns.Select((c, i) => (c.Header, Starred: losses.Rows.Any(r => r.Cells[i].Significance != Reports.Model.Significance.None)))
            .Where(c => c.Starred).Select(c => c.Header).ToList();
        Assert.All(starred, h => Assert.Equal("DM vs implied (own dates)", h));
        Assert.Contains(losses.Columns, c => c.Header == "MZ Wald p");
        Assert.Contains(losses.Columns, c => c.Header == "Encompassing p");
        Assert.Contains("Stars mark only better or worse than implied or than the baseline", Html, StringComparison.Ordinal);
    }

    [Fact]
    public void RuleTable_TestsSignalledDatesAgainstAllDates()
    {
        var rule = Model.Tables.Single(t => t.Title.StartsWith("Rule test", StringComparison.Ordinal));

        Assert.Contains(rule.Columns, c => c.Unit == "signalled against all dates");
        Assert.All(rule.Rows, r => Assert.All(r.Cells, c => Assert.Equal(Reports.Model.Significance.None, c.Significance)));
        Assert.DoesNotContain("differs from zero", Html, StringComparison.Ordinal);
    }

    [Fact]
    public void RuleTable_ShowsBuySignalsOnlyWhenTheRuleBuys()
    {
        // The traded rules sell only by default (ruleSides sell-only), so buy rows would judge a side nobody trades.
        var sellOnly = ReportTables.Build(Result).Single(t => t.Title.StartsWith("Rule test", StringComparison.Ordinal));
        Assert.DoesNotContain(sellOnly.Rows, r => r.Label.Contains("buy signals", StringComparison.Ordinal));
        Assert.Contains(sellOnly.Rows, r => r.Label.Contains("sell signals", StringComparison.Ordinal));
        Assert.Contains("buy signals are not shown", sellOnly.Note, StringComparison.Ordinal);

        var both = Backtester.Run(Scenario.Index, Scenario.Implied, Settings with { Trading = new Core.Trading.TradingSettings { Sides = Core.Trading.RuleSides.Both } });
        var bothTable = ReportTables.Build(both).Single(t => t.Title.StartsWith("Rule test", StringComparison.Ordinal));
        Assert.Contains(bothTable.Rows, r => r.Label.Contains("buy signals", StringComparison.Ordinal));
        Assert.EndsWith("(buy for the mirror)", bothTable.Title, StringComparison.Ordinal);
    }

    [Fact]
    public void PValues_BelowOneInAThousand_AreWrittenLessThanOnlyOneWay()
    {
        Assert.DoesNotContain("= &lt; 0.0", Html, StringComparison.Ordinal);
        Assert.DoesNotContain("&lt; 0.0001", Html, StringComparison.Ordinal);
        Assert.Equal("< 0.001", Core.Scoring.PValueText.Value(0.0004));
        Assert.Equal("p < 0.001", Core.Scoring.PValueText.Clause(0.0004));
        Assert.Equal("p = 0.150", Core.Scoring.PValueText.Clause(0.15));

        // Every p-value column of every table is written by the one helper, so none reads 0.000.
        Assert.Equal("&lt; 0.001", HtmlReport.Cell(new Reports.Model.MetricCell(0.0004, Reports.Model.MetricCell.PValue)));
        foreach (var table in Model.Tables)
        {
            for (var i = 0; i < table.Columns.Count; i++)
            {
                if (table.Columns[i].Header.EndsWith(" p", StringComparison.Ordinal) || table.Columns[i].Header == "p")
                {
                    Assert.All(table.Rows, r => Assert.Equal(Reports.Model.MetricCell.PValue, r.Cells[i].Format));
                }
            }
        }
    }

    [Fact]
    public void Horizon_IsStatedOnceWithBothCounts()
    {
        var (shortest, longest) = ReportWriter.WindowRange(Result);
        var statement = shortest == longest
            ? $"30-calendar-day tenor = {longest} trading days, 21 nominal"
            : $"30-calendar-day tenor = {shortest}–{longest} trading days, 21 nominal";

        // round(30 · 252 / 365) = 21 nominal trading days (docs/conventions.md); the calendar gives 20 to 22.
        Assert.Contains(statement, Model.Run.Settings.Single(s => s.Name == "Horizon").Value, StringComparison.Ordinal);
        Assert.Contains("lag " + Result.HacLag + " (the nominal", Html, StringComparison.Ordinal);
    }

    [Fact]
    public void DataQuality_CountsRoutineNotesApartFromWarnings()
    {
        Assert.Equal(["implied.csv: a real warning"], Model.DataQuality.Warnings);
        Assert.Contains(Model.DataQuality.RoutineNotes, n => n.Contains("no realized target yet", StringComparison.Ordinal));
        Assert.Contains("<th scope=\"row\">Warnings</th><td>1 (listed below)</td>", Html, StringComparison.Ordinal);

        var q = Result.DataQuality;
        Assert.Contains($"({q.ScoredDatesWithImplied} of the {q.ScoredDates} scored dates have an implied quote)", Html, StringComparison.Ordinal);
    }

    [Fact]
    public void FirstColumn_DoesNotWrapSpecNames() =>
        Assert.Contains("th:first-child,td:first-child{text-align:left;white-space:nowrap}", Html, StringComparison.Ordinal);

    [Fact]
    public void Labels_AreOurOwnWords()
    {
        Assert.DoesNotContain("RiskMetrics", Html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("expected-move", Html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotMatch(ScanWord(), Regex.Replace(Html, "data:image/png;base64,[^\"]*", string.Empty));
        Assert.Contains("Coverage of the forecast move bands (±1σ, ±2σ)", System.Net.WebUtility.HtmlDecode(Html), StringComparison.Ordinal);
    }

    [Fact]
    public void DmAgainstImplied_OwnDatesAndCommonDates_AreLabelledAndTheVerdictQuotesTheCommonOne()
    {
        // The loss table scores each forecaster on its own dates, the ranking on the common dates; one page must not
        // show two figures for "the same" test without saying which is which, and the verdict must quote the ranking's.
        var losses = Model.Tables.Single(t => t.Title.StartsWith("Forecast losses", StringComparison.Ordinal));
        Assert.Contains(losses.Columns, c => c.Header == "DM vs implied (own dates)");
        Assert.Contains("the ranking on common dates", losses.Note, StringComparison.Ordinal);
        Assert.DoesNotContain("  ", losses.Note, StringComparison.Ordinal);
        var ranking = Model.Answers.Single(t => t.Title.StartsWith("Ranking on the", StringComparison.Ordinal));
        var column = ranking.Headers.ToList().IndexOf("DM vs implied (common dates)");
        Assert.True(column > 0);

        var common = Result.Common!;
        var leader = Reports.ReportSeries.Ranked(Result)[0];
        var row = ranking.Rows.Single(r => r[0] == leader.Spec);
        Assert.Contains("DM " + row[column] + ",", Model.Verdict.Headline, StringComparison.Ordinal);
        Assert.Contains(" on the " + common.Count + " common dates (QLIKE", Model.Verdict.Headline, StringComparison.Ordinal);
        Assert.StartsWith("Head to head on " + common.Count + " common dates:", Model.Verdict.Points[0], StringComparison.Ordinal);
        var headToHead = Model.Tables.Single(t => t.Title.StartsWith("Head to head", StringComparison.Ordinal));
        Assert.StartsWith("On the " + common.Count + " common dates", headToHead.Note, StringComparison.Ordinal);
    }

    [Fact]
    public void Premium_SaysWhichDatesTheLossTablesBiasOfImpliedIsOn()
    {
        // The premium is on the common dates; the loss table's bias of implied on implied's own dates. When the two
        // sets differ the verdict must not call them the same dates.
        var premium = Model.Verdict.Points[2];
        var implied = Result.Metrics.Single(m => m.Kind == ForecastKind.Implied).Losses!;
        Assert.Contains("of the " + Result.Common!.Count + " dates with both", premium, StringComparison.Ordinal);
        if (implied.Count != Result.Common.Count)
        {
            Assert.Contains("the loss table's bias of implied, " + (implied.Bias * 100).ToString("0.00", System.Globalization.CultureInfo.InvariantCulture) + ", is on its own " + implied.Count + " dates", premium, StringComparison.Ordinal);
            Assert.DoesNotContain("on the same dates", premium, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void VolatilityThirds_KnownAtTheForecastDateAndInHindsight_HaveDifferentPlainNames()
    {
        // "Regime" named two different things: thirds of trailing volatility known when forecasting, and thirds of the
        // realized volatility that followed (hindsight). Each now has its own plain name and says it is not the other.
        var text = System.Net.WebUtility.HtmlDecode(Regex.Replace(Html, "data:image/png;base64,[^\"]*", string.Empty));
        Assert.DoesNotContain("regime", text, StringComparison.OrdinalIgnoreCase);
        var byLevel = Model.Answers.Single(t => t.Title == "By volatility level known at the forecast date");
        Assert.Contains("not the thirds of the odds section", byLevel.Note, StringComparison.Ordinal);
        Assert.Contains(Model.Odds!.Notes, n => n.Contains("known only in hindsight; they are not the volatility levels known at the forecast date", StringComparison.Ordinal));
        Assert.DoesNotContain(" periods (|z| ≤ 1 held", text, StringComparison.Ordinal);
    }

    [GeneratedRegex(@"\bscan\b", RegexOptions.CultureInvariant | RegexOptions.IgnoreCase)]
    private static partial Regex ScanWord();
}
