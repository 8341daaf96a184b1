using System.Globalization;

namespace VolCast.Core.Trading;

/// <summary>The trading costs charged on every delta-hedged straddle.</summary>
/// <remarks>
/// The option half-spread is charged once, at entry, as <see cref="OptionHalfSpreadVolPoints"/> × the straddle's entry
/// vega per volatility point (so in vol-point units it costs exactly that many points per trade). The hedge cost is
/// charged on the notional of every hedge trade: |Δ₀|·S at entry, |Δ_t − Δ_{t−1}|·S_t at each rebalance and
/// |Δ_last|·S_T at the unwind, times <see cref="HedgeCostBps"/> / 10,000. Every cost is carried to expiry at the rate r,
/// like the premium. Limits: 0 to <see cref="MaximumHalfSpreadVolPoints"/> vol points and 0 to
/// <see cref="MaximumHedgeCostBps"/> basis points; anything outside is refused as a likely unit mistake.
/// </remarks>
public sealed record TradeCosts
{
    /// <summary>The largest option half-spread accepted, in volatility points.</summary>
    public const double MaximumHalfSpreadVolPoints = 10.0;

    /// <summary>The largest hedge cost accepted, in basis points of the traded notional.</summary>
    public const double MaximumHedgeCostBps = 100.0;

    /// <summary>Initializes a new instance of the <see cref="TradeCosts"/> class.</summary>
    /// <param name="optionHalfSpreadVolPoints">Half the option bid-ask spread in volatility points (0.25 = a quarter of a vol point).</param>
    /// <param name="hedgeCostBps">Cost of a hedge trade in basis points of its notional.</param>
    /// <exception cref="ArgumentOutOfRangeException">A cost is not finite, negative, or above its limit.</exception>
    public TradeCosts(double optionHalfSpreadVolPoints, double hedgeCostBps)
    {
        if (!double.IsFinite(optionHalfSpreadVolPoints) || optionHalfSpreadVolPoints < 0 || optionHalfSpreadVolPoints > MaximumHalfSpreadVolPoints)
        {
            throw new ArgumentOutOfRangeException(nameof(optionHalfSpreadVolPoints), optionHalfSpreadVolPoints, string.Create(CultureInfo.InvariantCulture,
                $"The option half-spread must be between 0 and {MaximumHalfSpreadVolPoints} volatility points (0.25 = a quarter of a vol point), was {optionHalfSpreadVolPoints}."));
        }

        if (!double.IsFinite(hedgeCostBps) || hedgeCostBps < 0 || hedgeCostBps > MaximumHedgeCostBps)
        {
            throw new ArgumentOutOfRangeException(nameof(hedgeCostBps), hedgeCostBps, string.Create(CultureInfo.InvariantCulture,
                $"The hedge cost must be between 0 and {MaximumHedgeCostBps} basis points of the traded notional (1.0 = one basis point), was {hedgeCostBps}."));
        }

        OptionHalfSpreadVolPoints = optionHalfSpreadVolPoints;
        HedgeCostBps = hedgeCostBps;
    }

    /// <summary>Gets the default costs: a half-spread of 0.25 vol points and 1 basis point per hedge trade.</summary>
    public static TradeCosts Default { get; } = new(0.25, 1.0);

    /// <summary>Gets zero costs (the gross figures shown beside every net figure).</summary>
    public static TradeCosts Zero { get; } = new(0, 0);

    /// <summary>Gets half the option bid-ask spread in volatility points, charged once at entry.</summary>
    public double OptionHalfSpreadVolPoints { get; }

    /// <summary>Gets the cost of a hedge trade in basis points of its notional.</summary>
    public double HedgeCostBps { get; }
}
