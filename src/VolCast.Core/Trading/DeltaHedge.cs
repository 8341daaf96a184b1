using System.Runtime.CompilerServices;
using VolCast.Core.Options;

namespace VolCast.Core.Trading;

/// <summary>
/// The delta hedge of one long European option position along one price path, the accounting shared by the rule's
/// straddles and the textbook checks.
/// </summary>
/// <remarks>
/// The position is bought at entry (index 0) at the pricing volatility; at every point t = 0 … m − 1 it holds −Δ_t units
/// of the underlying, Δ_t the Black-Scholes-Merton delta at the hedge volatility and the remaining time T − y_t; it
/// settles at index m with its payoff. The hedge of step t earns −Δ_t (S_{t+1} − S_t e^{(r−q)(y_{t+1} − y_t)}) (the
/// underlying financed at r and paying the yield q), and every cash flow is carried to expiry at r.
/// </remarks>
internal static class DeltaHedge
{
    /// <summary>Runs the hedge; when the path spans are not empty, also fills the position's value at each point.</summary>
    /// <param name="option">Call or straddle.</param>
    /// <param name="spots">S_0 … S_m, m at least 1.</param>
    /// <param name="years">y_0 = 0 … y_m = T, strictly increasing, in years.</param>
    /// <param name="strike">The strike.</param>
    /// <param name="priceVolatility">The volatility of the premium (and of the entry-vol marks).</param>
    /// <param name="hedgeVolatility">The volatility of the deltas.</param>
    /// <param name="rate">r, continuous.</param>
    /// <param name="dividendYield">q, continuous.</param>
    /// <param name="markVolatility">Volatility at which to mark the option at each point 0 … m − 1 (empty: no paths).</param>
    /// <param name="markValue">Out: the long position's value at each point 0 … m at the mark volatility, carried to expiry, the premium netted (value 0 at entry when marked at the pricing volatility; the gross P&amp;L at m).</param>
    /// <param name="entryVolValue">Out: the same marked at the pricing volatility (the gamma-against-theta path).</param>
    /// <param name="notional">Out: the hedge notional traded up to and including each point, carried to expiry.</param>
    /// <returns>The outcome.</returns>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static HedgeOutcome Run(
        HedgedOption option,
        ReadOnlySpan<double> spots,
        ReadOnlySpan<double> years,
        double strike,
        double priceVolatility,
        double hedgeVolatility,
        double rate,
        double dividendYield,
        ReadOnlySpan<double> markVolatility,
        Span<double> markValue,
        Span<double> entryVolValue,
        Span<double> notional)
    {
        var m = spots.Length - 1;
        var expiry = years[m];
        var carry = Math.Exp(rate * expiry);
        var premium = Value(option, spots[0], strike, expiry, priceVolatility, rate, dividendYield);
        var vega = BlackScholesMerton.Vega(spots[0], strike, expiry, priceVolatility, rate, dividendYield) * (option == HedgedOption.Straddle ? 2 : 1);
        var paths = !markVolatility.IsEmpty;
        double hedgePnl = 0;
        double traded = 0;
        double previousDelta = 0;
        double entryDelta = 0;
        for (var t = 0; t < m; t++)
        {
            var remaining = expiry - years[t];
            var toExpiry = Math.Exp(rate * remaining);
            double delta;
            var atPriceVolatility = 0.0;
            var needValue = paths && t > 0;
            if (option == HedgedOption.Straddle)
            {
                var value = Straddle(spots[t], strike, remaining, hedgeVolatility, rate, dividendYield, out delta);
                if (hedgeVolatility == priceVolatility)
                {
                    atPriceVolatility = value;
                }
                else if (needValue)
                {
                    atPriceVolatility = Straddle(spots[t], strike, remaining, priceVolatility, rate, dividendYield, out _);
                }
            }
            else
            {
                delta = Delta(option, spots[t], strike, remaining, hedgeVolatility, rate, dividendYield);
                atPriceVolatility = needValue ? Value(option, spots[t], strike, remaining, priceVolatility, rate, dividendYield) : 0;
            }

            if (t == 0)
            {
                entryDelta = delta;
                atPriceVolatility = premium;
            }

            traded += Math.Abs(delta - previousDelta) * spots[t] * toExpiry;
            if (paths)
            {
                var owed = (premium * carry) - hedgePnl;
                entryVolValue[t] = (atPriceVolatility * toExpiry) - owed;
                markValue[t] = markVolatility[t] == priceVolatility
                    ? entryVolValue[t]
                    : (Mark(option, spots[t], strike, remaining, markVolatility[t], rate, dividendYield) * toExpiry) - owed;
                notional[t] = traded;
            }

            var step = years[t + 1] - years[t];
            var move = spots[t + 1] - (spots[t] * Math.Exp((rate - dividendYield) * step));
            hedgePnl += -delta * move * Math.Exp(rate * (expiry - years[t + 1]));
            previousDelta = delta;
        }

        var payoff = option == HedgedOption.Straddle ? Math.Abs(spots[m] - strike) : Math.Max(spots[m] - strike, 0);
        traded += Math.Abs(previousDelta) * spots[m];
        if (paths)
        {
            markValue[m] = payoff - (premium * carry) + hedgePnl;
            entryVolValue[m] = markValue[m];
            notional[m] = traded;
        }

        return new HedgeOutcome(premium, vega, entryDelta, hedgePnl, payoff, traded, carry);
    }

    /// <summary>
    /// The straddle's value and delta from one d₁: c + p = S e^{−qτ}(2N(d₁) − 1) − K e^{−rτ}(2N(d₂) − 1) and
    /// Δ = e^{−qτ}(2N(d₁) − 1), the call and put of <see cref="BlackScholesMerton"/> added (a test pins the two
    /// together); one pair of normal distribution calls per hedge date instead of three.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static double Straddle(double spot, double strike, double years, double volatility, double rate, double dividendYield, out double delta)
    {
        var stdDev = volatility * Math.Sqrt(years);
        var d1 = (Math.Log(spot / strike) + ((rate - dividendYield + (0.5 * volatility * volatility)) * years)) / stdDev;
        var carry = Math.Exp(-dividendYield * years);
        var n1 = (2 * StandardNormal.Cdf(d1)) - 1;
        var n2 = (2 * StandardNormal.Cdf(d1 - stdDev)) - 1;
        delta = carry * n1;
        return (spot * carry * n1) - (strike * Math.Exp(-rate * years) * n2);
    }

    /// <summary>The value of the position at a mark volatility (the straddle through <see cref="Straddle"/>).</summary>
    private static double Mark(HedgedOption option, double spot, double strike, double years, double volatility, double rate, double dividendYield) =>
        option == HedgedOption.Straddle
            ? Straddle(spot, strike, years, volatility, rate, dividendYield, out _)
            : Value(option, spot, strike, years, volatility, rate, dividendYield);

    /// <summary>The value of the position: a call, or a call plus a put (the put by parity, c − S e^{−qτ} + K e^{−rτ}).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static double Value(HedgedOption option, double spot, double strike, double years, double volatility, double rate, double dividendYield)
    {
        var call = BlackScholesMerton.Price(OptionType.Call, spot, strike, years, volatility, rate, dividendYield);
        return option == HedgedOption.Call
            ? call
            : (2 * call) - (spot * Math.Exp(-dividendYield * years)) + (strike * Math.Exp(-rate * years));
    }

    /// <summary>The delta of the position: the call's, or the straddle's 2Δ_call − e^{−qτ}.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static double Delta(HedgedOption option, double spot, double strike, double years, double volatility, double rate, double dividendYield)
    {
        var call = BlackScholesMerton.Delta(OptionType.Call, spot, strike, years, volatility, rate, dividendYield);
        return option == HedgedOption.Call ? call : (2 * call) - Math.Exp(-dividendYield * years);
    }
}
