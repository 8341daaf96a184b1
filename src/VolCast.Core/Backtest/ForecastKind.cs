namespace VolCast.Core.Backtest;

/// <summary>Where a forecast series in a backtest came from.</summary>
public enum ForecastKind
{
    /// <summary>A forecaster named in the configuration.</summary>
    Configured,

    /// <summary>The out-of-sample adaptive lookback choice of one estimator family.</summary>
    Adaptive,

    /// <summary>The implied-volatility series joined by date.</summary>
    Implied,
}
