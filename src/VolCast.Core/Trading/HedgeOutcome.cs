namespace VolCast.Core.Trading;

/// <summary>What one delta-hedged long option position did, per unit of underlying, every cash flow carried to expiry at r.</summary>
/// <param name="Premium">Price paid at entry (at the pricing volatility).</param>
/// <param name="Vega">∂V/∂σ at entry per unit of σ (divide by 100 for a volatility point).</param>
/// <param name="EntryDelta">Δ₀, the delta at entry at the hedge volatility.</param>
/// <param name="HedgePnl">Σ −Δ_t (S_{t+1} − S_t e^{(r−q)δt}), each step carried from t+1 to expiry.</param>
/// <param name="Payoff">The payoff at expiry.</param>
/// <param name="HedgeNotional">|Δ₀|S₀ + Σ|Δ_t − Δ_{t−1}|S_t + |Δ_last|S_T, each carried from its date to expiry.</param>
/// <param name="Carry">e^{rT}, the factor that carries an entry cash flow to expiry.</param>
internal readonly record struct HedgeOutcome(double Premium, double Vega, double EntryDelta, double HedgePnl, double Payoff, double HedgeNotional, double Carry)
{
    /// <summary>Gets the long position's P&amp;L before costs, at expiry: payoff − premium·e^{rT} + hedge P&amp;L.</summary>
    public double GrossPnl => Payoff - (Premium * Carry) + HedgePnl;
}
