namespace VolCast.Core.Garch;

/// <summary>Horizon forecasts from a GARCH-type model: the average variance over the next days, and its annualized volatility.</summary>
/// <remarks>
/// Both forms decay the next-day variance towards the long-run variance V_L at the persistence φ.
/// <see cref="AverageVariance"/> is the one forecasters use: the exact mean of the daily expectations
/// E[σ²ₜ₊ₖ] = V_L + φ^(k−1)(σ²ₜ₊₁ − V_L) over k = 1..h. <see cref="AverageVarianceContinuous"/> is the
/// continuous-time approximation used in Hull's textbook tables; the two differ by about 0.01 volatility points at
/// ten days for a typical equity fit.
/// </remarks>
internal static class GarchHorizon
{
    /// <summary>Returns the expected variance k days after the day whose variance is given: V_L + φᵏ (σ² − V_L).</summary>
    /// <param name="variance">The variance of the starting day.</param>
    /// <param name="longRunVariance">V_L = ω / (1 − φ).</param>
    /// <param name="persistence">φ, in [0, 1).</param>
    /// <param name="days">k, at least zero.</param>
    /// <returns>The expected variance of day k.</returns>
    /// <exception cref="ArgumentOutOfRangeException">k is negative or φ is outside [0, 1).</exception>
    public static double ExpectedVariance(double variance, double longRunVariance, double persistence, int days)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(days);
        CheckPersistence(persistence);
        return longRunVariance + (Math.Pow(persistence, days) * (variance - longRunVariance));
    }

    /// <summary>Returns the mean of the expected daily variances over days 1..h after the forecast date.</summary>
    /// <param name="nextVariance">σ²ₜ₊₁, the variance of the first day of the horizon.</param>
    /// <param name="longRunVariance">V_L = ω / (1 − φ).</param>
    /// <param name="persistence">φ, in [0, 1).</param>
    /// <param name="horizonDays">h, at least one trading day.</param>
    /// <returns>V_L + (σ²ₜ₊₁ − V_L)(1 − φʰ) / (h(1 − φ)), the discrete daily average.</returns>
    /// <exception cref="ArgumentOutOfRangeException">h is below one or φ is outside [0, 1).</exception>
    public static double AverageVariance(double nextVariance, double longRunVariance, double persistence, int horizonDays)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(horizonDays, 1);
        CheckPersistence(persistence);
        if (persistence == 0)
        {
            return longRunVariance + ((nextVariance - longRunVariance) / horizonDays);
        }

        var weight = (1 - Math.Pow(persistence, horizonDays)) / (horizonDays * (1 - persistence));
        return longRunVariance + ((nextVariance - longRunVariance) * weight);
    }

    /// <summary>Returns Hull's continuous-time average variance over the next T days.</summary>
    /// <param name="initialVariance">V(0), the current daily variance.</param>
    /// <param name="longRunVariance">V_L = ω / (1 − φ).</param>
    /// <param name="persistence">φ, in (0, 1).</param>
    /// <param name="horizonDays">T in trading days, above zero.</param>
    /// <returns>V_L + (1 − e^(−aT)) / (aT) · (V(0) − V_L) with a = ln(1/φ).</returns>
    /// <exception cref="ArgumentOutOfRangeException">T is not above zero or φ is outside (0, 1).</exception>
    public static double AverageVarianceContinuous(double initialVariance, double longRunVariance, double persistence, double horizonDays)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(horizonDays);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(persistence);
        CheckPersistence(persistence);
        var aT = Math.Log(1 / persistence) * horizonDays;
        return longRunVariance + ((1 - Math.Exp(-aT)) / aT * (initialVariance - longRunVariance));
    }

    /// <summary>Annualizes a daily variance: √(A · variance).</summary>
    /// <param name="dailyVariance">Daily variance, at least zero.</param>
    /// <param name="annualizationFactor">A, trading days per year (252 by default).</param>
    /// <returns>The annualized volatility as a decimal.</returns>
    public static double AnnualizedVolatility(double dailyVariance, double annualizationFactor = 252) =>
        Math.Sqrt(annualizationFactor * dailyVariance);

    private static void CheckPersistence(double persistence)
    {
        if (!(persistence >= 0 && persistence < 1))
        {
            throw new ArgumentOutOfRangeException(nameof(persistence), persistence,
                FormattableString.Invariant($"persistence must be in [0, 1) for a horizon forecast, was {persistence}."));
        }
    }
}
