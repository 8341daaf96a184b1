using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Demo;
using VolCast.IO.Results;
using VolCast.Reports.Html;
using VolCast.Reports.Tests.Support;

namespace VolCast.Reports.Tests;

/// <summary>
/// The mapping from a backtest to its report: which forecaster leads, the series each chart is handed, and what is
/// left out without implied. Runs a small backtest on invented demo data (3 years), not reference data.
/// </summary>
public sealed class ReportWriterTests
{
    private static readonly DemoScenario Scenario = new DemoScenarioGenerator(5, years: 3).Generate();

    private static readonly BacktestSettings Settings = new()
    {
        Forecasters = ["close-to-close:5", "close-to-close:21", "ewma:0.94", "garch"],
        FullSweep = true,
        SweepEstimators = [Core.Estimators.Estimator.CloseToClose, Core.Estimators.Estimator.YangZhang],
        SweepLookbacks = [10, 21, 63],
        EwmaLambdas = [0.94, 0.97],
        SelectionWindowDays = 126,
        McsReplications = 200,
        Baseline = "close-to-close:21",
        Candidate = "garch",
    };

    private static readonly BacktestResult WithImplied = Backtester.Run(Scenario.Index, Scenario.Implied, Settings);

    private static readonly BacktestRunInfo Run = new(
        "0.1.0-test",
        [new InputFileInfo("prices", "<script>alert(1)</script>.csv", new string('a', 64)), new InputFileInfo("implied", "implied.csv", new string('b', 64))],
        new DateTimeOffset(2025, 1, 2, 3, 4, 5, TimeSpan.Zero),
        new DateTimeOffset(2025, 1, 2, 3, 4, 7, TimeSpan.Zero),
        "decimal",
        ["implied.csv: a warning & <b>bold</b>"]);

    private static BacktestRun Of(BacktestResult result, BacktestRunInfo info) =>
        new(result, BacktestCalibrator.Evaluate(result, Scenario.Index), info, Scenario.Index, Scenario.Index.Count);

    [Fact]
    public void Build_Verdict_NamesTheLowestQlikeForecasterFirst()
    {
        // Ranked on the dates every compared forecaster and implied share, so the leader is the lowest there.
        var lowest = WithImplied.Common!.Rows.Where(r => r.Kind != ForecastKind.Implied).MinBy(r => r.Losses.Qlike)!;

        var model = ReportWriter.Build(Of(WithImplied, Run));

        Assert.StartsWith($"{lowest.Spec} ranks first on QLIKE", model.Verdict.Headline, StringComparison.Ordinal);
        Assert.Contains("DM ", model.Verdict.Headline, StringComparison.Ordinal);
        Assert.Contains(string.Create(System.Globalization.CultureInfo.InvariantCulture, $"The ranking, the verdict, the head-to-head and the premium use the {WithImplied.Common.Count} dates"), model.Verdict.Headline, StringComparison.Ordinal);
        Assert.StartsWith("Head to head on ", model.Verdict.Points[0], StringComparison.Ordinal);
        Assert.Contains(model.Verdict.Points, p => p.Contains("model confidence set", StringComparison.Ordinal));
        Assert.DoesNotContain(model.Verdict.Points, p => p.StartsWith("Adaptive", StringComparison.Ordinal));
        Assert.Equal("Head to head: candidate garch against baseline close-to-close:21", model.Tables[0].Title);
    }

    [Fact]
    public void Build_WithImplied_DrawsAllSevenCharts()
    {
        var model = ReportWriter.Build(Of(WithImplied, Run));

        Assert.Equal(
            ["forecast-vs-realized.png", "premium.png", "cumulative-qlike.png", "loss-vs-lookback.png", "mincer-zarnowitz.png", "cone.png", "rule-test.png"],
            model.Charts.Select(c => c.FileName));
        Assert.All(model.Charts, c => Assert.True(Png.HasSignature(c.Png.Span), c.FileName));
        Assert.Equal(Scenario.Index.Count, model.DataQuality.RowsRead);
        Assert.Equal(WithImplied.DataQuality.ScoredDatesWithImplied / (double)WithImplied.DataQuality.ScoredDates, model.DataQuality.ImpliedCoverage);
    }

    [Fact]
    public void Build_WithoutImplied_LeavesOutTheChartsThatNeedIt()
    {
        var result = Backtester.Run(Scenario.Index, null, Settings with { Baseline = null });
        var run = Run with { Inputs = [Run.Inputs[0]], ImpliedUnit = null };

        var model = ReportWriter.Build(Of(result, run));

        Assert.Equal(["forecast-vs-realized.png", "loss-vs-lookback.png", "mincer-zarnowitz.png", "cone.png"], model.Charts.Select(c => c.FileName));
        Assert.Contains("no implied series", model.Verdict.Headline, StringComparison.Ordinal);
        Assert.Null(model.DataQuality.ImpliedCoverage);
    }

