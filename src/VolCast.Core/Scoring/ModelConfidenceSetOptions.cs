using System.Globalization;

namespace VolCast.Core.Scoring;

/// <summary>Settings of the model confidence set: size, bootstrap and statistic.</summary>
/// <remarks>
/// The seed is always given by the caller, so a run is repeatable: the same losses, options and seed give the
/// same p-values bit for bit (System.Random with a seed).
/// </remarks>
public sealed record ModelConfidenceSetOptions
{
    /// <summary>Creates the settings, checking each one.</summary>
    /// <param name="blockLength">Bootstrap block length (mean length for the stationary bootstrap), at least 1; about the horizon h.</param>
    /// <param name="seed">Seed of the random number generator.</param>
    /// <param name="alpha">Size α of the elimination tests, in (0, 1); 0.10 by default (a 90% set).</param>
    /// <param name="bootstrapReplications">Bootstrap replications B, at least 10; 1,000 by default.</param>
    /// <param name="statistic">The equivalence statistic; T_max by default.</param>
    /// <param name="bootstrap">The bootstrap scheme; moving blocks by default.</param>
    /// <exception cref="ArgumentOutOfRangeException">A setting is out of range.</exception>
    public ModelConfidenceSetOptions(
        int blockLength,
        int seed,
        double alpha = 0.10,
        int bootstrapReplications = 1000,
        ModelConfidenceSetStatistic statistic = ModelConfidenceSetStatistic.TMax,
        BootstrapScheme bootstrap = BootstrapScheme.MovingBlock)
    {
        Preconditions.AtLeast(blockLength, 1, "date");

        Preconditions.Fraction(alpha);

        Preconditions.AtLeast(bootstrapReplications, 10, "replications");

        if (!Enum.IsDefined(statistic))
        {
            throw new ArgumentOutOfRangeException(nameof(statistic), statistic, "Unknown model confidence set statistic.");
        }

        if (!Enum.IsDefined(bootstrap))
        {
            throw new ArgumentOutOfRangeException(nameof(bootstrap), bootstrap, "Unknown bootstrap scheme.");
        }

        BlockLength = blockLength;
        Seed = seed;
        Alpha = alpha;
        BootstrapReplications = bootstrapReplications;
        Statistic = statistic;
        Bootstrap = bootstrap;
    }

    /// <summary>Gets the bootstrap block length (mean length for the stationary bootstrap).</summary>
    public int BlockLength { get; }

    /// <summary>Gets the seed of the random number generator.</summary>
    public int Seed { get; }

    /// <summary>Gets the size α; models with an MCS p-value of at least α are in the set.</summary>
    public double Alpha { get; }

    /// <summary>Gets the number of bootstrap replications B.</summary>
    public int BootstrapReplications { get; }

    /// <summary>Gets the equivalence statistic.</summary>
    public ModelConfidenceSetStatistic Statistic { get; }

    /// <summary>Gets the bootstrap scheme.</summary>
    public BootstrapScheme Bootstrap { get; }
}
