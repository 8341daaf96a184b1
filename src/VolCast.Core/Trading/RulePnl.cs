using System.Collections.Immutable;

namespace VolCast.Core.Trading;

/// <summary>What one rule would have earned as delta-hedged straddles, net of costs and (beside it) without costs.</summary>
/// <remarks>
/// Trade statistics use the one-at-a-time trades from the first start date (no overlap). Daily paths and their
/// statistics use the every-signal ladder (a trade on every firing date, each sized 1/h, h the horizon in trading days): each open trade marked daily at
/// that day's quoted implied volatility (the constant-tenor series stands in for the option's own, shorter-dated implied;
/// a missing quote carries the last one), and beside it the same trades marked at their entry implied (the
/// gamma-against-theta path). Daily values are changes of the trades' value carried to their expiry at r, in vol points,
/// aligned with <see cref="RuleBacktestResult.Dates"/>; each trade's increments sum to its P&amp;L at expiry on both paths.
/// </remarks>
/// <param name="Rule">Which rule.</param>
/// <param name="ForecastSpec">The forecaster that drives it; null for always-sell.</param>
/// <param name="Threshold">Its threshold; null for always-sell and the walk-forward threshold.</param>
/// <param name="Sides">The sides it trades (sell only for always-sell).</param>
/// <param name="Trades">The trade table: one-at-a-time trades from the first start date, or every signal's trade (<see cref="TradingSettings.Entries"/>).</param>
/// <param name="TradeStatisticsNet">Statistics of those trades after costs.</param>
/// <param name="TradeStatisticsZeroCost">The same without costs.</param>
/// <param name="LadderTrades">Trades in the every-signal ladder.</param>
/// <param name="ShareOfDaysInMarket">Share of the path's days on which the ladder held a trade.</param>
/// <param name="PathNet">Statistics of the net daily path (marked at the quoted implied).</param>
/// <param name="PathZeroCost">The same without costs.</param>
/// <param name="DailyPnl">The net daily path, marked at the quoted implied.</param>
/// <param name="DailyPnlZeroCost">The same without costs.</param>
/// <param name="DailyPnlEntryVol">The net daily path, marked at each trade's entry implied.</param>
/// <param name="DailyPnlEntryVolZeroCost">The same without costs.</param>
/// <param name="OneAtATimeRangeNet">Each one-at-a-time trade figure's range over the h possible start offsets, after costs.</param>
/// <param name="OneAtATimeRangeZeroCost">The same without costs.</param>
/// <param name="MeanStressPnlVolPoints">Mean stress P&amp;L per trade (spot and implied shocked at entry), vol points; null without trades.</param>
/// <param name="VarianceGapTotal">Σ s·(RV² − IV²) over the trades, total variance.</param>
/// <param name="VarianceGapVolPoints">Σ s·(RV² − IV²)/(2·IV) over the trades, vol points.</param>
/// <param name="ChosenThresholds">For the walk-forward threshold, the threshold in force on each path date (null elsewhere and for the other rules: empty).</param>
public sealed record RulePnl(
    TradingRule Rule,
    string? ForecastSpec,
    double? Threshold,
    RuleSides Sides,
    ImmutableArray<StraddleTrade> Trades,
    TradeStatistics TradeStatisticsNet,
    TradeStatistics TradeStatisticsZeroCost,
    int LadderTrades,
    double ShareOfDaysInMarket,
    PathStatistics PathNet,
    PathStatistics PathZeroCost,
    ImmutableArray<double> DailyPnl,
    ImmutableArray<double> DailyPnlZeroCost,
    ImmutableArray<double> DailyPnlEntryVol,
    ImmutableArray<double> DailyPnlEntryVolZeroCost,
    StartOffsetRange OneAtATimeRangeNet,
    StartOffsetRange OneAtATimeRangeZeroCost,
    double? MeanStressPnlVolPoints,
    double VarianceGapTotal,
    double VarianceGapVolPoints,
    ImmutableArray<double?> ChosenThresholds);
