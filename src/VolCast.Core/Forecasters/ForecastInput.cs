using System.Globalization;
using VolCast.Core.Data;
using VolCast.Core.Estimators;

namespace VolCast.Core.Forecasters;

/// <summary>What a forecasting session runs over: one price history, optionally an implied series, a horizon and an annualization factor.</summary>
/// <remarks>
/// Work that depends on the history alone (the estimators' per-bar terms) is done once per input, on first use, and
/// shared by every session started from it: a sweep of many windows reads one set of terms.
/// </remarks>
public sealed record ForecastInput
{
    private readonly Lazy<EstimatorTerms> _terms;

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
        _terms = new Lazy<EstimatorTerms>(() => EstimatorTerms.From(prices));
    }

    /// <summary>Gets the daily price history.</summary>
    public PriceHistory Prices { get; }

    /// <summary>Gets the implied-volatility series, or null.</summary>
    public ImpliedSeries? Implied { get; }

    /// <summary>Gets the forecast horizon in trading days.</summary>
    public int HorizonDays { get; }

    /// <summary>Gets the trading days per year used to annualize.</summary>
    public double AnnualizationFactor { get; }

    /// <summary>Gets the trailing window, in forecast dates, of the forecasters that learn from their own past errors when no window is given in their spec (504 by default, the run's selection window).</summary>
    public int SelectionWindowDays { get; init; } = 504;

    /// <summary>Gets the estimators' per-bar terms of <see cref="Prices"/>, built on first use and shared by every session of this input.</summary>
    internal EstimatorTerms Terms => _terms.Value;
}
