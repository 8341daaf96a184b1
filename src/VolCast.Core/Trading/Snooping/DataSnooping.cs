using System.Buffers;
using System.Globalization;

namespace VolCast.Core.Trading.Snooping;

/// <summary>
/// Tests whether the best of K rules searched (thresholds × forecasters × sides) beats the benchmark rule
/// (always sell) once the search itself is accounted for: White's (2000) Reality Check, Hansen's (2005) SPA test and
/// Romano &amp; Wolf's (2005) StepM, on mean daily P&amp;L differences or on Sharpe ratios (Sullivan, Timmermann &amp;
/// White 1999), with the stationary bootstrap of Politis &amp; Romano (1994).
/// </summary>
/// <remarks>
/// <para>
/// The bootstrap resamples are drawn once (<see cref="Draw"/>) and can be passed to both tests, so the mean and the
/// Sharpe tests see the same resampled dates. The overloads that take <see cref="DataSnoopingOptions"/> draw them
/// from the options: the draws depend only on (T, L, B, seed), not on the data or the number of rules.
/// </para>
/// <para>
/// ω̂_k, the standard deviation of √T·θ̂_k that studentizes the SPA and StepM statistics, is estimated from the same
/// bootstrap draws, ω̂²_k = (T/B)·Σ_b (θ̂*_k,b − θ̂_k)², as Hansen (2005) does; not from the stationary bootstrap's
/// analytic kernel (which gives the same quantity up to Monte Carlo error, and is what a test checks it against).
/// </para>
/// </remarks>
internal static class DataSnooping
{
    /// <summary>Draws the stationary-bootstrap resamples for T dates with the options' L, B and seed.</summary>
    /// <param name="days">Number of dates T, at least 2.</param>
    /// <param name="options">The settings.</param>
    /// <returns>The draws, to pass to <see cref="TestMeans(double[][], StationaryBootstrapDraws, double)"/> and <see cref="TestSharpeRatios(double[][], double[], StationaryBootstrapDraws, double)"/>.</returns>
    /// <exception cref="ArgumentOutOfRangeException">T is below 2.</exception>
    public static StationaryBootstrapDraws Draw(int days, DataSnoopingOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        return StationaryBootstrap.Draw(days, options.MeanBlockLength, options.Replications, options.Seed);
    }

    /// <summary>Tests H0: max_k E[d_k] ≤ 0 on the daily net P&amp;L differences d (rule k minus the benchmark).</summary>
    /// <param name="differences">K rows (rules) of T daily values d_k,t = P&amp;L of rule k − P&amp;L of the benchmark on day t, the same dates in every row.</param>
    /// <param name="options">The settings.</param>
    /// <returns>The Reality Check, SPA and StepM results on θ_k = E[d_k].</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">No rule, fewer than 2 days, rows of different lengths, or a value that is not finite.</exception>
    public static DataSnoopingResult TestMeans(double[][] differences, DataSnoopingOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var days = SnoopingGuard.Rectangular(differences, nameof(differences));
        return TestMeans(differences, Draw(days, options), options.Level);
    }

    /// <summary>Tests H0: max_k E[d_k] ≤ 0 with resamples already drawn (shared with other tests).</summary>
    /// <param name="differences">K rows (rules) of T daily values d_k,t, rule k minus the benchmark.</param>
    /// <param name="draws">Stationary-bootstrap draws for T dates.</param>
    /// <param name="level">StepM's familywise error rate, in (0, 1).</param>
    /// <returns>The Reality Check, SPA and StepM results on θ_k = E[d_k].</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">Bad shape, a value that is not finite, or draws for another number of dates.</exception>
    /// <exception cref="ArgumentOutOfRangeException">The level is outside (0, 1).</exception>
    public static DataSnoopingResult TestMeans(double[][] differences, StationaryBootstrapDraws draws, double level)
    {
        var days = SnoopingGuard.Rectangular(differences, nameof(differences));
        SnoopingGuard.DrawsMatch(draws, days, nameof(draws));
        SnoopingGuard.Level(level, nameof(level));
        for (var k = 0; k < differences.Length; k++)
        {
            SnoopingGuard.Finite(differences[k], nameof(differences), k);
        }

        return Means(new Rows(differences, null, 0), differences.Length, days, draws, level);
    }

