namespace VolCast.Core.Trading;

/// <summary>
/// One delta-hedged at-the-money straddle held to expiry: the figures per unit of underlying, and the sized figures in
/// volatility points (÷ the entry vega per vol point) and in percent of the entry spot.
/// </summary>
/// <remarks>
/// P&amp;L per unit = s·(payoff − premium·e^{rT} + hedge P&amp;L of the long position) − costs, s = +1 long, −1 short.
/// Money amounts are in the units of the price, carried to expiry at r.
/// </remarks>
/// <param name="Side">+1 long the straddle (buy volatility), −1 short (sell volatility).</param>
/// <param name="EntryIndex">Index of the entry close in the price history.</param>
/// <param name="ExpiryIndex">Index of the expiry close.</param>
/// <param name="EntryDate">Date of the entry close.</param>
/// <param name="ExpiryDate">Date of the expiry close, where the straddle settles.</param>
/// <param name="TradingDays">Trading days held (expiry index − entry index).</param>
/// <param name="CalendarDays">Calendar days held (the option's life under ACT/365).</param>
/// <param name="Spot">The entry close.</param>
/// <param name="Strike">The strike, equal to the entry close.</param>
/// <param name="ImpliedVolatility">The entry date's implied volatility (decimal), at which the straddle is priced.</param>
/// <param name="HedgeVolatility">The volatility of the hedge deltas (decimal).</param>
/// <param name="Forecast">The rule's forecast on the firing date (decimal); null for a trade not driven by a forecast.</param>
/// <param name="Premium">The straddle's price at entry.</param>
/// <param name="VegaPerVolPoint">The straddle's entry vega per volatility point.</param>
/// <param name="EntryDelta">The long straddle's delta at entry (the hedge holds minus this).</param>
/// <param name="HedgePnl">The long position's hedge P&amp;L, carried to expiry.</param>
/// <param name="Payoff">|S_T − K|.</param>
/// <param name="OptionCost">The half-spread charge, carried to expiry.</param>
/// <param name="HedgeCost">The hedge trades' charge, carried to expiry.</param>
/// <param name="GrossPnl">P&amp;L per unit before costs.</param>
/// <param name="Pnl">P&amp;L per unit after costs.</param>
/// <param name="GrossPnlVolPoints">Gross P&amp;L ÷ entry vega per vol point.</param>
/// <param name="PnlVolPoints">Net P&amp;L ÷ entry vega per vol point.</param>
/// <param name="GrossPnlPercentOfSpot">Gross P&amp;L as a percentage of the entry spot.</param>
/// <param name="PnlPercentOfSpot">Net P&amp;L as a percentage of the entry spot.</param>
/// <param name="StressPnlVolPoints">The hedged position's instantaneous P&amp;L at entry after the stress shock (spot and implied moved, repriced with Black-Scholes-Merton), in vol points; negative is a loss.</param>
/// <param name="VarianceGap">The variance-swap view s·(RV² − IV²), both total variance over the trade: Σr² and IV²·days/365.</param>
/// <param name="VarianceGapVolPoints">The same in vol points: s·(RV² − IV²)/(2·IV) with RV² annualized on the calendar basis (Σr²·365/days), × 100.</param>
public sealed record StraddleTrade(
    int Side,
    int EntryIndex,
    int ExpiryIndex,
    DateOnly EntryDate,
    DateOnly ExpiryDate,
    int TradingDays,
    int CalendarDays,
    double Spot,
    double Strike,
    double ImpliedVolatility,
    double HedgeVolatility,
    double? Forecast,
    double Premium,
    double VegaPerVolPoint,
    double EntryDelta,
    double HedgePnl,
    double Payoff,
    double OptionCost,
    double HedgeCost,
    double GrossPnl,
    double Pnl,
    double GrossPnlVolPoints,
    double PnlVolPoints,
    double GrossPnlPercentOfSpot,
    double PnlPercentOfSpot,
    double StressPnlVolPoints,
    double VarianceGap,
    double VarianceGapVolPoints)
{
    /// <summary>Gets both costs (option half-spread and hedge), carried to expiry.</summary>
    public double Costs => OptionCost + HedgeCost;
}