    [Fact]
    public void Lookback_SeveralTied_SaysTheyAreTiedInsteadOfNamingTheInSampleBestAsTheWinner()
    {
        // The answer the report must give when 42 to 252 days are all in the confidence set (invented numbers).
        var answer = new LookbackAnswer(
            "yang-zhang", ["yang-zhang:21", "yang-zhang:42", "yang-zhang:63", "yang-zhang:252"], 2000, "yang-zhang:252", "yang-zhang:63",
            ["yang-zhang:42", "yang-zhang:63", "yang-zhang:252"], [0.01, 0.4, 0.7, 1.0], 0.9, 21, "yang-zhang:63", 0.55, 12, 1500, null);
        var sentence = ReportAnswers.Lookback(WithImplied with { Lookbacks = [answer] }, "yang-zhang")!;

        Assert.Equal(
            "Which yang-zhang lookback: yang-zhang:252 has the lowest loss in-sample, the walk-forward choice on the last date is yang-zhang:63; 42 to 252 days (yang-zhang:42, yang-zhang:63, yang-zhang:252) are all statistically tied with the best (90% model confidence set), so the data do not single one out; out of sample it chose yang-zhang:63 on 55% of 1500 dates and changed 12 times.",
            sentence);
        var row = ReportAnswers.Tables(WithImplied with { Lookbacks = [answer] }, GroupedResults.Empty).Single(t => t.Title == "Which lookback").Rows.Single();
        Assert.Equal(["yang-zhang", "yang-zhang:252 (in-sample)", "yang-zhang:63", "yang-zhang:42, yang-zhang:63, yang-zhang:252", "yang-zhang:63 (55%)", "12", "2000"], row);
    }

    [Fact]
    public void Premium_IsImpliedMinusRealizedOnDatesWithBoth()
    {
        var premium = ReportSeries.Premium(WithImplied);

        var expected = new List<(DateOnly, double)>();
        for (var i = 0; i < WithImplied.Dates.Length; i++)
        {
            // The premium is measured on the common dates, the same as the verdict's.
            if (WithImplied.Implied[i] is double iv && WithImplied.Realized[i] is double rv && WithImplied.Common!.OnCommonDates[i])
            {
                expected.Add((WithImplied.Dates[i], iv - rv));
            }
        }

        Assert.Equal(expected.Select(e => e.Item1), premium.Dates);
        Assert.Equal(expected.Select(e => e.Item2), premium.Values);
    }

    [Fact]
    public void QlikeDifferential_MatchesTheFormulaOnCommonDates()
    {
        var differential = ReportSeries.QlikeDifferential(WithImplied, "garch");
        var garch = WithImplied.Forecasts.Single(f => f.Spec == "garch").Values;

        // QLIKE(RV, F) = RV²/F² − ln(RV²/F²) − 1 (Patton 2011's normalized form, as docs/conventions.md#losses ranks on).
        static double Qlike(double rv, double f) => (rv * rv / (f * f)) - Math.Log(rv * rv / (f * f)) - 1;
        var expected = new List<double>();
        for (var i = 0; i < WithImplied.Dates.Length; i++)
        {
            if (garch[i] is double f && WithImplied.Implied[i] is double iv && WithImplied.Realized[i] is double rv && rv > 0)
            {
                expected.Add(Qlike(rv, f) - Qlike(rv, iv));
            }
        }

        Assert.Equal(expected.Count, differential.Values.Count);
        for (var i = 0; i < expected.Count; i++)
        {
            Assert.Equal(expected[i], differential.Values[i], 12);
        }
    }

    [Fact]
    public void LookbackCurves_OneCurvePerWindowFamilyWithEveryAdaptiveChoice()
    {
        var curves = ReportSeries.LookbackCurves(WithImplied);

        Assert.Equal(["close-to-close", "yang-zhang"], curves.Select(c => c.Family));
        foreach (var curve in curves)
        {
            Assert.Equal([10, 21, 63], curve.LookbackDays);
            var adaptive = WithImplied.Adaptive.Single(a => a.Family == curve.Family);
            Assert.Equal(adaptive.DatesWithChoice, curve.ChosenLookbackDays.Count);
            var sweep = WithImplied.Sweep.Where(s => s.Family == curve.Family).Select(s => s.Qlike!.Value);
            Assert.Equal(sweep, curve.MeanLoss);
        }
    }

    [Fact]
    public void RuleGaps_SellDatesAreThoseWhereImpliedExceedsTheForecastByTheThreshold()
    {
        var (all, sell) = ReportSeries.RuleGaps(WithImplied);
        var rows = WithImplied.RuleTest!.Rows.Where(r => r.Source == WithImplied.RuleTest.ForecastSpec).ToArray();

        Assert.Equal(rows.Single(r => r.Signal == RuleSignal.AllDates).Count, all.Length);
        Assert.Equal(rows.Single(r => r.Signal == RuleSignal.SellVolatility).Count, sell.Length);
        Assert.Equal(rows.Single(r => r.Signal == RuleSignal.SellVolatility).MeanVolatilityGap!.Value, sell.Average(), 12);
    }

