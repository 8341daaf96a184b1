using System.Globalization;
using VolCast.Core.Data;
using VolCast.Core.Estimators;

namespace VolCast.Core.Backtest;

/// <summary>
/// The realized window of every forecast date of a history: its length h_t, the index by which it has closed, and the
/// realized target RV(t, h_t) = sqrt(A/h_t · Σ_{i=1..h_t} v_{t+i}), v the squared log return or a range term.
/// </summary>
/// <remarks>
/// A window closes at index c_t: t + h for a trading-day horizon; for a tenor of D calendar days, the first index
/// whose date is on or after date_t + D (all days of (t, t + D] are then known). A date whose window has not closed
/// inside the history has no target. c_t is non-decreasing in t.
/// </remarks>
internal sealed class RealizedWindows
{
    private RealizedWindows(int[] windowDays, int[] closeIndex, double?[] realized)
    {
        WindowDays = windowDays;
        CloseIndex = closeIndex;
        Realized = realized;
    }

    /// <summary>Gets h_t, or 0 where the window has not closed.</summary>
    public int[] WindowDays { get; }

    /// <summary>Gets c_t, or the history length where the window has not closed.</summary>
    public int[] CloseIndex { get; }

    /// <summary>Gets RV(t, h_t), or null where the window has not closed.</summary>
    public double?[] Realized { get; }

    public static RealizedWindows Compute(PriceHistory prices, BacktestHorizon horizon, RealizedTarget target, double annualizationFactor)
    {
        var n = prices.Count;
        var term = DailyTerms(prices, target);
        var windowDays = new int[n];
        var closeIndex = new int[n];
        var realized = new double?[n];
        var dates = prices.Dates;
        var last = 0;
        for (var t = 0; t < n; t++)
        {
            int h;
            int close;
            if (horizon.TradingDays is int fixedDays)
            {
                h = fixedDays;
                close = t + fixedDays;
            }
            else
            {
                var end = dates[t].AddDays(horizon.TenorCalendarDays!.Value);
                last = Math.Max(last, t);
                while (last + 1 < n && dates[last + 1] <= end)
                {
                    last++;
                }

                h = last - t;
                close = dates[last] == end ? last : (last + 1 < n ? last + 1 : n);
            }

            if (close >= n || h < 1)
            {
                closeIndex[t] = n;
                continue;
            }

            double sum = 0;
            for (var j = t + 1; j <= t + h; j++)
            {
                sum += term[j];
            }

            windowDays[t] = h;
            closeIndex[t] = close;
            realized[t] = Math.Sqrt(annualizationFactor / h * sum);
        }

        // c_t must not decrease (the adaptive choice relies on it); dates without a window keep n.
        for (var t = n - 2; t >= 0; t--)
        {
            if (closeIndex[t] > closeIndex[t + 1])
            {
                closeIndex[t] = closeIndex[t + 1];
            }
        }

        return new RealizedWindows(windowDays, closeIndex, realized);
    }

    /// <summary>The per-bar daily variance term v_j of bar j (v_0 is never inside a window).</summary>
    private static double[] DailyTerms(PriceHistory prices, RealizedTarget target)
    {
        var n = prices.Count;
        var v = new double[n];
        if (target == RealizedTarget.SquaredReturns)
        {
            var close = prices.Close;
            for (var j = 1; j < n; j++)
            {
                var r = Math.Log(close[j] / close[j - 1]);
                v[j] = r * r;
            }

            return v;
        }

        if (!prices.HasRange)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"The {target} realized target needs open, high and low prices; the price history has closes only (use the squared-returns target)."), nameof(prices));
        }

        var open = prices.Open;
        var high = prices.High;
        var low = prices.Low;
        var c = prices.Close;
        for (var j = 0; j < n; j++)
        {
            v[j] = target switch
            {
                RealizedTarget.Parkinson => BarVariance.Parkinson(high[j], low[j]),
                RealizedTarget.GarmanKlass => BarVariance.GarmanKlass(open[j], high[j], low[j], c[j]),
                _ => BarVariance.RogersSatchell(open[j], high[j], low[j], c[j]),
            };
        }

        return v;
    }
}
