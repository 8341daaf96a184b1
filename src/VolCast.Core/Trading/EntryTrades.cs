using System.Runtime.CompilerServices;
using VolCast.Core.Data;

namespace VolCast.Core.Trading;

/// <summary>
/// The long straddle entered at each close and hedged at that close's implied volatility, evaluated at most once per
/// entry close with its daily increments: a trade depends only on its entry close (strike, premium, expiry, hedge), not
/// on the firing date that sent it, so the two entry timings share every trade they both enter (a next-day trade fired
/// on date f is the trade entered at the close of f + 1, which the firing-close timing also enters when f + 1 fires).
/// </summary>
/// <remarks>Only for the default hedge at the entry implied; a forecast hedge makes the trade depend on the firing date.</remarks>
internal sealed class EntryTrades
{
    private readonly PriceHistory _prices;
    private readonly double?[] _implied;
    private readonly TradingSettings _settings;
    private readonly int[] _windowDays;
    private readonly LongStraddle[] _trades;
    private readonly bool[] _evaluated;

    /// <summary>Creates the store; no trade is evaluated until a book asks for it.</summary>
    /// <param name="prices">The price history (its closes are traded).</param>
    /// <param name="implied">Implied volatility at each close (decimal), null where there was no quote.</param>
    /// <param name="windowDays">Trading days from each close to the expiry of a trade entered there (the realized target's windows).</param>
    /// <param name="settings">Rate, dividend yield, costs and stress shock of every trade.</param>
    public EntryTrades(PriceHistory prices, double?[] implied, int[] windowDays, TradingSettings settings)
    {
        var n = prices.Count;
        _prices = prices;
        _implied = implied;
        _settings = settings;
        _windowDays = windowDays;
        _trades = new LongStraddle[n];
        _evaluated = new bool[n];
        Offset = new int[n + 1];
        for (var e = 0; e < n; e++)
        {
            Offset[e + 1] = Offset[e] + (windowDays[e] > 0 ? windowDays[e] + 1 : 0);
        }

        Mark = new double[Offset[n]];
        EntryVol = new double[Offset[n]];
        Cost = new double[Offset[n]];
    }

    /// <summary>Gets where the increments of the trade entered at each close start in the flat arrays (entry … expiry).</summary>
    public int[] Offset { get; }

    /// <summary>Gets the gross daily increments of the long trades marked at the quoted implied.</summary>
    public double[] Mark { get; }

    /// <summary>Gets the gross daily increments marked at the entry implied.</summary>
    public double[] EntryVol { get; }

    /// <summary>Gets the daily cost increments.</summary>
    public double[] Cost { get; }

    /// <summary>The trade entered at the close <paramref name="entry"/>, evaluated on the first call.</summary>
    /// <exception cref="ArgumentException">The expiry is not the one this store's windows give that entry.</exception>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public LongStraddle Trade(int entry, int expiry)
    {
        if (expiry != entry + _windowDays[entry] || _windowDays[entry] <= 0)
        {
            throw new ArgumentException($"The trade entered at close {entry} expires at close {entry + _windowDays[entry]} in these windows, was asked to expire at {expiry}.", nameof(expiry));
        }

        if (!_evaluated[entry])
        {
            var length = expiry - entry + 1;
            var iv = _implied[entry]!.Value;
            _trades[entry] = StraddleTrader.EvaluateLong(
                _prices.Dates, _prices.Close, entry, expiry, iv, iv, _settings.Rate, _settings.DividendYield, _settings.Costs,
                _settings.StressSpotMove, _settings.StressVolatilityShift, _implied,
                Mark.AsSpan(Offset[entry], length), EntryVol.AsSpan(Offset[entry], length), Cost.AsSpan(Offset[entry], length));
            _evaluated[entry] = true;
        }

        return _trades[entry];
    }
}
