using System.Buffers;
using System.Globalization;
using System.Runtime.CompilerServices;
using VolCast.Core.Data;
using VolCast.Core.Options;

namespace VolCast.Core.Trading;

/// <summary>
/// Prices, hedges and settles one at-the-money straddle along the closes of a price history: the trade the rule makes.
/// </summary>
/// <remarks>
/// <para>Instrument: one call and one put struck at the entry close K = S_e, priced with Black-Scholes-Merton at the
/// entry date's implied volatility, rate r and dividend yield q (continuous decimals), time in years = calendar days /
/// 365 (ACT/365, see <see cref="DayCount"/>). The straddle is held to the expiry close and settles at |S_T − K|.</para>
/// <para>Hedge: at the entry close and at every close up to the one before expiry the long straddle holds −Δ_t units of
/// the underlying, Δ_t = 2N(d₁) e^{−qτ} − e^{−qτ} at the hedge volatility and the remaining time τ; the hedge of close t
/// earns −Δ_t (S_{t+1} − S_t e^{(r−q)δt}), δt in ACT/365 years. Every cash flow, the premium included, is carried to
/// expiry at r. When adjusted closes already hold the dividends, pass q = 0.</para>
/// <para>Costs: <see cref="TradeCosts"/>. Stress: the hedged position at entry repriced with Black-Scholes-Merton after
/// the spot moves by <c>stressSpotMove</c> (−0.10 = −10%) and implied by <c>stressVolatilityShift</c> (+0.10 = +10 vol
/// points), time unchanged.</para>
/// </remarks>
internal static class StraddleTrader
{
    /// <summary>The default stress move of the spot, −10%.</summary>
    public const double DefaultStressSpotMove = -0.10;

    /// <summary>The default stress shift of implied volatility, +10 vol points.</summary>
    public const double DefaultStressVolatilityShift = 0.10;

