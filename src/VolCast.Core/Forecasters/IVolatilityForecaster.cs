namespace VolCast.Core.Forecasters;

/// <summary>
/// A volatility forecasting method: at the close of day t it forecasts the average annualized volatility over the
/// next h trading days, t+1 .. t+h, from data up to and including day t.
/// </summary>
/// <remarks>
/// A forecaster is an immutable description (built from a spec string by <see cref="ForecasterSpec.Parse"/>); the
/// walk-forward work happens in the <see cref="IForecastSession"/> it starts over one price history. Sessions may
/// keep state between days (filters, warm-started refits), but the answer at t never depends on data after t: the
/// same session run over <c>PriceHistory.Take(t + 1)</c> gives the same forecast at t, bit for bit.
/// </remarks>
public interface IVolatilityForecaster
{
    /// <summary>Gets the canonical spec string, for example <c>ewma:0.94</c> or <c>garch</c>.</summary>
    string Spec { get; }

    /// <summary>Starts a walk-forward session over one history.</summary>
    /// <param name="input">The prices, the optional implied series, the horizon and the annualization factor.</param>
    /// <returns>A new session positioned before day 0.</returns>
    /// <exception cref="ArgumentException">The input lacks something this forecaster needs (for example an implied series, or open/high/low for a range proxy).</exception>
    IForecastSession Start(ForecastInput input);
}
