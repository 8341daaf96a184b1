using System.Runtime.CompilerServices;
using VolCast.Core.Data;

namespace VolCast.TestSupport;

/// <summary>Seeded builders of test data: the same seed always gives the same history.</summary>
public static class Some
{
    /// <summary>The first trading date of every built history (a Monday).</summary>
    public static readonly DateOnly FirstDate = new(2000, 1, 3);

    /// <summary>
    /// Daily OHLC bars from geometric Brownian motion with zero drift in log price and a known daily volatility,
    /// sampled at <paramref name="stepsPerDay"/> points per trading day. The open is the previous close moved by an
    /// overnight gap with volatility <paramref name="overnightVolatility"/> (0 = no gap).
    /// </summary>
    /// <param name="seed">Seed of the random stream.</param>
    /// <param name="days">Number of bars.</param>
    /// <param name="dailyVolatility">Standard deviation of the open-to-close log return (e.g. 0.01 = 1% a day).</param>
    /// <param name="stepsPerDay">Path points per day; the high and low are taken over them.</param>
    /// <param name="overnightVolatility">Standard deviation of the close-to-open log gap.</param>
    /// <param name="startPrice">Close before the first bar.</param>
    /// <param name="continuousExtremes">
    /// When true, the high and low are the extremes of the continuous path: within each step, the maximum and
    /// minimum of the Brownian bridge between the two sampled points are drawn from their exact conditional law,
    /// max = (a + b + sqrt((b − a)² − 2 s² ln U)) / 2 with U uniform on (0, 1] and s² the step variance (and the
    /// mirror image for the minimum); a draw is skipped when the bridge has less than e^−40 chance of setting a new
    /// extreme. When false, the extremes are those of the sampled points only, which are
    /// biased towards the open and close.
    /// </param>
    /// <returns>A valid OHLC history on consecutive weekdays from <see cref="FirstDate"/>.</returns>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static PriceHistory GbmBars(
        int seed,
        int days,
        double dailyVolatility = 0.01,
        int stepsPerDay = 24,
        double overnightVolatility = 0.0,
        double startPrice = 100.0,
        bool continuousExtremes = false)
    {
        var random = new Normal(seed);

        // The bridge draws come from their own stream, so a seed gives the same sampled path either way and the
        // two kinds of extremes can be compared on it.
        var bridge = new Normal(~seed);
        var open = new double[days];
        var high = new double[days];
        var low = new double[days];
        var close = new double[days];
        var stepSd = dailyVolatility / Math.Sqrt(stepsPerDay);
        var stepVariance = stepSd * stepSd;
        var previousClose = Math.Log(startPrice);
        for (var day = 0; day < days; day++)
        {
            var a = previousClose + (overnightVolatility > 0 ? overnightVolatility * random.Next() : 0.0);
            var dayOpen = a;
            double hi = a, lo = a;
            for (var step = 0; step < stepsPerDay; step++)
            {
                var b = a + (stepSd * random.Next());
                if (continuousExtremes)
                {
                    // The bridge from a to b rises above the running high with probability
                    // exp(−2 (hi − a)(hi − b) / s²); below e^−40 the draw cannot matter and is skipped.
                    if ((hi - a) * (hi - b) < 20 * stepVariance)
                    {
                        hi = Math.Max(hi, 0.5 * (a + b + Math.Sqrt(((b - a) * (b - a)) - (2 * stepVariance * Math.Log(bridge.Uniform())))));
                    }

                    if ((a - lo) * (b - lo) < 20 * stepVariance)
                    {
                        lo = Math.Min(lo, 0.5 * (a + b - Math.Sqrt(((b - a) * (b - a)) - (2 * stepVariance * Math.Log(bridge.Uniform())))));
                    }
                }
                else
                {
                    hi = Math.Max(hi, b);
                    lo = Math.Min(lo, b);
                }

                a = b;
            }

            open[day] = Math.Exp(dayOpen);
            close[day] = Math.Exp(a);
            high[day] = Math.Max(Math.Exp(hi), Math.Max(open[day], close[day]));
            low[day] = Math.Min(Math.Exp(lo), Math.Min(open[day], close[day]));
            previousClose = a;
        }

        return PriceHistory.FromBars(TradingDates(days), open, high, low, close);
    }

    /// <summary>A close-only history: log returns normal with the given daily volatility, zero drift.</summary>
    public static PriceHistory Closes(int seed, int days, double dailyVolatility = 0.01, double startPrice = 100.0)
    {
        var random = new Normal(seed);
        var close = new double[days];
        var x = Math.Log(startPrice);
        for (var day = 0; day < days; day++)
        {
            x += dailyVolatility * random.Next();
            close[day] = Math.Exp(x);
        }

        return PriceHistory.FromCloses(TradingDates(days), close);
    }

    /// <summary>Consecutive weekdays starting at <see cref="FirstDate"/>.</summary>
    public static DateOnly[] TradingDates(int count) => Weekdays.From(FirstDate, count);

    /// <summary>
    /// Standard normal draws by Marsaglia's polar method over SplitMix64 (Steele, Lea and Flood 2014): small, fast
    /// even in unoptimized test builds, and the same stream on every platform and runtime.
    /// </summary>
    private sealed class Normal(int seed)
    {
        private ulong _state = unchecked((ulong)seed * 0x9E3779B97F4A7C15UL) ^ 0xD1B54A32D192ED03UL;
        private double _spare;
        private bool _hasSpare;

        /// <summary>A uniform draw on (0, 1], safe to take the logarithm of.</summary>
        [MethodImpl(MethodImplOptions.AggressiveOptimization | MethodImplOptions.AggressiveInlining)]
        public double Uniform() => ((NextBits() >> 11) + 1) * (1.0 / 9007199254740992.0);

        [MethodImpl(MethodImplOptions.AggressiveOptimization)]
        public double Next()
        {
            if (_hasSpare)
            {
                _hasSpare = false;
                return _spare;
            }

            double x, y, r2;
            do
            {
                x = (2.0 * Uniform()) - 1.0;
                y = (2.0 * Uniform()) - 1.0;
                r2 = (x * x) + (y * y);
            }
            while (r2 >= 1.0 || r2 == 0.0);

            var scale = Math.Sqrt(-2.0 * Math.Log(r2) / r2);
            _spare = y * scale;
            _hasSpare = true;
            return x * scale;
        }

        [MethodImpl(MethodImplOptions.AggressiveOptimization | MethodImplOptions.AggressiveInlining)]
        private ulong NextBits()
        {
            unchecked
            {
                var z = _state += 0x9E3779B97F4A7C15UL;
                z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
                z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
                return z ^ (z >> 31);
            }
        }
    }
}
