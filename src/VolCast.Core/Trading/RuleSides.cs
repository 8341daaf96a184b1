namespace VolCast.Core.Trading;

/// <summary>Which sides the rule trades.</summary>
public enum RuleSides
{
    /// <summary>Sell a straddle when implied − forecast is above the threshold; otherwise stay out (the default).</summary>
    SellOnly,

    /// <summary>Also buy a straddle when forecast − implied is above the threshold.</summary>
    Both,
}
