using System.Collections.Immutable;

namespace VolCast.Core.Trading;

/// <summary>The rules compared as delta-hedged straddle trades (see <see cref="RuleBacktest"/>).</summary>
/// <param name="Settings">The settings used.</param>
/// <param name="HorizonDays">h: the horizon's nominal trading days (ladder size 1/h, Newey-West lag of the daily tests).</param>
/// <param name="FiringDates">Number of dates on which every rule could fire (implied, the three forecasts and a full trade window).</param>
/// <param name="Dates">Dates of the daily paths: from the first entry to the last expiry.</param>
/// <param name="Rules">Always-sell, proposed, current, plain historical, walk-forward threshold, in that order.</param>
/// <param name="ProposedVersusCurrent">Proposed − current daily net P&amp;L.</param>
/// <param name="VersusAlwaysSell">Each other rule − always-sell daily net P&amp;L.</param>
/// <param name="Sweep">Every threshold × forecaster × side shown.</param>
/// <param name="BreakEven">The option half-spread at which the proposed rule's edge vanishes.</param>
/// <param name="SnoopingDifferences">For each sweep row k (same order), the daily net P&amp;L d_k = rule k − always-sell over <see cref="Dates"/>: the input of the data-snooping tests.</param>
public sealed record RuleBacktestResult(
    TradingSettings Settings,
    int HorizonDays,
    int FiringDates,
    ImmutableArray<DateOnly> Dates,
    ImmutableArray<RulePnl> Rules,
    RuleComparison ProposedVersusCurrent,
    ImmutableArray<RuleComparison> VersusAlwaysSell,
    ImmutableArray<ThresholdSweepRow> Sweep,
    BreakEvenSpread BreakEven,
    double[][] SnoopingDifferences)
{
    /// <summary>Gets the result of one rule.</summary>
    /// <param name="rule">The rule.</param>
    /// <returns>Its P&amp;L.</returns>
    public RulePnl this[TradingRule rule] => Rules.First(r => r.Rule == rule);

    /// <summary>Gets the threshold the walk-forward rule would use on the last forecast date, chosen from the trades closed by then, or null when the run was not given that date.</summary>
    public WalkForwardChoice? WalkForwardToday { get; init; }
}
