namespace VolCast.Core.Scoring;

/// <summary>
/// Per-observation and mean losses of volatility forecasts against realized volatility (docs/methods.md#losses,
/// Patton 2011). Inputs are aligned spans of annualized volatilities as decimals: realized RV_t and forecast F_t.
/// </summary>
/// <remarks>
/// Conventions: errors are F − RV (positive = over-forecast); variance losses use F² and RV² (annualized
/// variance); QLIKE is the normalized form RV²/F² − ln(RV²/F²) − 1 (form A of the reference sheet), which is
/// at least 0 and 0 only at F = RV. Forecasts must be finite and above zero; realized values must be finite and
/// at least zero, and above zero for normalized QLIKE (whose logarithm is undefined at RV = 0).
/// </remarks>
public static class Losses
{
    private const string QlikeNeedsPositiveRealized =
        "for normalized QLIKE (ln(RV^2/F^2) is undefined at zero; use the unnormalized form for differentials)";

    /// <summary>Gets the forecast error F − RV in volatility points (decimal).</summary>
    /// <param name="realized">Realized volatility RV (decimal, annualized).</param>
    /// <param name="forecast">Forecast volatility F (decimal, annualized).</param>
    /// <returns>F − RV.</returns>
    public static double Error(double realized, double forecast) => forecast - realized;

    /// <summary>Gets the squared error on annualized variance, (F² − RV²)².</summary>
    /// <param name="realized">Realized volatility RV (decimal, annualized).</param>
    /// <param name="forecast">Forecast volatility F (decimal, annualized).</param>
    /// <returns>(F² − RV²)².</returns>
    public static double SquaredErrorVariance(double realized, double forecast)
    {
        var e = (forecast * forecast) - (realized * realized);
        return e * e;
    }

    /// <summary>Gets the normalized QLIKE on variance, RV²/F² − ln(RV²/F²) − 1.</summary>
    /// <param name="realized">Realized volatility RV (decimal, annualized), above zero.</param>
    /// <param name="forecast">Forecast volatility F (decimal, annualized), above zero.</param>
    /// <returns>The loss, at least 0 and 0 exactly when F = RV.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A volatility is not finite or not above zero.</exception>
    public static double Qlike(double realized, double forecast)
    {
        Preconditions.PositiveAt(realized, 0, "volatility", nameof(realized), QlikeNeedsPositiveRealized);
        Preconditions.PositiveAt(forecast, 0, "volatility", nameof(forecast));
        return QlikeUnchecked(realized, forecast);
    }

    /// <summary>Gets the unnormalized QLIKE on variance, ln F² + RV²/F² (Patton 2011's form).</summary>
    /// <param name="realized">Realized volatility RV (decimal, annualized), zero or more.</param>
    /// <param name="forecast">Forecast volatility F (decimal, annualized), above zero.</param>
    /// <returns>The loss; it differs from <see cref="Qlike"/> by ln RV² + 1, a term free of the forecast.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A volatility is not finite, or the forecast is not above zero, or realized is negative.</exception>
    public static double QlikeUnnormalized(double realized, double forecast)
    {
        Preconditions.NonNegativeAt(realized, 0, "volatility", nameof(realized));
        Preconditions.PositiveAt(forecast, 0, "volatility", nameof(forecast));
        var f2 = forecast * forecast;
        return Math.Log(f2) + (realized * realized / f2);
    }