    [Fact]
    public void Render_UserStrings_AreEscaped()
    {
        var html = HtmlReport.Render(ReportWriter.Build(Of(WithImplied, Run)));

        Assert.Contains("&lt;script&gt;alert(1)&lt;/script&gt;.csv", html, StringComparison.Ordinal);
        Assert.Contains("a warning &amp; &lt;b&gt;bold&lt;/b&gt;", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void Stars_FollowTheLegendThresholds()
    {
        Assert.Equal(Model.Significance.OnePercent, ReportTables.Stars(0.009));
        Assert.Equal(Model.Significance.FivePercent, ReportTables.Stars(0.01));
        Assert.Equal(Model.Significance.TenPercent, ReportTables.Stars(0.05));
        Assert.Equal(Model.Significance.None, ReportTables.Stars(0.10));
        Assert.Equal(Model.Significance.None, ReportTables.Stars(null));
    }

    [Fact]
    public void Build_WithCalibration_OddsSectionHoldsDiagramTableAndVerdicts()
    {
        var calibration = BacktestCalibrator.Evaluate(WithImplied, Scenario.Index);

        var model = ReportWriter.Build(new BacktestRun(WithImplied, calibration, Run, Scenario.Index, Scenario.Index.Count));

        var odds = model.Odds!;
        Assert.Equal("reliability.png", odds.Reliability!.FileName);
        Assert.True(Png.HasSignature(odds.Reliability.Png.Span));
        Assert.DoesNotContain(model.Charts, c => c.FileName == "reliability.png");
        Assert.Equal(calibration.Forecasters.Length, odds.Coverage.Rows.Count);
        Assert.Equal("implied", odds.Coverage.Rows[0].Label);
        var implied = calibration.Forecasters[0].Coverage;
        Assert.Equal(implied.Levels[0].NonOverlappingCount, odds.Coverage.Rows[0].Cells[0].Value);
        Assert.Equal(implied.Levels[0].ShareWithin, odds.Coverage.Rows[0].Cells[1].Value);
        Assert.Equal(implied.Levels[0].Kupiec?.PValue, odds.Coverage.Rows[0].Cells[2].Value);
        Assert.Equal(implied.Levels[0].ConditionalCoverage?.PValue, odds.Coverage.Rows[0].Cells[3].Value);
        Assert.Equal(implied.Levels[1].ShareWithin, odds.Coverage.Rows[0].Cells[4].Value);
        Assert.Equal(implied.MaxAbsZ, odds.Coverage.Rows[0].Cells[7].Value);
        Assert.Equal(implied.ShareAboveThree, odds.Coverage.Rows[0].Cells[8].Value);
        Assert.Equal(implied.MissingCount, odds.Coverage.Rows[0].Cells[9].Value);
        Assert.StartsWith("Move bands from implied", odds.Verdicts[0], StringComparison.Ordinal);

        var html = HtmlReport.Render(model);
        Assert.Contains("<h2>Do the odds hold?</h2>", html, StringComparison.Ordinal);
        Assert.True(html.IndexOf("id=\"odds\"", StringComparison.Ordinal) < html.IndexOf("id=\"data-quality\"", StringComparison.Ordinal));
        Assert.Contains("calibrated odds in the past do not make calibrated odds in the future", html, StringComparison.Ordinal);
    }

    [Fact]
    public void ReliabilityCurves_ImpliedAndTwoLeading_PooledBinsMatchAHandSum()
    {
        var calibration = BacktestCalibrator.Evaluate(WithImplied, Scenario.Index);

        var curves = ReportOdds.Curves(WithImplied, calibration);

        Assert.Equal(["implied", .. ReportSeries.Leading(WithImplied).Take(2)], curves.Select(c => c.Name));
        foreach (var curve in curves)
        {
            // Pool by hand: for each bin, counts add up and the means are count-weighted over the five strikes.
            var strikes = calibration.Forecasters.Single(f => f.Spec == curve.Name).Calibration.Strikes;
            var k = 0;
            for (var bin = 0; bin < 10; bin++)
            {
                var rows = strikes.Select(s => s.Bins[bin]).Where(b => b.Count > 0).ToArray();
                if (rows.Length == 0)
                {
                    continue;
                }

                var n = rows.Sum(b => b.Count);
                Assert.Equal(n, curve.Counts[k]);
                Assert.Equal(rows.Sum(b => b.Count * b.MeanPredicted!.Value) / n, curve.Predicted[k], 12);
                Assert.Equal(rows.Sum(b => b.Count * b.ObservedFrequency!.Value) / n, curve.Observed[k], 12);
                Assert.True(curve.Lower[k] <= curve.Observed[k] && curve.Observed[k] <= curve.Upper[k]);
                k++;
            }

            Assert.Equal(k, curve.Counts.Count);
            Assert.Equal(strikes.Length * strikes[0].Decomposition.Count, curve.Counts.Sum());
        }
    }

    [Fact]
    public void Render_ModelWithoutOdds_OddsSectionSaysNotRun()
    {
        var html = HtmlReport.Render(ReportWriter.Build(Of(WithImplied, Run)) with { Odds = null });

        Assert.Contains("<section id=\"odds\">", html, StringComparison.Ordinal);
        Assert.Contains("were not run", html, StringComparison.Ordinal);
    }
}
