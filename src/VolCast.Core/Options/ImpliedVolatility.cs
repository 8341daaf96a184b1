namespace VolCast.Core.Options;

/// <summary>
/// The implied volatility of a European option price: the σ at which Black-Scholes-Merton (or Black-76)
/// reprices it.
/// </summary>
/// <remarks>
/// <para>The price is first reduced to its time value over the discounted forward intrinsic value, which is
/// the price of the out-of-the-money option at the same strike (put-call parity), and normalized; the root is
/// then found in σ√T by safeguarded Newton inside a maintained bracket with bisection as the fallback
/// (see the remarks on the internal normalized solver). Working on the out-of-the-money value keeps deep
/// in-the-money prices from losing the time value to rounding more than the price itself already does.</para>
/// <para>Failures are typed: an expiry with no time left, a non-positive or non-finite input, a price at or
/// below intrinsic or at or above the upper bound, and a vega so small that four units in the last place of
/// the price would move σ by more than <see cref="VolatilityResolution"/>. None of them yields a number.</para>
/// </remarks>
internal static class ImpliedVolatility
{
    /// <summary>The largest change in σ that a rounding-level change of the price may cause before the
    /// solve reports <see cref="ImpliedVolatilityStatus.VegaTooSmall"/>.</summary>
    public const double VolatilityResolution = 1e-6;

    /// <summary>The gap between 1 and the next larger double, 2⁻⁵².</summary>
    private const double MachineEpsilon = 2.220446049250313e-16;

    /// <summary>The implied volatility of a price under Black-Scholes-Merton.</summary>
    /// <param name="type">Call or put.</param>
    /// <param name="price">The option price, in the units of <paramref name="spot"/>.</param>
    /// <param name="spot">Underlying price S.</param>
    /// <param name="strike">Strike K.</param>
    /// <param name="yearsToExpiry">T in years (ACT/365); at or below zero gives <see cref="ImpliedVolatilityStatus.Expired"/>.</param>
    /// <param name="rate">Continuously compounded risk-free rate r.</param>
    /// <param name="dividendYield">Continuous dividend yield q.</param>
    /// <returns>The volatility, or the reason there is none.</returns>
    public static ImpliedVolatilityResult FromBlackScholesMerton(
        OptionType type, double price, double spot, double strike, double yearsToExpiry, double rate, double dividendYield)
    {
        if (!double.IsFinite(spot) || spot <= 0 || !double.IsFinite(rate) || !double.IsFinite(dividendYield))
        {
            return ImpliedVolatilityResult.Failed(ImpliedVolatilityStatus.NonPositiveInput);
        }

        var forward = yearsToExpiry > 0 && double.IsFinite(yearsToExpiry) ? spot * Math.Exp((rate - dividendYield) * yearsToExpiry) : spot;
        return FromBlack76(type, price, forward, strike, yearsToExpiry, rate);
    }

    /// <summary>The implied volatility of a price under Black-76 on a forward.</summary>
    /// <param name="type">Call or put.</param>
    /// <param name="price">The option price, paid today.</param>
    /// <param name="forward">Forward price F for delivery at expiry.</param>
    /// <param name="strike">Strike K.</param>
    /// <param name="yearsToExpiry">T in years (ACT/365); at or below zero gives <see cref="ImpliedVolatilityStatus.Expired"/>.</param>
    /// <param name="rate">Continuously compounded rate r used to discount the payoff.</param>
    /// <returns>The volatility, or the reason there is none.</returns>
    public static ImpliedVolatilityResult FromBlack76(OptionType type, double price, double forward, double strike, double yearsToExpiry, double rate)
    {
        if (!double.IsFinite(price) || price <= 0 || !double.IsFinite(forward) || forward <= 0
            || !double.IsFinite(strike) || strike <= 0 || !double.IsFinite(rate) || double.IsNaN(yearsToExpiry))
        {
            return ImpliedVolatilityResult.Failed(ImpliedVolatilityStatus.NonPositiveInput);
        }

        if (yearsToExpiry <= 0)
        {
            return ImpliedVolatilityResult.Failed(ImpliedVolatilityStatus.Expired);
        }

        if (double.IsPositiveInfinity(yearsToExpiry))
        {
            return ImpliedVolatilityResult.Failed(ImpliedVolatilityStatus.NonPositiveInput);
        }

        var undiscounted = price * Math.Exp(rate * yearsToExpiry);
        var intrinsic = type == OptionType.Call ? Math.Max(forward - strike, 0) : Math.Max(strike - forward, 0);
        var timeValue = undiscounted - intrinsic;
        var scale = Math.Sqrt(forward) * Math.Sqrt(strike);
        var beta = timeValue / scale;
        var x = -Math.Abs(Math.Log(forward / strike));
        if (!(beta > 0))
        {
            return ImpliedVolatilityResult.Failed(ImpliedVolatilityStatus.BelowIntrinsic);
        }

        if (beta >= Math.Exp(0.5 * x))
        {
            return ImpliedVolatilityResult.Failed(ImpliedVolatilityStatus.AboveUpperBound);
        }

        var s = NormalizedBlack.Solve(x, beta, out var evaluations);
        if (s is not double stdDev)
        {
            return ImpliedVolatilityResult.Failed(ImpliedVolatilityStatus.NotConverged, evaluations);
        }

        var sqrtT = Math.Sqrt(yearsToExpiry);

        // The price is known to a few units in its last place; σ must not be more sensitive than that allows.
        var priceNoise = 4.0 * MachineEpsilon * (undiscounted / scale);
        var vega = NormalizedBlack.Vega(x, stdDev);
        if (!(priceNoise <= VolatilityResolution * sqrtT * vega))
        {
            return ImpliedVolatilityResult.Failed(ImpliedVolatilityStatus.VegaTooSmall, evaluations);
        }

        return ImpliedVolatilityResult.Solved(stdDev / sqrtT, evaluations);
    }
}
