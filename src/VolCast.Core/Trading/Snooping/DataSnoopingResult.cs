using System.Collections.Immutable;

namespace VolCast.Core.Trading.Snooping;

/// <summary>
/// The data-snooping tests of K rules against one benchmark on one performance measure θ_k (rule k minus the
/// benchmark): White's (2000) Reality Check, Hansen's (2005) SPA p-values and Romano &amp; Wolf's (2005) StepM, all
/// from the same stationary-bootstrap resamples. The null of the first two is max_k θ_k ≤ 0: no rule beats the
/// benchmark.
/// </summary>
/// <param name="Measure">What θ_k is: the mean daily P&amp;L difference, or the difference of daily Sharpe ratios.</param>
/// <param name="Days">Number of dates T.</param>
/// <param name="Estimates">θ̂_k for each rule, in the order given (per day; a Sharpe difference is not annualized: multiply by √(days per year)).</param>
/// <param name="StandardDeviations">ω̂_k, the bootstrap standard deviation of √T·θ̂_k: ω̂²_k = (T/B)·Σ_b (θ̂*_k,b − θ̂_k)² (Hansen 2005's bootstrap estimate). Zero for a rule that differs from the benchmark by a constant.</param>
/// <param name="TStatistics">√T·θ̂_k / ω̂_k, absent where ω̂_k is zero (such a rule takes no part in the studentized statistics).</param>
/// <param name="BestRule">Index of the rule with the largest θ̂_k.</param>
/// <param name="RealityCheckPValue">White's (2000) p-value for V = max_k √T·θ̂_k against V*_b = max_k √T·(θ̂*_k,b − θ̂_k): the share of replications with V*_b &gt; V.</param>
/// <param name="StudentizedRealityCheckPValue">The same with each rule's term divided by ω̂_k (no floor at zero).</param>
/// <param name="Spa">Hansen's (2005) SPA statistic and its lower, consistent and upper p-values.</param>
/// <param name="StepM">Romano &amp; Wolf's (2005) StepM, studentized.</param>
/// <param name="Replications">Bootstrap replications B.</param>
/// <param name="MeanBlockLength">Mean block length L of the stationary bootstrap.</param>
/// <param name="Seed">Seed of the bootstrap draws.</param>
public sealed record DataSnoopingResult(
    SnoopingMeasure Measure,
    int Days,
    ImmutableArray<double> Estimates,
    ImmutableArray<double> StandardDeviations,
    ImmutableArray<double?> TStatistics,
    int BestRule,
    double RealityCheckPValue,
    double StudentizedRealityCheckPValue,
    SpaPValues Spa,
    StepMResult StepM,
    int Replications,
    double MeanBlockLength,
    int Seed)
{
    /// <summary>Gets the number of rules K.</summary>
    public int Rules => Estimates.Length;
}
