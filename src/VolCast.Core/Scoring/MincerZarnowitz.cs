using System.Buffers;

namespace VolCast.Core.Scoring;

/// <summary>
/// The Mincer-Zarnowitz regression on the variance scale, RV² = a + b F² + e, with Newey-West (Bartlett, no
/// prewhitening, divisor T) standard errors and the Wald χ²(2) test of a = 0, b = 1 (docs/methods.md#mincer-zarnowitz-and-encompassing).
/// </summary>
/// <remarks>
/// The variance scale is used because a log-scale regression is biased by Jensen's inequality. For overlapping
/// h-day targets the errors follow an MA(h − 1), hence the default lag h − 1.
/// </remarks>
public static class MincerZarnowitz
{
    /// <summary>Fits the regression for h-day forecasts with the Newey-West lag h − 1.</summary>
    /// <param name="realized">Realized volatilities RV_t (decimal, annualized), zero or more.</param>
    /// <param name="forecast">Forecast volatilities F_t aligned with <paramref name="realized"/>, above zero.</param>
    /// <param name="horizonDays">The forecast horizon h in trading days, at least 1.</param>
    /// <returns>The coefficients, HAC standard errors, Wald test and R².</returns>
    /// <exception cref="ArgumentException">The lengths differ, there are fewer than 3 observations, the forecast is constant, or RV² is constant.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A volatility is out of range, or h − 1 is not below T.</exception>
    public static MincerZarnowitzResult Fit(ReadOnlySpan<double> realized, ReadOnlySpan<double> forecast, int horizonDays)
    {
        Preconditions.AtLeast(horizonDays, 1, "trading day");
        return FitWithLag(realized, forecast, horizonDays - 1);
    }

    /// <summary>Fits the regression with a given Newey-West lag.</summary>
    /// <param name="realized">Realized volatilities RV_t (decimal, annualized), zero or more.</param>
    /// <param name="forecast">Forecast volatilities F_t aligned with <paramref name="realized"/>, above zero.</param>
    /// <param name="lag">The Newey-West lag L, 0 to T − 1.</param>
    /// <returns>The coefficients, HAC standard errors, Wald test and R².</returns>
    /// <exception cref="ArgumentException">The lengths differ, there are fewer than 3 observations, the forecast is constant, or RV² is constant.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A volatility or the lag is out of range.</exception>
    public static MincerZarnowitzResult FitWithLag(ReadOnlySpan<double> realized, ReadOnlySpan<double> forecast, int lag)
    {
        Preconditions.SameLength(forecast.Length, realized.Length, nameof(realized), nameof(forecast));
        var n = realized.Length;
        Preconditions.CountAtLeast(n, 3, "for a two-coefficient regression", nameof(realized));
        var y = ArrayPool<double>.Shared.Rent(n);
        var x = ArrayPool<double>.Shared.Rent(2 * n);
        try
        {
            for (var t = 0; t < n; t++)
            {
                Preconditions.NonNegativeAt(realized[t], t, "volatility", nameof(realized));
                Preconditions.PositiveAt(forecast[t], t, "volatility", nameof(forecast));
                y[t] = realized[t] * realized[t];
                x[2 * t] = 1.0;
                x[(2 * t) + 1] = forecast[t] * forecast[t];
            }

            var fit = HacRegression.Fit(y.AsSpan(0, n), x.AsSpan(0, 2 * n), 2, lag);
            var wald = fit.Wald([0, 1], [0.0, 1.0]);
            return new MincerZarnowitzResult(
                n, lag, fit.Coefficients[0], fit.Coefficients[1], fit.StandardErrors[0], fit.StandardErrors[1],
                wald.Statistic, wald.PValue, fit.RSquared, fit);
        }
        finally
        {
            ArrayPool<double>.Shared.Return(y);
            ArrayPool<double>.Shared.Return(x);
        }
    }
}