    /// <summary>Evaluates one trade.</summary>
    /// <param name="prices">The price history (closes are used).</param>
    /// <param name="entryIndex">Index of the entry close.</param>
    /// <param name="expiryIndex">Index of the expiry close, after the entry.</param>
    /// <param name="side">+1 long the straddle, −1 short.</param>
    /// <param name="impliedVolatility">The entry date's implied volatility (decimal, above zero).</param>
    /// <param name="costs">The trading costs.</param>
    /// <param name="hedgeVolatility">The volatility of the hedge deltas; null hedges at <paramref name="impliedVolatility"/>.</param>
    /// <param name="rate">r, continuous decimal per year.</param>
    /// <param name="dividendYield">q, continuous decimal per year.</param>
    /// <param name="forecast">The forecast that drove the trade, recorded with it.</param>
    /// <returns>The trade.</returns>
    /// <exception cref="ArgumentException">An index, the side, a volatility or a rate is out of range.</exception>
    public static StraddleTrade Evaluate(
        PriceHistory prices,
        int entryIndex,
        int expiryIndex,
        int side,
        double impliedVolatility,
        TradeCosts costs,
        double? hedgeVolatility = null,
        double rate = 0,
        double dividendYield = 0,
        double? forecast = null)
    {
        ArgumentNullException.ThrowIfNull(prices);
        ArgumentNullException.ThrowIfNull(costs);
        if (entryIndex < 0 || expiryIndex <= entryIndex || expiryIndex >= prices.Count)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"A trade needs 0 <= entry index < expiry index < {prices.Count} (the number of closes), was entry {entryIndex} and expiry {expiryIndex}."), nameof(expiryIndex));
        }

        if (side is not (1 or -1))
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture, $"The side must be +1 (long) or -1 (short), was {side}."), nameof(side));
        }

        TradingGuard.Volatility(impliedVolatility, nameof(impliedVolatility));
        var hedge = hedgeVolatility ?? impliedVolatility;
        TradingGuard.Volatility(hedge, nameof(hedgeVolatility));
        TradingGuard.Rate(rate, nameof(rate));
        TradingGuard.Rate(dividendYield, nameof(dividendYield));
        var trade = EvaluateLong(
            prices.Dates, prices.Close, entryIndex, expiryIndex, impliedVolatility, hedge, rate, dividendYield, costs,
            DefaultStressSpotMove, DefaultStressVolatilityShift, default, default, default, default);
        return ToTrade(trade, side, prices.Dates, prices.Close, forecast);
    }

    /// <summary>
    /// Evaluates the long straddle entered at <paramref name="entry"/>; when <paramref name="marks"/> is not empty, also
    /// writes the daily increments (entry … expiry, vol points) of the gross value marked at each day's implied
    /// (the last quote carried over a missing one), of the gross value marked at the entry implied, and of the costs.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static LongStraddle EvaluateLong(
        ReadOnlySpan<DateOnly> dates,
        ReadOnlySpan<double> close,
        int entry,
        int expiry,
        double impliedVolatility,
        double hedgeVolatility,
        double rate,
        double dividendYield,
        TradeCosts costs,
        double stressSpotMove,
        double stressVolatilityShift,
        ReadOnlySpan<double?> marks,
        Span<double> markIncrement,
        Span<double> entryVolIncrement,
        Span<double> costIncrement)
    {
        var length = expiry - entry + 1;
        var buffer = ArrayPool<double>.Shared.Rent(5 * length);
        try
        {
            var all = buffer.AsSpan(0, 5 * length);
            var years = all[..length];
            var markVol = all.Slice(length, length);
            var markValue = all.Slice(2 * length, length);
            var entryValue = all.Slice(3 * length, length);
            var notional = all.Slice(4 * length, length);
            var spots = close.Slice(entry, length);
            double realized = 0;
            for (var i = 0; i < length; i++)
            {
                years[i] = DayCount.YearsAct365(dates[entry], dates[entry + i]);
                if (i > 0)
                {
                    var r = Math.Log(spots[i] / spots[i - 1]);
                    realized += r * r;
                }
            }

            var paths = !marks.IsEmpty;
            if (paths)
            {
                var last = impliedVolatility;
                markVol[0] = impliedVolatility;
                for (var i = 1; i < length; i++)
                {
                    last = marks[entry + i] ?? last;
                    markVol[i] = last;
                }
            }

            var outcome = DeltaHedge.Run(
                HedgedOption.Straddle, spots, years, spots[0], impliedVolatility, hedgeVolatility, rate, dividendYield,
                paths ? markVol : default, markValue, entryValue, notional);
            var vegaPoint = outcome.Vega / 100.0;
            var bps = costs.HedgeCostBps / 10_000.0;
            var optionCost = costs.OptionHalfSpreadVolPoints * vegaPoint * outcome.Carry;
            var hedgeCost = bps * outcome.HedgeNotional;
            var spot = spots[0];
            var stressed = DeltaHedge.Value(
                HedgedOption.Straddle, spot * (1 + stressSpotMove), spot, years[length - 1], impliedVolatility + stressVolatilityShift, rate, dividendYield);
            var stressPnl = stressed - outcome.Premium - (outcome.EntryDelta * spot * stressSpotMove);
            if (paths)
            {
                double previousMark = 0, previousEntry = 0, previousCost = 0;
                for (var i = 0; i < length; i++)
                {
                    var cost = (bps * notional[i]) + optionCost;
                    markIncrement[i] = (markValue[i] - previousMark) / vegaPoint;
                    entryVolIncrement[i] = (entryValue[i] - previousEntry) / vegaPoint;
                    costIncrement[i] = (cost - previousCost) / vegaPoint;
                    previousMark = markValue[i];
                    previousEntry = entryValue[i];
                    previousCost = cost;
                }
            }

            return new LongStraddle(
                entry, expiry, spot, impliedVolatility, hedgeVolatility, DayCount.CalendarDays(dates[entry], dates[expiry]),
                outcome, optionCost, hedgeCost, stressPnl, realized);
        }
        finally
        {
            ArrayPool<double>.Shared.Return(buffer);
        }
    }

    /// <summary>The trade record of a long straddle taken on <paramref name="side"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static StraddleTrade ToTrade(in LongStraddle trade, int side, ReadOnlySpan<DateOnly> dates, ReadOnlySpan<double> close, double? forecast)
    {
        var o = trade.Outcome;
        var spot = close[trade.EntryIndex];
        var vegaPoint = trade.VegaPerVolPoint;
        var gross = side * o.GrossPnl;
        var net = gross - trade.Costs;
        var iv = trade.ImpliedVolatility;
        var annualizedRealized = trade.RealizedVariance * DayCount.DaysPerYear / trade.CalendarDays;
        return new StraddleTrade(
            side,
            trade.EntryIndex,
            trade.ExpiryIndex,
            dates[trade.EntryIndex],
            dates[trade.ExpiryIndex],
            trade.ExpiryIndex - trade.EntryIndex,
            trade.CalendarDays,
            spot,
            trade.Strike,
            iv,
            trade.HedgeVolatility,
            forecast,
            o.Premium,
            vegaPoint,
            o.EntryDelta,
            o.HedgePnl,
            o.Payoff,
            trade.OptionCost,
            trade.HedgeCost,
            gross,
            net,
            gross / vegaPoint,
            net / vegaPoint,
            100.0 * gross / spot,
            100.0 * net / spot,
            side * trade.StressPnl / vegaPoint,
            side * (trade.RealizedVariance - trade.ImpliedVariance),
            100.0 * side * (annualizedRealized - (iv * iv)) / (2 * iv));
    }
}
