namespace VolCast.Core.Options;

/// <summary>
/// Black-Scholes-Merton prices and sensitivities of European options on an underlying that pays a
/// continuous dividend yield.
/// </summary>
/// <remarks>
/// c = S e^{−qT} N(d₁) − K e^{−rT} N(d₂) and p = K e^{−rT} N(−d₂) − S e^{−qT} N(−d₁), with
/// d₁ = (ln(S/K) + (r − q + σ²/2)T) / (σ√T) and d₂ = d₁ − σ√T. Rates and yields are continuously compounded
/// decimals per year; T is in years (ACT/365, see <see cref="DayCount"/>); σ is annualized (0.20 = 20%).
/// When σ√T is zero the option is worth its discounted forward intrinsic value.
/// </remarks>
internal static class BlackScholesMerton
{
    /// <summary>The price of a European option.</summary>
    /// <param name="type">Call or put.</param>
    /// <param name="spot">Underlying price S, above zero.</param>
    /// <param name="strike">Strike K, above zero.</param>
    /// <param name="yearsToExpiry">T in years, at or above zero.</param>
    /// <param name="volatility">Annualized volatility σ (decimal), at or above zero.</param>
    /// <param name="rate">Continuously compounded risk-free rate r.</param>
    /// <param name="dividendYield">Continuous dividend yield q.</param>
    /// <returns>The option price in the units of <paramref name="spot"/>.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is not finite or out of its range.</exception>
    public static double Price(OptionType type, double spot, double strike, double yearsToExpiry, double volatility, double rate, double dividendYield)
    {
        Black76.CheckArguments(spot, nameof(spot), strike, yearsToExpiry, volatility, rate);
        Preconditions.Finite(dividendYield);
        var spotDiscounted = spot * Math.Exp(-dividendYield * yearsToExpiry);
        var strikeDiscounted = strike * Math.Exp(-rate * yearsToExpiry);
        var stdDev = volatility * Math.Sqrt(yearsToExpiry);
        if (stdDev == 0)
        {
            return type == OptionType.Call
                ? Math.Max(spotDiscounted - strikeDiscounted, 0)
                : Math.Max(strikeDiscounted - spotDiscounted, 0);
        }

        var d1 = (Math.Log(spot / strike) + ((rate - dividendYield + (0.5 * volatility * volatility)) * yearsToExpiry)) / stdDev;
        var d2 = d1 - stdDev;
        return type == OptionType.Call
            ? (spotDiscounted * StandardNormal.Cdf(d1)) - (strikeDiscounted * StandardNormal.Cdf(d2))
            : (strikeDiscounted * StandardNormal.Cdf(-d2)) - (spotDiscounted * StandardNormal.Cdf(-d1));
    }

    /// <summary>The sensitivity of the price to the underlying price, ∂V/∂S.</summary>
    /// <param name="type">Call or put.</param>
    /// <param name="spot">Underlying price S, above zero.</param>
    /// <param name="strike">Strike K, above zero.</param>
    /// <param name="yearsToExpiry">T in years, above zero.</param>
    /// <param name="volatility">Annualized volatility σ, above zero.</param>
    /// <param name="rate">Continuously compounded risk-free rate r.</param>
    /// <param name="dividendYield">Continuous dividend yield q.</param>
    /// <returns>e^{−qT} N(d₁) for a call, −e^{−qT} N(−d₁) for a put.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is not finite or out of its range, or σ√T is zero.</exception>
    public static double Delta(OptionType type, double spot, double strike, double yearsToExpiry, double volatility, double rate, double dividendYield)
    {
        var d1 = D1(spot, strike, yearsToExpiry, volatility, rate, dividendYield);
        var carry = Math.Exp(-dividendYield * yearsToExpiry);
        return type == OptionType.Call ? carry * StandardNormal.Cdf(d1) : -carry * StandardNormal.Cdf(-d1);
    }

    /// <summary>The sensitivity of the price to the volatility, ∂V/∂σ, per unit of σ (not per point).</summary>
    /// <param name="spot">Underlying price S, above zero.</param>
    /// <param name="strike">Strike K, above zero.</param>
    /// <param name="yearsToExpiry">T in years, above zero.</param>
    /// <param name="volatility">Annualized volatility σ, above zero.</param>
    /// <param name="rate">Continuously compounded risk-free rate r.</param>
    /// <param name="dividendYield">Continuous dividend yield q.</param>
    /// <returns>S e^{−qT} φ(d₁) √T, the same for calls and puts.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is not finite or out of its range, or σ√T is zero.</exception>
    public static double Vega(double spot, double strike, double yearsToExpiry, double volatility, double rate, double dividendYield)
    {
        var d1 = D1(spot, strike, yearsToExpiry, volatility, rate, dividendYield);
        return spot * Math.Exp(-dividendYield * yearsToExpiry) * StandardNormal.Pdf(d1) * Math.Sqrt(yearsToExpiry);
    }

    /// <summary>The forward price of the underlying, F = S e^{(r − q)T}.</summary>
    /// <param name="spot">Underlying price S, above zero.</param>
    /// <param name="yearsToExpiry">T in years, at or above zero.</param>
    /// <param name="rate">Continuously compounded risk-free rate r.</param>
    /// <param name="dividendYield">Continuous dividend yield q.</param>
    /// <returns>The forward price for delivery at T.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is not finite or out of its range.</exception>
    public static double Forward(double spot, double yearsToExpiry, double rate, double dividendYield)
    {
        Preconditions.Positive(spot);
        Preconditions.NonNegative(yearsToExpiry);
        Preconditions.Finite(rate);
        Preconditions.Finite(dividendYield);
        return spot * Math.Exp((rate - dividendYield) * yearsToExpiry);
    }

    private static double D1(double spot, double strike, double yearsToExpiry, double volatility, double rate, double dividendYield)
    {
        Black76.CheckArguments(spot, nameof(spot), strike, yearsToExpiry, volatility, rate);
        Preconditions.Finite(dividendYield);
        var stdDev = volatility * Math.Sqrt(yearsToExpiry);
        Preconditions.Positive(stdDev, paramName: "volatility * sqrt(yearsToExpiry)");
        return (Math.Log(spot / strike) + ((rate - dividendYield + (0.5 * volatility * volatility)) * yearsToExpiry)) / stdDev;
    }
}
