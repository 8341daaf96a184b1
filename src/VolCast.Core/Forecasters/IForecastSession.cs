namespace VolCast.Core.Forecasters;

/// <summary>One forecaster walking forward over one price history, day by day.</summary>
public interface IForecastSession
{
    /// <summary>Returns the forecast made at the close of day <paramref name="t"/> (an index into the price history).</summary>
    /// <param name="t">The forecast day; each call must ask for a later day than the previous one. Days skipped
    /// between calls are still processed in order, so the answer does not depend on which days were asked for.</param>
    /// <returns>The forecast of average annualized volatility (decimal) over t+1 .. t+h, or null when the method has
    /// no forecast yet (too little history) or none for that day (for example no implied quote).</returns>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="t"/> is outside the history or not after the previous call's day.</exception>
    double? Forecast(int t);

    /// <summary>Gets counts of the events the session has handled so far (refits, rejected fits, fallbacks).</summary>
    ForecasterCounts Counts { get; }
}
