namespace VolCast.Core.Trading.Snooping;

/// <summary>Settings of the data-snooping tests: bootstrap size, mean block length, seed and level.</summary>
/// <remarks>
/// <para>
/// The seed is always given by the caller, so a run is repeatable: the same data and settings give the same p-values
/// bit for bit.
/// </para>
/// <para>
/// The mean block length should cover the serial dependence of the P&amp;L differences. The stationary bootstrap weighs
/// the lag-i autocovariance by about (1 − 1/L)^i (Politis &amp; Romano 1994), so with L equal to the span of the
/// dependence the bootstrap variance of a mean falls short of the long-run variance (about 72% of it for the MA(4) of
/// overlapping 5-day sums at L = 5) and every test here rejects too often. The run therefore uses the Politis-White
/// automatic length, at least the horizon (<see cref="AutomaticBlockLength"/>), unless the configuration sets L; the
/// sizes measured for L = h, 2h and the automatic length are in docs/methods.md#data-snooping-reality-check-spa-stepm.
/// </para>
/// </remarks>
internal sealed record DataSnoopingOptions
{
    /// <summary>Creates the settings, checking each one.</summary>
    /// <param name="meanBlockLength">Mean block length L of the stationary bootstrap in days, at least 1; the run passes the Politis-White automatic length, at least the horizon (<see cref="AutomaticBlockLength"/>).</param>
    /// <param name="seed">Seed of the random number generator.</param>
    /// <param name="replications">Bootstrap replications B, at least 1; 1,000 by default.</param>
    /// <param name="level">Familywise error rate of StepM, in (0, 1); 0.05 by default.</param>
    /// <exception cref="ArgumentOutOfRangeException">A setting is out of range.</exception>
    public DataSnoopingOptions(double meanBlockLength, int seed, int replications = 1000, double level = 0.05)
    {
        SnoopingGuard.MeanBlockLength(meanBlockLength, nameof(meanBlockLength));
        SnoopingGuard.Replications(replications, nameof(replications));
        SnoopingGuard.Level(level, nameof(level));
        MeanBlockLength = meanBlockLength;
        Seed = seed;
        Replications = replications;
        Level = level;
    }

    /// <summary>Gets the mean block length L of the stationary bootstrap, in days.</summary>
    public double MeanBlockLength { get; }

    /// <summary>Gets the seed of the random number generator.</summary>
    public int Seed { get; }

    /// <summary>Gets the number of bootstrap replications B.</summary>
    public int Replications { get; }

    /// <summary>Gets the familywise error rate α of StepM.</summary>
    public double Level { get; }

    /// <summary>The default settings for trades held <paramref name="horizonDays"/> trading days: L = horizon, B = 1,000, α = 0.05.</summary>
    /// <param name="horizonDays">Holding period in trading days, at least 1.</param>
    /// <param name="seed">Seed of the random number generator.</param>
    /// <returns>The settings.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The horizon is below 1.</exception>
    public static DataSnoopingOptions ForHorizon(int horizonDays, int seed) => new(horizonDays, seed);
}
