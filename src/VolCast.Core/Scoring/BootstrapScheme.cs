namespace VolCast.Core.Scoring;

/// <summary>How the block bootstrap of the model confidence set resamples dates.</summary>
public enum BootstrapScheme
{
    /// <summary>
    /// Moving blocks of fixed length b with starts drawn uniformly from 1 .. T − b + 1, laid end to end and the last
    /// one cut so that each resample has T dates.
    /// </summary>
    MovingBlock,

    /// <summary>
    /// The stationary bootstrap of Politis and Romano (1994): blocks with geometric lengths of mean b and uniform
    /// starts, wrapping around the end of the sample.
    /// </summary>
    Stationary,
}
