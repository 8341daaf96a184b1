using VolCast.Core.Trading;

namespace VolCast.IO.Tables;

/// <summary>One row of trades.csv: a trade of one rule at one entry timing.</summary>
/// <param name="Timing">When the trade was entered: <c>close</c> (the firing date's close) or <c>next-day</c>.</param>
/// <param name="Rule">The rule that made the trade.</param>
/// <param name="Trade">The trade.</param>
public sealed record TradeRow(string Timing, RulePnl Rule, StraddleTrade Trade);
