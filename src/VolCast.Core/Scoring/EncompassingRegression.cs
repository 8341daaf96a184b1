using System.Buffers;

namespace VolCast.Core.Scoring;

/// <summary>
/// The forecast-encompassing regression on variance, RV² = a + b IV² + c F² + e, with Newey-West (Bartlett, no
/// prewhitening, divisor T) standard errors (docs/methods.md#mincer-zarnowitz-and-encompassing): implied encompasses the forecast when c = 0.
/// </summary>
internal static class EncompassingRegression
{
    /// <summary>Fits the regression for h-day forecasts with the Newey-West lag h − 1.</summary>
    /// <param name="realized">Realized volatilities RV_t (decimal, annualized), zero or more.</param>
    /// <param name="implied">Implied volatilities IV_t aligned with <paramref name="realized"/>, above zero.</param>
    /// <param name="forecast">Forecast volatilities F_t aligned with <paramref name="realized"/>, above zero.</param>
    /// <param name="horizonDays">The forecast horizon h in trading days, at least 1.</param>
    /// <returns>The coefficients with HAC t tests.</returns>
    /// <exception cref="ArgumentException">The lengths differ, there are fewer than 4 observations, or the regressors are collinear.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A volatility is out of range, or h − 1 is not below T.</exception>
    public static EncompassingResult Fit(ReadOnlySpan<double> realized, ReadOnlySpan<double> implied, ReadOnlySpan<double> forecast, int horizonDays)
    {
        Preconditions.AtLeast(horizonDays, 1, "trading day");
        return FitWithLag(realized, implied, forecast, horizonDays - 1);
    }

    /// <summary>Fits the regression with a given Newey-West lag.</summary>
    /// <param name="realized">Realized volatilities RV_t (decimal, annualized), zero or more.</param>
    /// <param name="implied">Implied volatilities IV_t aligned with <paramref name="realized"/>, above zero.</param>
    /// <param name="forecast">Forecast volatilities F_t aligned with <paramref name="realized"/>, above zero.</param>
    /// <param name="lag">The Newey-West lag L, 0 to T − 1.</param>
    /// <returns>The coefficients with HAC t tests.</returns>
    /// <exception cref="ArgumentException">The lengths differ, there are fewer than 4 observations, or the regressors are collinear.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A volatility or the lag is out of range.</exception>
    public static EncompassingResult FitWithLag(ReadOnlySpan<double> realized, ReadOnlySpan<double> implied, ReadOnlySpan<double> forecast, int lag)
    {
        Preconditions.SameLength(implied.Length, realized.Length, nameof(realized), nameof(implied));
        Preconditions.SameLength(forecast.Length, realized.Length, nameof(realized), nameof(forecast));
        var n = realized.Length;
        Preconditions.CountAtLeast(n, 4, "for a three-coefficient regression", nameof(realized));
        var y = ArrayPool<double>.Shared.Rent(n);
        var x = ArrayPool<double>.Shared.Rent(3 * n);
        try
        {
            for (var t = 0; t < n; t++)
            {
                Preconditions.NonNegativeAt(realized[t], t, "volatility", nameof(realized));
                Preconditions.PositiveAt(implied[t], t, "volatility", nameof(implied));
                Preconditions.PositiveAt(forecast[t], t, "volatility", nameof(forecast));
                y[t] = realized[t] * realized[t];
                x[3 * t] = 1.0;
                x[(3 * t) + 1] = implied[t] * implied[t];
                x[(3 * t) + 2] = forecast[t] * forecast[t];
            }

            var fit = HacRegression.Fit(y.AsSpan(0, n), x.AsSpan(0, 3 * n), 3, lag);
            return new EncompassingResult(
                n, lag, fit.Coefficients[0], fit.Coefficients[1], fit.Coefficients[2],
                fit.StandardErrors[1], fit.StandardErrors[2],
                fit.TStatistic(1), fit.TPValue(1), fit.TStatistic(2), fit.TPValue(2),
                fit.RSquared, fit);
        }
        finally
        {
            ArrayPool<double>.Shared.Return(y);
            ArrayPool<double>.Shared.Return(x);
        }
    }
}
