namespace VolCast.Core.Scoring;

/// <summary>The lag window that weights autocovariances in a long-run (HAC) variance.</summary>
public enum LongRunVarianceWindow
{
    /// <summary>Bartlett (Newey-West) weights 1 − j/(L+1); the estimate is never negative.</summary>
    Bartlett,

    /// <summary>Rectangular (truncated) weights 1 for j ≤ L, as in Diebold and Mariano (1995); can be negative in small samples.</summary>
    Rectangular,
}
