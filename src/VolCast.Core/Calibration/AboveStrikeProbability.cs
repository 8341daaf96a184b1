using VolCast.Core.Options;

namespace VolCast.Core.Calibration;

/// <summary>
/// The lognormal probability that the underlying finishes above a strike, N(d2), from a volatility number.
/// </summary>
/// <remarks>
/// d2 = [ln(S/K) + (r − q − σ²/2)τ] / (σ√τ) and P(S_τ &gt; K) = N(d2). This is a risk-neutral-style probability: it
/// assumes the log price moves as a Brownian motion with constant volatility σ and drift r − q per year (the
/// forward's drift), no jumps, and nothing about a risk premium. With r = q = 0 (the default) the price is a
/// martingale and the median of S_τ sits at S·e^{−σ²τ/2}, slightly below today's close. It is the number a trader
/// reads off an option screen as the "probability of finishing in the money" for a call.
/// </remarks>
internal static class AboveStrikeProbability
{
    /// <summary>d2 of Black-Scholes-Merton.</summary>
    /// <param name="spot">S, above zero.</param>
    /// <param name="strike">K, above zero.</param>
    /// <param name="volatility">σ per year, above zero.</param>
    /// <param name="timeYears">τ in years, above zero.</param>
    /// <param name="rate">r per year, continuously compounded.</param>
    /// <param name="dividendYield">q per year, continuous.</param>
    /// <returns>d2.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An input is not finite, or S, K, σ or τ is not above zero.</exception>
    public static double D2(double spot, double strike, double volatility, double timeYears, double rate = 0, double dividendYield = 0)
    {
        Preconditions.Positive(spot);
        Preconditions.Positive(strike);
        Preconditions.Positive(volatility);
        Preconditions.Positive(timeYears);
        Preconditions.Finite(rate);
        Preconditions.Finite(dividendYield);
        var sd = volatility * Math.Sqrt(timeYears);
        return (Math.Log(spot / strike) + ((rate - dividendYield) * timeYears)) / sd - (0.5 * sd);
    }

    /// <summary>P(S_τ &gt; K) = N(d2) under the lognormal model with drift r − q.</summary>
    /// <param name="spot">S, above zero.</param>
    /// <param name="strike">K, above zero.</param>
    /// <param name="volatility">σ per year, above zero.</param>
    /// <param name="timeYears">τ in years, above zero.</param>
    /// <param name="rate">r per year, continuously compounded.</param>
    /// <param name="dividendYield">q per year, continuous.</param>
    /// <returns>N(d2), in [0, 1].</returns>
    /// <exception cref="ArgumentOutOfRangeException">An input is not finite, or S, K, σ or τ is not above zero.</exception>
    public static double Compute(double spot, double strike, double volatility, double timeYears, double rate = 0, double dividendYield = 0)
        => StandardNormal.Cdf(D2(spot, strike, volatility, timeYears, rate, dividendYield));
}
