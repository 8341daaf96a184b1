namespace VolCast.Core.Trading;

/// <summary>The option position that <see cref="DeltaHedge"/> hedges.</summary>
internal enum HedgedOption
{
    /// <summary>One European call.</summary>
    Call,

    /// <summary>One call and one put at the same strike.</summary>
    Straddle,
}
