using VolCast.Core.Trading;

namespace VolCast.IO.Tables;

/// <summary>One row of rule-pnl.csv: one rule's daily P&amp;L on one date, at one entry timing.</summary>
/// <param name="Timing">When the trades were entered: <c>close</c> or <c>next-day</c>.</param>
/// <param name="Rule">The rule.</param>
/// <param name="Date">The date.</param>
/// <param name="Day">Index of the date in the rule's daily path.</param>
public sealed record RulePathRow(string Timing, RulePnl Rule, DateOnly Date, int Day);
