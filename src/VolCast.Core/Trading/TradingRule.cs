namespace VolCast.Core.Trading;

/// <summary>The rules compared as trades.</summary>
public enum TradingRule
{
    /// <summary>Sell a straddle on every date: the unconditional short-volatility trade every rule must beat.</summary>
    AlwaysSell,

    /// <summary>Sell when implied − the rule forecaster's forecast is above the threshold (and buy on the mirror with both sides).</summary>
    Proposed,

    /// <summary>The same rule driven by the baseline forecaster (the rule in use today).</summary>
    Current,

    /// <summary>The same rule driven by a plain historical estimate (close-to-close over 21 days by default).</summary>
    Historical,

    /// <summary>The proposed rule with its threshold chosen at each date as the best of the sweep on the trades closed by then.</summary>
    WalkForwardThreshold,
}
