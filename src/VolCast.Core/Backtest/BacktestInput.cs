namespace VolCast.Core.Backtest;

/// <summary>The input series of a backtest, to say which one a <see cref="BacktestDataException"/> is about.</summary>
public enum BacktestInput
{
    /// <summary>The price history.</summary>
    Prices,

    /// <summary>The implied-volatility series.</summary>
    Implied,
}
