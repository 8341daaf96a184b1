namespace VolCast.Core.Options;

/// <summary>Black-76 prices and sensitivities of European options on a forward (or futures) price.</summary>
/// <remarks>
/// c = e^{−rT} [F N(d₁) − K N(d₂)] and p = e^{−rT} [K N(−d₂) − F N(−d₁)], with d₁ = (ln(F/K) + σ²T/2) / (σ√T)
/// and d₂ = d₁ − σ√T. With F = S e^{(r − q)T} these are the Black-Scholes-Merton prices.
/// When σ√T is zero the option is worth its discounted intrinsic value on the forward.
/// </remarks>
internal static class Black76
{
    /// <summary>The price of a European option on a forward.</summary>
    /// <param name="type">Call or put.</param>
    /// <param name="forward">Forward price F for delivery at expiry, above zero.</param>
    /// <param name="strike">Strike K, above zero.</param>
    /// <param name="yearsToExpiry">T in years, at or above zero.</param>
    /// <param name="volatility">Annualized volatility σ (decimal), at or above zero.</param>
    /// <param name="rate">Continuously compounded rate r used to discount the payoff.</param>
    /// <returns>The option price, paid today.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is not finite or out of its range.</exception>
    public static double Price(OptionType type, double forward, double strike, double yearsToExpiry, double volatility, double rate)
    {
        CheckArguments(forward, nameof(forward), strike, yearsToExpiry, volatility, rate);
        var discount = Math.Exp(-rate * yearsToExpiry);
        var stdDev = volatility * Math.Sqrt(yearsToExpiry);
        if (stdDev == 0)
        {
            return discount * (type == OptionType.Call ? Math.Max(forward - strike, 0) : Math.Max(strike - forward, 0));
        }

        var d1 = (Math.Log(forward / strike) / stdDev) + (0.5 * stdDev);
        var d2 = d1 - stdDev;
        return type == OptionType.Call
            ? discount * ((forward * StandardNormal.Cdf(d1)) - (strike * StandardNormal.Cdf(d2)))
            : discount * ((strike * StandardNormal.Cdf(-d2)) - (forward * StandardNormal.Cdf(-d1)));
    }

    /// <summary>The sensitivity of the price to the forward, ∂V/∂F.</summary>
    /// <param name="type">Call or put.</param>
    /// <param name="forward">Forward price F, above zero.</param>
    /// <param name="strike">Strike K, above zero.</param>
    /// <param name="yearsToExpiry">T in years, above zero.</param>
    /// <param name="volatility">Annualized volatility σ, above zero.</param>
    /// <param name="rate">Continuously compounded discount rate r.</param>
    /// <returns>e^{−rT} N(d₁) for a call, −e^{−rT} N(−d₁) for a put.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is not finite or out of its range, or σ√T is zero.</exception>
    public static double Delta(OptionType type, double forward, double strike, double yearsToExpiry, double volatility, double rate)
    {
        var d1 = D1(forward, strike, yearsToExpiry, volatility, rate);
        var discount = Math.Exp(-rate * yearsToExpiry);
        return type == OptionType.Call ? discount * StandardNormal.Cdf(d1) : -discount * StandardNormal.Cdf(-d1);
    }

    /// <summary>The sensitivity of the price to the volatility, ∂V/∂σ, per unit of σ.</summary>
    /// <param name="forward">Forward price F, above zero.</param>
    /// <param name="strike">Strike K, above zero.</param>
    /// <param name="yearsToExpiry">T in years, above zero.</param>
    /// <param name="volatility">Annualized volatility σ, above zero.</param>
    /// <param name="rate">Continuously compounded discount rate r.</param>
    /// <returns>e^{−rT} F φ(d₁) √T, the same for calls and puts.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is not finite or out of its range, or σ√T is zero.</exception>
    public static double Vega(double forward, double strike, double yearsToExpiry, double volatility, double rate)
    {
        var d1 = D1(forward, strike, yearsToExpiry, volatility, rate);
        return Math.Exp(-rate * yearsToExpiry) * forward * StandardNormal.Pdf(d1) * Math.Sqrt(yearsToExpiry);
    }

    private static double D1(double forward, double strike, double yearsToExpiry, double volatility, double rate)
    {
        CheckArguments(forward, nameof(forward), strike, yearsToExpiry, volatility, rate);
        var stdDev = volatility * Math.Sqrt(yearsToExpiry);
        Preconditions.Positive(stdDev, paramName: "volatility * sqrt(yearsToExpiry)");
        return (Math.Log(forward / strike) / stdDev) + (0.5 * stdDev);
    }

    /// <summary>Checks the arguments every pricing formula shares: a positive underlying and strike, a time and a
    /// volatility of zero or more, a finite rate.</summary>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of range.</exception>
    internal static void CheckArguments(double underlying, string underlyingName, double strike, double yearsToExpiry, double volatility, double rate)
    {
        Preconditions.Positive(underlying, "price", underlyingName);
        Preconditions.Positive(strike, "price");
        Preconditions.NonNegative(yearsToExpiry);
        Preconditions.NonNegative(volatility);
        Preconditions.Finite(rate);
    }
}
