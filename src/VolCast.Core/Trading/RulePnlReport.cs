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
}