    /// <summary>Tests H0: max_k E[d_k] ≤ 0 on a flat rule-major array (rule k's T days at k·T … k·T + T − 1).</summary>
    /// <param name="differences">K·T values, rule-major.</param>
    /// <param name="rules">Number of rules K, at least 1.</param>
    /// <param name="days">Number of dates T, at least 2.</param>
    /// <param name="options">The settings.</param>
    /// <returns>The Reality Check, SPA and StepM results on θ_k = E[d_k].</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">The length is not K·T, no rule, fewer than 2 days, or a value that is not finite.</exception>
    public static DataSnoopingResult TestMeans(double[] differences, int rules, int days, DataSnoopingOptions options)
    {
        ArgumentNullException.ThrowIfNull(differences);
        ArgumentNullException.ThrowIfNull(options);
        SnoopingGuard.Rules(rules, nameof(rules));
        SnoopingGuard.Days(days, nameof(days));
        if (differences.LongLength != (long)rules * days)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"differences must hold rules × days = {rules} × {days} = {(long)rules * days} values (rule-major), was {differences.LongLength}."), nameof(differences));
        }

        for (var k = 0; k < rules; k++)
        {
            SnoopingGuard.Finite(differences.AsSpan(k * days, days), nameof(differences), k);
        }

        return Means(new Rows(null, differences, days), rules, days, Draw(days, options), options.Level);
    }

    /// <summary>
    /// Tests H0: max_k (SR_k − SR_0) ≤ 0, SR the daily Sharpe ratio (mean over sample standard deviation, divisor T − 1)
    /// of a P&amp;L path, k a rule and 0 the benchmark (Sullivan, Timmermann &amp; White 1999).
    /// </summary>
    /// <param name="rulePaths">K rows of T daily net P&amp;L values, one per rule (not differences: each rule's own path).</param>
    /// <param name="benchmarkPath">The benchmark's (always sell) T daily net P&amp;L values on the same dates.</param>
    /// <param name="options">The settings.</param>
    /// <returns>The Reality Check, SPA and StepM results on θ_k = SR_k − SR_0 (per day, not annualized).</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">Bad shape, a value that is not finite, or a path with no variation (its Sharpe ratio is undefined).</exception>
    public static DataSnoopingResult TestSharpeRatios(double[][] rulePaths, double[] benchmarkPath, DataSnoopingOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var days = SnoopingGuard.Rectangular(rulePaths, nameof(rulePaths));
        return TestSharpeRatios(rulePaths, benchmarkPath, Draw(days, options), options.Level);
    }

    /// <summary>Tests H0: max_k (SR_k − SR_0) ≤ 0 with resamples already drawn (shared with other tests).</summary>
    /// <param name="rulePaths">K rows of T daily net P&amp;L values, one per rule.</param>
    /// <param name="benchmarkPath">The benchmark's T daily net P&amp;L values on the same dates.</param>
    /// <param name="draws">Stationary-bootstrap draws for T dates.</param>
    /// <param name="level">StepM's familywise error rate, in (0, 1).</param>
    /// <returns>The Reality Check, SPA and StepM results on θ_k = SR_k − SR_0 (per day, not annualized).</returns>
    /// <remarks>
    /// Each replication resamples the rules' and the benchmark's paths on the same dates (jointly) and recomputes every
    /// Sharpe ratio from the resampled path; a resampled path with no variation (a rule that rarely trades, resampled
    /// on its idle days only) counts as a Sharpe ratio of 0.
    /// </remarks>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">Bad shape, a value that is not finite, a path with no variation, or draws for another number of dates.</exception>
    /// <exception cref="ArgumentOutOfRangeException">The level is outside (0, 1).</exception>
    public static DataSnoopingResult TestSharpeRatios(double[][] rulePaths, double[] benchmarkPath, StationaryBootstrapDraws draws, double level)
    {
        var days = SnoopingGuard.Rectangular(rulePaths, nameof(rulePaths));
        ArgumentNullException.ThrowIfNull(benchmarkPath);
        if (benchmarkPath.Length != days)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"benchmarkPath has {benchmarkPath.Length} days but the rule paths have {days}: both must cover the same dates."), nameof(benchmarkPath));
        }

        SnoopingGuard.DrawsMatch(draws, days, nameof(draws));
        SnoopingGuard.Level(level, nameof(level));
        for (var k = 0; k < rulePaths.Length; k++)
        {
            SnoopingGuard.Finite(rulePaths[k], nameof(rulePaths), k);
        }

        SnoopingGuard.Finite(benchmarkPath, nameof(benchmarkPath), 0);
        return Sharpe(rulePaths, benchmarkPath, days, draws, level);
    }

    private static DataSnoopingResult Means(Rows rows, int rules, int days, StationaryBootstrapDraws draws, double level)
    {
        var estimates = new double[rules];
        var prefix = BlockSums.RentPrefix(days, rules);
        var scale = 0.0;
        try
        {
            for (var k = 0; k < rules; k++)
            {
                var row = rows.Row(k);
                var sum = 0.0;
                for (var t = 0; t < row.Length; t++)
                {
                    sum += row[t];
                    scale = Math.Max(scale, Math.Abs(row[t]));
                }

                estimates[k] = sum / days;
                // Demeaned, so a replication's sum divided by T is θ̂*_k − θ̂_k directly.
                BlockSums.FillColumn(prefix, rules, k, row, estimates[k], 1);
            }

            var replications = draws.Replications;
            var deviations = new double[replications * rules];
            var (starts, lengths, offsets) = draws.Blocks;
            for (var b = 0; b < replications; b++)
            {
                var sums = deviations.AsSpan(b * rules, rules);
                BlockSums.Replication(starts, lengths, offsets[b], offsets[b + 1], days, prefix, rules, sums);
                for (var k = 0; k < rules; k++)
                {
                    sums[k] /= days;
                }
            }

            return SnoopingInference.Run(SnoopingMeasure.MeanDifference, days, estimates, deviations, draws, level, scale);
        }
        finally
        {
            ArrayPool<double>.Shared.Return(prefix);
        }
    }

    private static DataSnoopingResult Sharpe(double[][] rulePaths, double[] benchmarkPath, int days, StationaryBootstrapDraws draws, double level)
    {
        var rules = rulePaths.Length;
        var columns = rules + 1;
        var means = new double[columns];
        var variances = new double[columns];
        var sharpe = new double[columns];
        var sums = BlockSums.RentPrefix(days, columns);
        var squares = BlockSums.RentPrefix(days, columns);
        var work = ArrayPool<double>.Shared.Rent(2 * columns);
        try
        {
            for (var j = 0; j < columns; j++)
            {
                ReadOnlySpan<double> path = j < rules ? rulePaths[j] : benchmarkPath;
                var sum = 0.0;
                for (var t = 0; t < days; t++)
                {
                    sum += path[t];
                }

                means[j] = sum / days;
                var squared = 0.0;
                for (var t = 0; t < days; t++)
                {
                    var z = path[t] - means[j];
                    squared += z * z;
                }

                variances[j] = squared / (days - 1);
                if (!(variances[j] > 0))
                {
                    var name = j < rules ? string.Create(CultureInfo.InvariantCulture, $"rulePaths[{j}]") : "benchmarkPath";
                    throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                        $"{name} is the same value ({path[0]}) on every day, so its Sharpe ratio is undefined: leave a rule that never trades out of the Sharpe test."),
                        j < rules ? nameof(rulePaths) : nameof(benchmarkPath));
                }

                sharpe[j] = means[j] / Math.Sqrt(variances[j]);
                BlockSums.FillColumn(sums, columns, j, path, means[j], 1);
                BlockSums.FillColumn(squares, columns, j, path, means[j], 2);
            }

            var estimates = new double[rules];
            for (var k = 0; k < rules; k++)
            {
                estimates[k] = sharpe[k] - sharpe[rules];
            }

            var replications = draws.Replications;
            var deviations = new double[replications * rules];
            var (starts, lengths, offsets) = draws.Blocks;
            var first = work.AsSpan(0, columns);
            var second = work.AsSpan(columns, columns);
            for (var b = 0; b < replications; b++)
            {
                BlockSums.Replication(starts, lengths, offsets[b], offsets[b + 1], days, sums, columns, first);
                BlockSums.Replication(starts, lengths, offsets[b], offsets[b + 1], days, squares, columns, second);
                // first and second become each column's resampled Sharpe ratio in place.
                for (var j = 0; j < columns; j++)
                {
                    var shift = first[j] / days;
                    var variance = (second[j] - (first[j] * shift)) / (days - 1);
                    // A resampled path without variation (relative to the sample's) has a Sharpe ratio of 0.
                    first[j] = variance > 1e-12 * variances[j] ? (means[j] + shift) / Math.Sqrt(variance) : 0.0;
                }

                var row = deviations.AsSpan(b * rules, rules);
                var benchmark = first[rules];
                for (var k = 0; k < rules; k++)
                {
                    row[k] = first[k] - benchmark - estimates[k];
                }
            }

            return SnoopingInference.Run(SnoopingMeasure.SharpeDifference, days, estimates, deviations, draws, level, 1.0);
        }
        finally
        {
            ArrayPool<double>.Shared.Return(sums);
            ArrayPool<double>.Shared.Return(squares);
            ArrayPool<double>.Shared.Return(work);
        }
    }

    /// <summary>The rows of the input, from a jagged or a flat rule-major array.</summary>
    private readonly struct Rows(double[][]? jagged, double[]? flat, int days)
    {
        public ReadOnlySpan<double> Row(int k) => jagged is not null ? jagged[k] : flat.AsSpan(k * days, days);
    }
}
