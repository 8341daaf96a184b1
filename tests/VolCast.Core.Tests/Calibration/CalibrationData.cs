using VolCast.Core.Calibration;

namespace VolCast.Core.Tests.Calibration;

/// <summary>Seeded simulated histories for the calibration tests.</summary>
internal static class CalibrationData
{
    /// <summary>
    /// Closes of a geometric Brownian motion with constant annualized volatility and zero drift in price
    /// (log drift −σ²/2 per year), so that N(d2) with r = q = 0 is the true probability of finishing above a strike.
    /// </summary>
    public static double[] Closes(int seed, int days, double annualVolatility, double annualization = 252.0)
    {
        var random = new Random(seed);
        var dailySd = annualVolatility / Math.Sqrt(annualization);
        var closes = new double[days];
        var logPrice = Math.Log(100.0);
        for (var t = 0; t < days; t++)
        {
            closes[t] = Math.Exp(logPrice);
            logPrice += (-0.5 * dailySd * dailySd) + (dailySd * Gaussian.Next(random));
        }

        return closes;
    }

    /// <summary>Pairs (S_t, S_{t+h}) for every date that has a close h days later.</summary>
    public static HorizonOutcomes Outcomes(double[] closes, int horizonDays)
    {
        var n = closes.Length - horizonDays;
        var start = new double[n];
        var end = new double[n];
        for (var t = 0; t < n; t++)
        {
            start[t] = closes[t];
            end[t] = closes[t + horizonDays];
        }

        return new HorizonOutcomes(horizonDays, start, end);
    }

    /// <summary>A forecaster that reports the same volatility every day.</summary>
    public static ForecasterVolatility Constant(string name, int count, double volatility)
    {
        var values = new double?[count];
        Array.Fill(values, volatility);
        return new ForecasterVolatility(name, values);
    }
}