    /// <summary>Writes the per-observation loss of each forecast into <paramref name="destination"/>.</summary>
    /// <param name="loss">Which loss to compute.</param>
    /// <param name="realized">Realized volatilities RV_t (decimal, annualized).</param>
    /// <param name="forecast">Forecast volatilities F_t, aligned with <paramref name="realized"/>.</param>
    /// <param name="destination">Receives one loss per observation; same length as the inputs.</param>
    /// <exception cref="ArgumentException">The lengths differ.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A volatility is out of range (see the remarks of <see cref="Losses"/>),
    /// or <paramref name="loss"/> is not a defined value.</exception>
    public static void Compute(LossFunction loss, ReadOnlySpan<double> realized, ReadOnlySpan<double> forecast, Span<double> destination)
    {
        Preconditions.SameLength(forecast.Length, realized.Length, nameof(realized), nameof(forecast));
        Preconditions.SameLength(destination.Length, realized.Length, nameof(realized), nameof(destination));
        CheckInputs(realized, forecast, loss == LossFunction.Qlike);
        switch (loss)
        {
            case LossFunction.SquaredErrorVariance:
                for (var t = 0; t < realized.Length; t++)
                {
                    destination[t] = SquaredErrorVariance(realized[t], forecast[t]);
                }

                break;
            case LossFunction.Qlike:
                for (var t = 0; t < realized.Length; t++)
                {
                    destination[t] = QlikeUnchecked(realized[t], forecast[t]);
                }

                break;
            case LossFunction.QlikeUnnormalized:
                for (var t = 0; t < realized.Length; t++)
                {
                    var f2 = forecast[t] * forecast[t];
                    destination[t] = Math.Log(f2) + (realized[t] * realized[t] / f2);
                }

                break;
            case LossFunction.AbsoluteErrorVolatility:
                for (var t = 0; t < realized.Length; t++)
                {
                    destination[t] = Math.Abs(forecast[t] - realized[t]);
                }

                break;
            case LossFunction.SquaredErrorVolatility:
                for (var t = 0; t < realized.Length; t++)
                {
                    var e = forecast[t] - realized[t];
                    destination[t] = e * e;
                }

                break;
            default:
                throw new ArgumentOutOfRangeException(nameof(loss), loss, "Unknown loss function.");
        }
    }

    /// <summary>Gets the per-observation losses of each forecast as a new array.</summary>
    /// <param name="loss">Which loss to compute.</param>
    /// <param name="realized">Realized volatilities RV_t (decimal, annualized).</param>
    /// <param name="forecast">Forecast volatilities F_t, aligned with <paramref name="realized"/>.</param>
    /// <returns>One loss per observation.</returns>
    /// <exception cref="ArgumentException">The lengths differ.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A volatility is out of range.</exception>
    public static double[] Compute(LossFunction loss, ReadOnlySpan<double> realized, ReadOnlySpan<double> forecast)
    {
        var result = new double[realized.Length];
        Compute(loss, realized, forecast, result);
        return result;
    }

    /// <summary>Gets the mean losses (bias, MAE, RMSE, MSE on variance, normalized QLIKE) of one forecaster.</summary>
    /// <param name="realized">Realized volatilities RV_t (decimal, annualized), each above zero.</param>
    /// <param name="forecast">Forecast volatilities F_t, aligned with <paramref name="realized"/>, each above zero.</param>
    /// <returns>The mean losses.</returns>
    /// <exception cref="ArgumentException">The lengths differ or the series are empty.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A volatility is not finite or not above zero.</exception>
    public static LossSummary Summarize(ReadOnlySpan<double> realized, ReadOnlySpan<double> forecast)
    {
        Preconditions.SameLength(forecast.Length, realized.Length, nameof(realized), nameof(forecast));
        Preconditions.CountAtLeast(realized.Length, 1, "to score a forecast", nameof(realized));
        CheckInputs(realized, forecast, requirePositiveRealized: true);
        double bias = 0, abs = 0, sq = 0, mse = 0, qlike = 0;
        for (var t = 0; t < realized.Length; t++)
        {
            var e = forecast[t] - realized[t];
            bias += e;
            abs += Math.Abs(e);
            sq += e * e;
            mse += SquaredErrorVariance(realized[t], forecast[t]);
            qlike += QlikeUnchecked(realized[t], forecast[t]);
        }

        double n = realized.Length;
        return new LossSummary(realized.Length, bias / n, abs / n, Math.Sqrt(sq / n), mse / n, qlike / n);
    }

    private static double QlikeUnchecked(double realized, double forecast)
    {
        var x = realized * realized / (forecast * forecast);
        return x - Math.Log(x) - 1.0;
    }

    private static void CheckInputs(ReadOnlySpan<double> realized, ReadOnlySpan<double> forecast, bool requirePositiveRealized)
    {
        for (var t = 0; t < realized.Length; t++)
        {
            if (requirePositiveRealized)
            {
                Preconditions.PositiveAt(realized[t], t, "volatility", nameof(realized), QlikeNeedsPositiveRealized);
            }
            else
            {
                Preconditions.NonNegativeAt(realized[t], t, "volatility", nameof(realized));
            }

            Preconditions.PositiveAt(forecast[t], t, "volatility", nameof(forecast));
        }
    }
}
