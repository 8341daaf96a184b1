using System.Numerics;
using System.Runtime.CompilerServices;

namespace VolCast.Core.Trading;

/// <summary>
/// The long straddle of every firing date, evaluated once with its daily increments (vol points), so that every rule,
/// threshold and side reuses them: a short trade is the mirror of the long one and pays the same costs.
/// </summary>
internal sealed class TradeBook
{
    private TradeBook(int[] entry, int[] expiry, LongStraddle[] trades, int[] offset, double[] mark, double[] entryVol, double[] cost)
    {
        Entry = entry;
        Expiry = expiry;
        Trades = trades;
        Offset = offset;
        Mark = mark;
        EntryVol = entryVol;
        Cost = cost;
    }

    /// <summary>Gets the entry index of each firing position.</summary>
    public int[] Entry { get; }

    /// <summary>Gets the expiry index of each firing position.</summary>
    public int[] Expiry { get; }

    /// <summary>Gets the long straddle of each firing position.</summary>
    public LongStraddle[] Trades { get; }

    /// <summary>Gets where each trade's increments start in the flat arrays (entry … expiry); the arrays may hold other trades too.</summary>
    public int[] Offset { get; }

    /// <summary>Gets the gross daily increments of the long trades marked at the quoted implied.</summary>
    public double[] Mark { get; }

    /// <summary>Gets the gross daily increments marked at the entry implied.</summary>
    public double[] EntryVol { get; }

    /// <summary>Gets the daily cost increments.</summary>
    public double[] Cost { get; }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static TradeBook Build(
        ReadOnlySpan<DateOnly> dates, ReadOnlySpan<double> close, int[] entry, int[] expiry, double[] hedgeVolatility, double?[] implied, TradingSettings settings)
    {
        var count = entry.Length;
        var offset = new int[count + 1];
        for (var i = 0; i < count; i++)
        {
            offset[i + 1] = offset[i] + (expiry[i] - entry[i] + 1);
        }

        var mark = new double[offset[count]];
        var entryVol = new double[offset[count]];
        var cost = new double[offset[count]];
        var trades = new LongStraddle[count];
        for (var i = 0; i < count; i++)
        {
            var length = expiry[i] - entry[i] + 1;
            trades[i] = StraddleTrader.EvaluateLong(
                dates, close, entry[i], expiry[i], implied[entry[i]]!.Value, hedgeVolatility[i], settings.Rate, settings.DividendYield, settings.Costs,
                settings.StressSpotMove, settings.StressVolatilityShift, implied,
                mark.AsSpan(offset[i], length), entryVol.AsSpan(offset[i], length), cost.AsSpan(offset[i], length));
        }

        return new TradeBook(entry, expiry, trades, offset, mark, entryVol, cost);
    }

    /// <summary>The book of trades entered at <paramref name="entry"/>, taken from (and added to) the shared store of trades hedged at the entry implied.</summary>
    public static TradeBook FromEntries(EntryTrades store, int[] entry, int[] expiry)
    {
        var count = entry.Length;
        var trades = new LongStraddle[count];
        var offset = new int[count];
        for (var i = 0; i < count; i++)
        {
            trades[i] = store.Trade(entry[i], expiry[i]);
            offset[i] = store.Offset[entry[i]];
        }

        return new TradeBook(entry, expiry, trades, offset, store.Mark, store.EntryVol, store.Cost);
    }

    /// <summary>Net vol-point P&amp;L of the trade at position <paramref name="i"/> on side <paramref name="side"/>.</summary>
    public double NetVolPoints(int i, int side) => ((side * Trades[i].Outcome.GrossPnl) - Trades[i].Costs) / Trades[i].VegaPerVolPoint;

    /// <summary>Gross vol-point P&amp;L of the trade at position <paramref name="i"/> on side <paramref name="side"/>.</summary>
    public double GrossVolPoints(int i, int side) => side * Trades[i].Outcome.GrossPnl / Trades[i].VegaPerVolPoint;

    /// <summary>The every-signal ladder: a trade at every position with a side, each weighted <paramref name="weight"/>, over days start … start + length − 1.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public Ladder Ladder(sbyte[] sides, double weight, int start, int length, bool entryVolPaths)
    {
        var net = new double[length];
        var gross = new double[length];
        var entryNet = entryVolPaths ? new double[length] : [];
        var entryGross = entryVolPaths ? new double[length] : [];
        var inMarket = new bool[length];
        var trades = 0;
        double carry = 0;
        for (var i = 0; i < sides.Length; i++)
        {
            int s = sides[i];
            if (s == 0)
            {
                continue;
            }

            trades++;
            carry += Trades[i].Outcome.Carry;
            var first = Entry[i] - start;
            var n = Expiry[i] - Entry[i] + 1;
            var o = Offset[i];
            var signed = weight * s;
            Add(gross.AsSpan(first, n), net.AsSpan(first, n), Mark.AsSpan(o, n), Cost.AsSpan(o, n), signed, weight);
            if (entryVolPaths)
            {
                Add(entryGross.AsSpan(first, n), entryNet.AsSpan(first, n), EntryVol.AsSpan(o, n), Cost.AsSpan(o, n), signed, weight);
            }

            inMarket.AsSpan(first + 1, n - 1).Fill(true);
        }

        var days = 0;
        for (var d = 0; d < length; d++)
        {
            days += inMarket[d] ? 1 : 0;
        }

        return new Ladder(net, gross, entryNet, entryGross, trades, days, carry * weight);
    }

    /// <summary>
    /// gross[j] += signed·value[j] and net[j] += signed·value[j] − weight·cost[j] for every j, several days at a time:
    /// each lane does the same operations in the same order as one day alone, so the sums are the same to the bit.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Add(Span<double> gross, Span<double> net, ReadOnlySpan<double> value, ReadOnlySpan<double> cost, double signed, double weight)
    {
        var j = 0;
        if (Vector.IsHardwareAccelerated && value.Length >= Vector<double>.Count)
        {
            var vs = new Vector<double>(signed);
            var vw = new Vector<double>(weight);
            for (; j <= value.Length - Vector<double>.Count; j += Vector<double>.Count)
            {
                var g = vs * new Vector<double>(value[j..]);
                var c = vw * new Vector<double>(cost[j..]);
                (new Vector<double>(gross[j..]) + g).CopyTo(gross[j..]);
                (new Vector<double>(net[j..]) + (g - c)).CopyTo(net[j..]);
            }
        }

        for (; j < value.Length; j++)
        {
            var g = signed * value[j];
            var c = weight * cost[j];
            gross[j] += g;
            net[j] += g - c;
        }
    }

    /// <summary>
    /// One trade at a time: starting at day <paramref name="firstEntry"/>, take a firing position with a side when no
    /// trade is open (a new trade may enter at the close where the previous one settles).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public List<int> OneAtATime(sbyte[] sides, int firstEntry)
    {
        var taken = new List<int>();
        var free = firstEntry;
        for (var i = 0; i < sides.Length; i++)
        {
            if (sides[i] != 0 && Entry[i] >= free)
            {
                taken.Add(i);
                free = Expiry[i];
            }
        }

        return taken;
    }
}
