namespace VolCast.Core.Trading;

/// <summary>The volatility at which the straddle's Black-Scholes-Merton delta is computed for the hedge.</summary>
public enum HedgeVolatility
{
    /// <summary>The implied volatility quoted on the entry date (the default), held for the whole trade.</summary>
    Implied,

    /// <summary>The forecaster's volatility on the firing date, held for the whole trade (the published alternative of hedging at the volatility one expects to be realized).</summary>
    Forecast,
}
