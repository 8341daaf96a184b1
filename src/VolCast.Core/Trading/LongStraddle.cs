namespace VolCast.Core.Trading;

/// <summary>One long delta-hedged straddle per unit of underlying; a short trade is its mirror (same costs).</summary>
/// <param name="EntryIndex">Index of the entry close.</param>
/// <param name="ExpiryIndex">Index of the expiry close.</param>
/// <param name="Strike">K = the entry close.</param>
/// <param name="ImpliedVolatility">The entry date's implied volatility (the premium's).</param>
/// <param name="HedgeVolatility">The volatility of the deltas.</param>
/// <param name="CalendarDays">Calendar days from entry to expiry.</param>
/// <param name="Outcome">Premium, vega, hedge P&amp;L, payoff and traded notional.</param>
/// <param name="OptionCost">Half-spread × entry vega per vol point, carried to expiry.</param>
/// <param name="HedgeCost">Hedge cost in basis points on the traded notional, carried to expiry.</param>
/// <param name="StressPnl">The long hedged position's instantaneous P&amp;L at entry under the stress shock, per unit.</param>
/// <param name="RealizedVariance">Σ r_j² of the daily log returns over the trade (total, not annualized).</param>
internal readonly record struct LongStraddle(
    int EntryIndex,
    int ExpiryIndex,
    double Strike,
    double ImpliedVolatility,
    double HedgeVolatility,
    int CalendarDays,
    HedgeOutcome Outcome,
    double OptionCost,
    double HedgeCost,
    double StressPnl,
    double RealizedVariance)
{
    /// <summary>Gets the entry vega per volatility point (∂V/∂σ / 100), the unit of the sized figures.</summary>
    public double VegaPerVolPoint => Outcome.Vega / 100.0;

    /// <summary>Gets both costs.</summary>
    public double Costs => OptionCost + HedgeCost;

    /// <summary>Gets the implied variance over the trade, σ²·days/365 (total, not annualized).</summary>
    public double ImpliedVariance => ImpliedVolatility * ImpliedVolatility * CalendarDays / 365.0;
}
