using System.Globalization;
using VolCast.Core.Data;

namespace VolCast.Core.Forecasters;

/// <summary>What a forecasting session runs over: one price history, optionally an implied series, a horizon and an annualization factor.</summary>
public sealed record ForecastInput
{
    /// <summary>Creates the input of a session.</summary>
    /// <param name="prices">The daily price history.</param>
    /// <param name="implied">The implied-volatility series, or null.</param>
    /// <param name="horizonDays">h, the forecast horizon in trading days, at least 1.</param>
    /// <param name="annualizationFactor">A, trading days per year, above zero (252 by default).</param>
    /// <exception cref="ArgumentNullException"><paramref name="prices"/> is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException">h is below 1 or A is not a finite number above zero.</exception>
    public ForecastInput(PriceHistory prices, ImpliedSeries? implied, int horizonDays, double annualizationFactor = 252)
    {
        ArgumentNullException.ThrowIfNull(prices);
        Preconditions.AtLeast(horizonDays, 1, "trading day");
        Preconditions.Positive(annualizationFactor);

        Prices = prices;
        Implied = implied;
        HorizonDays = horizonDays;
        AnnualizationFactor = annualizationFactor;
    }

    /// <summary>Gets the daily price history.</summary>
    public PriceHistory Prices { get; }

    /// <summary>Gets the implied-volatility series, or null.</summary>
    public ImpliedSeries? Implied { get; }

    /// <summary>Gets the forecast horizon in trading days.</summary>
    public int HorizonDays { get; }

    /// <summary>Gets the trading days per year used to annualize.</summary>
    public double AnnualizationFactor { get; }
}
