using VolCast.Core.Data;

namespace VolCast.Core.Tests.Reliability;

/// <summary>
/// Seeded valid OHLC histories with the awkward features real files have: a flat stretch (open = high = low = close,
/// so every return and range in it is zero), a single huge overnight jump, and otherwise ordinary random bars.
/// Invented data for property tests (common practice, no source).
/// </summary>
/// <param name="Seed">Seed of the random bars.</param>
/// <param name="Days">Number of bars.</param>
/// <param name="FlatStart">First bar of the flat stretch.</param>
/// <param name="FlatLength">Length of the flat stretch (0 = none).</param>
/// <param name="JumpAt">Bar that opens with the jump (−1 = none).</param>
/// <param name="JumpLog">Log size of the jump (e.g. 1.5 = ×4.5, −2 = ÷7.4).</param>
internal sealed record PathologicalHistory(int Seed, int Days, int FlatStart, int FlatLength, int JumpAt, double JumpLog)
{
    /// <summary>Builds the history on consecutive weekdays from 2000-01-03.</summary>
    public PriceHistory Build()
    {
        var random = new Random(Seed);
        var dates = Weekdays.From(new DateOnly(2000, 1, 3), Days);
        var open = new double[Days];
        var high = new double[Days];
        var low = new double[Days];
        var close = new double[Days];
        var previous = 100.0;
        for (var i = 0; i < Days; i++)
        {
            if (i >= FlatStart && i < FlatStart + FlatLength)
            {
                open[i] = high[i] = low[i] = close[i] = previous;
                continue;
            }

            var o = i == JumpAt ? previous * Math.Exp(JumpLog) : previous * Math.Exp(0.003 * Gaussian.Next(random));
            var c = o * Math.Exp(0.012 * Gaussian.Next(random));
            open[i] = o;
            close[i] = c;
            high[i] = Math.Max(o, c) * Math.Exp(0.004 * random.NextDouble());
            low[i] = Math.Min(o, c) * Math.Exp(-0.004 * random.NextDouble());
            previous = c;
        }

        return PriceHistory.FromBars(dates, open, high, low, close);
    }

    /// <summary>An implied series on every date of <paramref name="prices"/>, around 20%.</summary>
    public static ImpliedSeries ImpliedFor(PriceHistory prices)
    {
        var iv = new double[prices.Count];
        for (var i = 0; i < iv.Length; i++)
        {
            iv[i] = 0.2 + (0.05 * Math.Sin(i / 17.0));
        }

        return new ImpliedSeries(prices.Dates, iv);
    }
}
