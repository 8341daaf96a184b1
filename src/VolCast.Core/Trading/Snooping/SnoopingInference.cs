using System.Collections.Immutable;

namespace VolCast.Core.Trading.Snooping;

/// <summary>
/// The Reality Check, SPA and StepM from the estimates θ̂_k and their bootstrap deviations θ̂*_k,b − θ̂_k. Every test
/// only needs these, so the mean-difference and Sharpe-ratio tests share this code.
/// </summary>
internal static class SnoopingInference
{
    /// <summary>Runs the tests.</summary>
    /// <param name="measure">What θ is.</param>
    /// <param name="days">Number of dates T.</param>
    /// <param name="estimates">θ̂_k, K entries.</param>
    /// <param name="deviations">θ̂*_k,b − θ̂_k, row-major B × K; rows of rules without variation are set to zero.</param>
    /// <param name="draws">The bootstrap draws (for B, L and the seed).</param>
    /// <param name="level">StepM's familywise error rate.</param>
    /// <param name="scale">Size of the values the estimates come from (the largest |d|, or 1 for Sharpe ratios): below 1e-12 of it a bootstrap standard deviation is rounding.</param>
    public static DataSnoopingResult Run(SnoopingMeasure measure, int days, double[] estimates, double[] deviations, StationaryBootstrapDraws draws, double level, double scale)
    {
        var rules = estimates.Length;
        var replications = draws.Replications;
        var rootT = Math.Sqrt(days);
        var omega = BootstrapScales(deviations, rules, replications, days);
        var (inverse, tStatistics, varying) = Studentize(omega, estimates, deviations, replications, rootT, scale);
        var best = BestRule(estimates);
        var logLog = Math.Log(Math.Log(days));
        var threshold = logLog > 0 ? Math.Sqrt(2 * logLog) : 0.0;
        if (varying == 0)
        {
            // Every rule differs from the benchmark by a constant: there is nothing random to test.
            return new DataSnoopingResult(measure, days, [.. estimates], [.. omega], [.. tStatistics], best, 1.0, 1.0,
                new SpaPValues(0.0, threshold, 1.0, 1.0, 1.0), new StepMResult(level, [], [], []),
                replications, draws.MeanBlockLength, draws.Seed);
        }

        var counts = CountExceedances(estimates, deviations, replications, rootT, inverse, tStatistics, threshold);
        double count = replications;
        var spa = new SpaPValues(counts.SpaStatistic, threshold, counts.Lower / count, counts.Consistent / count, counts.Upper / count);
        var stepM = StepDown(deviations, rules, replications, rootT, inverse, tStatistics, level);
        return new DataSnoopingResult(measure, days, [.. estimates], [.. omega], [.. tStatistics], best,
            counts.Reality / count, counts.Studentized / count, spa, stepM, replications, draws.MeanBlockLength, draws.Seed);
    }

    /// <summary>ω̂_k = √((T/B) Σ_b (θ̂*_k,b − θ̂_k)²): Hansen's (2005) bootstrap estimate of the standard deviation of √T·θ̂_k.</summary>
    private static double[] BootstrapScales(double[] deviations, int rules, int replications, int days)
    {
        var omega = new double[rules];
        for (var b = 0; b < replications; b++)
        {
            var row = deviations.AsSpan(b * rules, rules);
            for (var k = 0; k < rules; k++)
            {
                omega[k] += row[k] * row[k];
            }
        }

        for (var k = 0; k < rules; k++)
        {
            omega[k] = Math.Sqrt(days * omega[k] / replications);
        }

        return omega;
    }

    /// <summary>
    /// The studentized statistics t_k = √T·θ̂_k/ω̂_k. A rule whose difference from the benchmark is a constant has no
    /// bootstrap variation (only rounding): it takes no part in the studentized statistics, and its ω̂ and deviations
    /// are set to exactly zero.
    /// </summary>
    private static (double[] Inverse, double?[] TStatistics, int Varying) Studentize(
        double[] omega, double[] estimates, double[] deviations, int replications, double rootT, double scale)
    {
        var rules = omega.Length;
        var largest = 0.0;
        for (var k = 0; k < rules; k++)
        {
            largest = Math.Max(largest, omega[k]);
        }

        var floor = Math.Max(1e-10 * largest, 1e-12 * scale);
        var inverse = new double[rules];
        var tStatistics = new double?[rules];
        var varying = 0;
        for (var k = 0; k < rules; k++)
        {
            if (omega[k] > floor)
            {
                inverse[k] = 1.0 / omega[k];
                tStatistics[k] = rootT * estimates[k] * inverse[k];
                varying++;
            }
            else
            {
                omega[k] = 0;
                for (var b = 0; b < replications; b++)
                {
                    deviations[(b * rules) + k] = 0;
                }
            }
        }

        return (inverse, tStatistics, varying);
    }

    private static int BestRule(double[] estimates)
    {
        var best = 0;
        for (var k = 1; k < estimates.Length; k++)
        {
            if (estimates[k] > estimates[best])
            {
                best = k;
            }
        }

        return best;
    }

