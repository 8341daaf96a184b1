using System.Collections.Immutable;
using System.Globalization;
using VolCast.Core.Data;

namespace VolCast.Core.Calibration;

/// <summary>Builds <see cref="HorizonOutcomes"/> from a price history, the forecast dates and each date's horizon.</summary>
internal static class OutcomeAlignment
{
    /// <summary>
    /// Finds S_t and S_{t+h_t} in the price history for each forecast date whose window has closed: a date with a null
    /// horizon, or whose h_t-th later close is past the end of the history, is left out (it has no outcome yet).
    /// </summary>
    /// <param name="prices">The price history the forecasts were made on.</param>
    /// <param name="forecastDates">The forecast dates, in increasing order, each a trading date of <paramref name="prices"/>.</param>
    /// <param name="windowDays">h_t per forecast date in trading days; null where the window had not closed.</param>
    /// <returns>The outcomes and the index of each in <paramref name="forecastDates"/>.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">The lengths differ, or a forecast date is not in the price history.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A horizon is below 1.</exception>
    public static AlignedOutcomes FromPrices(PriceHistory prices, IReadOnlyList<DateOnly> forecastDates, IReadOnlyList<int?> windowDays)
    {
        ArgumentNullException.ThrowIfNull(prices);
        ArgumentNullException.ThrowIfNull(forecastDates);
        ArgumentNullException.ThrowIfNull(windowDays);
        Preconditions.SameLength(windowDays.Count, forecastDates.Count, nameof(forecastDates), nameof(windowDays));
        var dates = prices.Dates;
        var close = prices.Close;
        var indices = ImmutableArray.CreateBuilder<int>();
        var kept = ImmutableArray.CreateBuilder<DateOnly>();
        var start = new List<double>();
        var end = new List<double>();
        var days = new List<int>();
        var j = 0;
        for (var i = 0; i < forecastDates.Count; i++)
        {
            var date = forecastDates[i];
            while (j < dates.Length && dates[j] < date)
            {
                j++;
            }

            if (j == dates.Length || dates[j] != date)
            {
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"forecastDates[{i}] = {date:yyyy-MM-dd} is not a trading date of the price history (dates must be increasing and taken from it)."), nameof(forecastDates));
            }

            if (windowDays[i] is not { } h)
            {
                continue;
            }

            if (h < 1)
            {
                throw new ArgumentOutOfRangeException(nameof(windowDays), h, string.Create(CultureInfo.InvariantCulture,
                    $"windowDays[{i}] must be at least 1 trading day, was {h}."));
            }

            if (j + h >= dates.Length)
            {
                continue;
            }

            indices.Add(i);
            kept.Add(date);
            start.Add(close[j]);
            end.Add(close[j + h]);
            days.Add(h);
        }

        return new AlignedOutcomes(new HorizonOutcomes(days.ToArray(), start.ToArray(), end.ToArray()), indices.ToImmutable(), kept.ToImmutable());
    }
}
