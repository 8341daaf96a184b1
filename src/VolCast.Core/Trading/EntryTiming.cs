namespace VolCast.Core.Trading;

/// <summary>When a trade is entered relative to the date the rule fired.</summary>
public enum EntryTiming
{
    /// <summary>At the close of the firing date (the default; assumes the forecast exists before that close).</summary>
    FiringClose,

    /// <summary>At the close one trading day after the firing date, priced at that day's close and implied volatility.</summary>
    NextClose,
}
