using VolCast.Core.Backtest;
using VolCast.Core.Demo;
using VolCast.Core.Trading;

namespace VolCast.Core.Tests.Trading;

public sealed class RulePnlEvaluatorTests
{
    private static readonly DemoScenario Scenario = new DemoScenarioGenerator(seed: 5, years: 3).Generate();

    [Fact]
    public void Evaluate_ImpliedBaseline_PlainHistoricalStandsInForTheCurrentRuleAndTheReportSaysSo()
    {
        // With an implied series and no baseline configured, the baseline is implied; the rule "sell when implied −
        // forecast > threshold" on implied itself never fires, so the plain historical rule stands in, and the note
        // that every answer carries names both.
        var (report, absence) = Evaluate(baseline: null);
        Assert.Null(absence);
        Assert.Equal("implied", report!.CurrentRuleBaselineReplaced, ignoreCase: true);
        Assert.Equal("close-to-close:21", report.AtClose[TradingRule.Current].ForecastSpec);
        Assert.Equal(report.AtClose[TradingRule.Historical].DailyPnl.ToArray(), report.AtClose[TradingRule.Current].DailyPnl.ToArray());
        Assert.Contains("implied minus implied never fires", report.CurrentRuleNote, StringComparison.Ordinal);
        Assert.Contains("(close-to-close:21)", report.CurrentRuleNote, StringComparison.Ordinal);
    }

    [Fact]
    public void Evaluate_ForecasterBaseline_DrivesTheCurrentRuleWithoutANote()
    {
        var (report, absence) = Evaluate(baseline: "ewma:0.94");
        Assert.Null(absence);
        Assert.Null(report!.CurrentRuleBaselineReplaced);
        Assert.Null(report.CurrentRuleNote);
        Assert.Equal("ewma:0.94", report.AtClose[TradingRule.Current].ForecastSpec);
    }

    private static (RulePnlReport? Report, string? Absence) Evaluate(string? baseline)
    {
        var result = Backtester.Run(Scenario.Index, Scenario.Implied, new BacktestSettings
        {
            Forecasters = ["close-to-close:21", "ewma:0.94", "yang-zhang:21"],
            Sweep = false,
            McsReplications = 50,
            SnoopingReplications = 50,
            Baseline = baseline,
            Candidate = "yang-zhang:21",
        });
        return RulePnlEvaluator.Evaluate(result, Scenario.Index);
    }
}
