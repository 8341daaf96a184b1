namespace VolCast.Core.Backtest;

/// <summary>Which dates a row of the rule test covers.</summary>
public enum RuleSignal
{
    /// <summary>Every date with implied, the forecast and a target (the unconditional reference).</summary>
    AllDates,

    /// <summary>Dates where implied minus the forecast was above the threshold: "sell volatility".</summary>
    SellVolatility,

    /// <summary>Dates where the forecast minus implied was above the threshold: "buy volatility".</summary>
    BuyVolatility,
}
