namespace VolCast.Core.Backtest;

/// <summary>Counts of what the backtest could and could not use, reported so that nothing is dropped silently.</summary>
/// <param name="PriceRows">Rows in the price history (all of it is used to warm the forecasters up).</param>
/// <param name="ForecastDates">Every date between start and end (inclusive): forecasts were made on all of them, scored or not (see <paramref name="ScoredDates"/>).</param>
/// <param name="DatesWithTarget">Forecast dates whose realized window closed inside the history.</param>
/// <param name="DatesWithoutTarget">Forecast dates at the end of the history whose window had not closed: forecasts written, not scored.</param>
/// <param name="ZeroRealizedDates">Dates whose realized target was zero (no price moves): not scored, QLIKE being undefined there.</param>
/// <param name="ImpliedRows">Rows in the implied series, or 0 without one.</param>
/// <param name="ForecastDatesWithImplied">Forecast dates with an implied quote on the same date.</param>
/// <param name="ForecastDatesWithoutImplied">Forecast dates without an implied quote.</param>
/// <param name="ImpliedDatesWithoutPrices">Implied quotes between start and end on dates with no price row (not used).</param>
/// <param name="MinimumHorizonDays">The shortest window h_t among dates with a target (equal to h for a trading-day horizon).</param>
/// <param name="MaximumHorizonDays">The longest window h_t among dates with a target; HAC lags use this − 1.</param>
/// <param name="ScoredDates">Forecast dates that are scored: a target above zero (dates with a target less the zero-realized ones).</param>
/// <param name="ScoredDatesWithImplied">Scored dates with an implied quote on the same date.</param>
public sealed record DataQualityCounts(
    int PriceRows,
    int ForecastDates,
    int DatesWithTarget,
    int DatesWithoutTarget,
    int ZeroRealizedDates,
    int ImpliedRows,
    int ForecastDatesWithImplied,
    int ForecastDatesWithoutImplied,
    int ImpliedDatesWithoutPrices,
    int MinimumHorizonDays,
    int MaximumHorizonDays,
    int ScoredDates,
    int ScoredDatesWithImplied);
