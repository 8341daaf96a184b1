namespace VolCast.Core.Trading.Snooping;

/// <summary>The performance measure a data-snooping test compares with the benchmark.</summary>
public enum SnoopingMeasure
{
    /// <summary>Mean daily net P&amp;L of the rule minus that of the benchmark, E[d_k] (White 2000; Hansen 2005).</summary>
    MeanDifference,

    /// <summary>
    /// Daily Sharpe ratio of the rule's P&amp;L path minus that of the benchmark's (Sullivan, Timmermann &amp; White 1999).
    /// </summary>
    SharpeDifference,
}