    /// <summary>
    /// How many bootstrap replications exceed the Reality Check's, the studentized maximum's and the three SPA
    /// statistics. Hansen (2005): the bootstrap mean of rule k is recentred at θ̂_k − g(θ̂_k); the shifts below are
    /// θ̂_k − g(θ̂_k) for g_l(x) = max(x, 0) and g_c(x) = x·1{√T·x/ω̂ ≥ −√(2 ln ln T)}; g_u(x) = x gives no shift.
    /// </summary>
    private static Exceedances CountExceedances(
        double[] estimates, double[] deviations, int replications, double rootT, double[] inverse, double?[] tStatistics, double threshold)
    {
        var rules = estimates.Length;
        var shiftLower = new double[rules];
        var shiftConsistent = new double[rules];
        var studentizedMax = double.NegativeInfinity;
        var plainMax = double.NegativeInfinity;
        for (var k = 0; k < rules; k++)
        {
            plainMax = Math.Max(plainMax, rootT * estimates[k]);
            if (tStatistics[k] is { } t)
            {
                studentizedMax = Math.Max(studentizedMax, t);
                shiftLower[k] = Math.Min(estimates[k], 0.0);
                shiftConsistent[k] = t < -threshold ? estimates[k] : 0.0;
            }
        }

        var spaStatistic = Math.Max(studentizedMax, 0.0);
        int realityCount = 0, studentizedCount = 0, lowerCount = 0, consistentCount = 0, upperCount = 0;
        for (var b = 0; b < replications; b++)
        {
            var row = deviations.AsSpan(b * rules, rules);
            var plain = double.NegativeInfinity;
            var upper = double.NegativeInfinity;
            var lower = double.NegativeInfinity;
            var consistent = double.NegativeInfinity;
            for (var k = 0; k < rules; k++)
            {
                var deviation = row[k];
                plain = Math.Max(plain, deviation);
                if (inverse[k] > 0)
                {
                    upper = Math.Max(upper, deviation * inverse[k]);
                    lower = Math.Max(lower, (deviation + shiftLower[k]) * inverse[k]);
                    consistent = Math.Max(consistent, (deviation + shiftConsistent[k]) * inverse[k]);
                }
            }

            realityCount += rootT * plain > plainMax ? 1 : 0;
            studentizedCount += rootT * upper > studentizedMax ? 1 : 0;
            // Ties count (T* ≥ T): they occur only at the floor 0, where no rule is ahead of the benchmark and the
            // p-value is 1. Counting only T* > T there would give SPA_c a spuriously small p when every rule is poor,
            // because its recentred draws sit at the floor too.
            upperCount += Math.Max(rootT * upper, 0.0) >= spaStatistic ? 1 : 0;
            lowerCount += Math.Max(rootT * lower, 0.0) >= spaStatistic ? 1 : 0;
            consistentCount += Math.Max(rootT * consistent, 0.0) >= spaStatistic ? 1 : 0;
        }

        return new Exceedances(spaStatistic, realityCount, studentizedCount, lowerCount, consistentCount, upperCount);
    }

    /// <summary>
    /// Romano &amp; Wolf (2005), the studentized StepM: at each step the critical value is the 1 − α bootstrap quantile of
    /// max over the rules not yet rejected of √T·(θ̂*_k,b − θ̂_k)/ω̂_k; every such rule with t_k above it is rejected;
    /// repeat until a step rejects nothing. ω̂_k is the full-sample bootstrap estimate, not re-estimated inside each
    /// replication.
    /// </summary>
    private static StepMResult StepDown(double[] deviations, int rules, int replications, double rootT, double[] inverse, double?[] tStatistics, double level)
    {
        var active = new List<int>(rules);
        for (var k = 0; k < rules; k++)
        {
            if (tStatistics[k] is not null)
            {
                active.Add(k);
            }
        }

        var rejected = ImmutableArray.CreateBuilder<int>();
        var rejectedAtStep = ImmutableArray.CreateBuilder<int>();
        var criticalValues = ImmutableArray.CreateBuilder<double>();
        var maxima = new double[replications];
        // The 1 − α quantile as the ⌈(1 − α)·B⌉-th smallest of the B maxima.
        var rank = Math.Clamp((int)Math.Ceiling((1.0 - level) * replications), 1, replications) - 1;
        var activeRules = new int[rules];
        var newly = new List<int>(rules);
        while (active.Count > 0)
        {
            var count = active.Count;
            active.CopyTo(activeRules);
            for (var b = 0; b < replications; b++)
            {
                var row = deviations.AsSpan(b * rules, rules);
                var max = double.NegativeInfinity;
                for (var i = 0; i < count; i++)
                {
                    var k = activeRules[i];
                    max = Math.Max(max, row[k] * inverse[k]);
                }

                maxima[b] = rootT * max;
            }

            Array.Sort(maxima);
            var critical = maxima[rank];
            criticalValues.Add(critical);
            newly.Clear();
            foreach (var k in active)
            {
                if (tStatistics[k]!.Value > critical)
                {
                    newly.Add(k);
                }
            }

            if (newly.Count == 0)
            {
                break;
            }

            newly.Sort((a, b) => tStatistics[b]!.Value.CompareTo(tStatistics[a]!.Value));
            foreach (var k in newly)
            {
                rejected.Add(k);
                rejectedAtStep.Add(criticalValues.Count);
                active.Remove(k);
            }
        }

        return new StepMResult(level, rejected.ToImmutable(), rejectedAtStep.ToImmutable(), criticalValues.ToImmutable());
    }

    /// <summary>The SPA statistic and the number of replications above each test's statistic.</summary>
    private readonly record struct Exceedances(double SpaStatistic, int Reality, int Studentized, int Lower, int Consistent, int Upper);
}
