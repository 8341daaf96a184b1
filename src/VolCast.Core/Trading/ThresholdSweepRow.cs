namespace VolCast.Core.Trading;

/// <summary>One rule of the threshold sweep: a forecaster, the sides it trades and a threshold, as an every-signal ladder.</summary>
/// <param name="Label">forecast spec | sides | threshold, the name used in the data-snooping tests.</param>
/// <param name="Rule">Which forecaster drives it (proposed, current or historical).</param>
/// <param name="ForecastSpec">The forecaster's spec.</param>
/// <param name="Sides">The sides traded.</param>
/// <param name="Threshold">The threshold (decimal).</param>
/// <param name="Trades">Trades in the ladder.</param>
/// <param name="PnlPerYear">Net P&amp;L per year, vol points.</param>
/// <param name="PnlPerYearZeroCost">The same without costs.</param>
/// <param name="Sharpe">Annualized Sharpe ratio of the net daily path; null when flat.</param>
/// <param name="SharpeZeroCost">The same without costs.</param>
public sealed record ThresholdSweepRow(
    string Label,
    TradingRule Rule,
    string ForecastSpec,
    RuleSides Sides,
    double Threshold,
    int Trades,
    double PnlPerYear,
    double PnlPerYearZeroCost,
    double? Sharpe,
    double? SharpeZeroCost);
