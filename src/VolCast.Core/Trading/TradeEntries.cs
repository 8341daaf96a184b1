namespace VolCast.Core.Trading;

/// <summary>Which of a rule's signals open the trades of its trade table and trade statistics.</summary>
/// <remarks>The daily paths and their tests always use the every-signal ladder (each trade sized 1/h, h the horizon in trading days).</remarks>
public enum TradeEntries
{
    /// <summary>A new trade only when none of the same rule is open, from the first firing date (trades do not overlap).</summary>
    OneAtATime,

    /// <summary>A new trade on every firing date (overlapping trades, the ladder's).</summary>
    EverySignal,
}
