using System.Collections.Immutable;
using VolCast.Core.Trading.Snooping;

namespace VolCast.Core.Trading;

/// <summary>
/// Everything a run reports about "would the rule have paid?": the rules as delta-hedged straddle trades entered at the
/// firing date's close and one trading day later, and the data-snooping tests of the threshold search.
/// </summary>
/// <param name="AtClose">The rules traded at the close of each firing date (the default timing).</param>
/// <param name="NextDay">The same rules entered one trading day later (the forecast need not exist before the close).</param>
/// <param name="Means">Reality Check, SPA and StepM on the mean daily net P&amp;L of every rule searched minus always-sell (one per sweep row, in order).</param>
/// <param name="Sharpe">The same tests on Sharpe ratios.</param>
public sealed record RulePnlReport(
    RuleBacktestResult AtClose,
    RuleBacktestResult NextDay,
    DataSnoopingResult Means,
    DataSnoopingResult Sharpe)
{
    /// <summary>
    /// Gets, for each rule of <see cref="Sharpe"/> (same order), its row in <see cref="RuleBacktestResult.Sweep"/>: the
    /// Sharpe test leaves out sweep rules whose daily path never varies (no trade, no Sharpe ratio). Empty means every
    /// sweep row, in order.
    /// </summary>
    public ImmutableArray<int> SharpeSweepRows { get; init; } = [];

    /// <summary>
    /// Gets the baseline forecaster that could not drive the current rule, or null when it did. The baseline is implied
    /// whenever an implied series is given and no other baseline is configured; "implied − implied" never fires, so the
    /// plain historical rule then stands in for the current rule, and the report says so wherever it names the current rule.
    /// </summary>
    public string? CurrentRuleBaselineReplaced { get; init; }

    /// <summary>Gets the sentence that says which forecaster stands in for the current rule, or null when the baseline drives it.</summary>
    public string? CurrentRuleNote => CurrentRuleBaselineReplaced is string baseline
        ? $"the baseline forecaster is {baseline}, and implied minus implied never fires, so the current rule is the plain historical rule ({AtClose[TradingRule.Current].ForecastSpec}); set baseline to the forecaster your rule uses today"
        : null;
}
