using System.Buffers;
using System.Globalization;
using System.Numerics;

namespace VolCast.Core.Scoring;

/// <summary>
/// The model confidence set of Hansen, Lunde and Nason (2011) (docs/methods.md#model-confidence-set): starting from all models, test
/// equal predictive ability with a block-bootstrap statistic, eliminate the worst model while the test rejects,
/// and report each model's MCS p-value and whether it is in the (1 − α) set.
/// </summary>
/// <remarks>
/// <para>
/// Bootstrap: every replication b draws one sequence of blocks of dates (moving-block or stationary) and the mean
/// of each model's demeaned loss over the resampled dates, δ*_b,i = L̄*_b,i − L̄_i, is computed once for all models
/// from prefix sums (one addition per block and model, not per date). Every elimination step reuses these
/// means, since d̄*_i and d̄*_ij are linear in them. se(d̄_i)² = (1/B) Σ_b (d̄*_b,i − d̄_i)², centred at the sample
/// value as in the paper.
/// </para>
/// <para>
/// Default statistic T_max (cheap, O(B k) per step): t_i = d̄_i / se(d̄_i), d_i,t = L_i,t − mean over the set at t;
/// T_R = max |t_ij| is the alternative. The elimination p-value is the share of replications whose centred
/// statistic is at least the observed one. A model's MCS p-value is the running maximum of elimination p-values up
/// to its own elimination; the final survivor has 1; a model is in the set when its MCS p-value is at least α.
/// Comparisons whose bootstrap variance is zero (identical loss series) are left out; when none remain the
/// remaining models are kept with p-value 1.
/// </para>
/// </remarks>
public static class ModelConfidenceSet
{
    /// <summary>Computes the model confidence set from one loss series per model.</summary>
    /// <param name="lossesByModel">One array of per-date losses per model, all over the same T dates (for example QLIKE).</param>
    /// <param name="options">Size, bootstrap, statistic and seed.</param>
    /// <returns>Each model's MCS p-value and membership, in the order given.</returns>
    /// <exception cref="ArgumentNullException">An argument or a series is null.</exception>
    /// <exception cref="ArgumentException">No models, series of different lengths, fewer than 2 dates, or a block longer than the sample.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A loss is not finite.</exception>
    public static ModelConfidenceSetResult Compute(IReadOnlyList<double[]> lossesByModel, ModelConfidenceSetOptions options)
    {
        ArgumentNullException.ThrowIfNull(lossesByModel);
        ArgumentNullException.ThrowIfNull(options);
        Preconditions.CountAtLeast(lossesByModel.Count, 1, "(models)", nameof(lossesByModel));
        var m = lossesByModel.Count;
        for (var i = 0; i < lossesByModel.Count; i++)
        {
            ArgumentNullException.ThrowIfNull(lossesByModel[i], string.Create(CultureInfo.InvariantCulture, $"{nameof(lossesByModel)}[{i}]"));
        }

        var n = lossesByModel[0].Length;
        // Pooled: at the default backtest's size this is megabytes, which would otherwise go to the large-object heap.
        var matrix = ArrayPool<double>.Shared.Rent(n * m);
        try
        {
            for (var i = 0; i < m; i++)
            {
                var series = lossesByModel[i];
                Preconditions.SameLength(series.Length, n, "model 0's losses", string.Create(CultureInfo.InvariantCulture, $"{nameof(lossesByModel)}[{i}]"));
                for (var t = 0; t < n; t++)
                {
                    matrix[(t * m) + i] = series[t];
                }
            }

            return Compute(matrix.AsSpan(0, n * m), m, options);
        }
        finally
        {
            ArrayPool<double>.Shared.Return(matrix);
        }
    }

    /// <summary>Computes the model confidence set from a loss matrix.</summary>
    /// <param name="losses">Losses, row-major T × m: row t holds every model's loss at date t.</param>
    /// <param name="modelCount">m, the number of models, at least 1.</param>
    /// <param name="options">Size, bootstrap, statistic and seed.</param>
    /// <returns>Each model's MCS p-value and membership, by column.</returns>
    /// <exception cref="ArgumentNullException"><paramref name="options"/> is null.</exception>
    /// <exception cref="ArgumentException">The matrix is not T × m, fewer than 2 dates, or a block longer than the sample.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A loss is not finite, or <paramref name="modelCount"/> is below 1.</exception>
    public static ModelConfidenceSetResult Compute(ReadOnlySpan<double> losses, int modelCount, ModelConfidenceSetOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentOutOfRangeException.ThrowIfLessThan(modelCount, 1);
        var m = modelCount;
        if (losses.Length % m != 0)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"losses must hold T rows of {m} models, but its length {losses.Length} is not a multiple of {m}."), nameof(losses));
        }

        var n = losses.Length / m;
        Preconditions.CountAtLeast(n, 2, "(dates) for a model confidence set", nameof(losses));
        if (options.BlockLength > n)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"The bootstrap block length ({options.BlockLength}) must not exceed the number of dates ({n})."), nameof(options));
        }

        var means = new double[m];
        var scale = 0.0;
        for (var t = 0; t < n; t++)
        {
            var row = losses.Slice(t * m, m);
            for (var i = 0; i < m; i++)
            {
                Preconditions.FiniteAt(row[i], (t * m) + i, nameof(losses));
                means[i] += row[i];
                scale = Math.Max(scale, Math.Abs(row[i]));
            }
        }

        for (var i = 0; i < m; i++)
        {
            means[i] /= n;
        }

        var boot = BootstrapMeanDeviations(losses, m, means, options);
        // Below this a bootstrap variance of a mean is rounding noise: the series compared are identical.
        var varianceFloor = Math.Pow(1e-13 * Math.Max(scale, double.Epsilon), 2);
        return options.Statistic == ModelConfidenceSetStatistic.TMax
            ? Eliminate(n, m, options, (int[] active, int k, out int worst) => StepMax(boot, means, m, options.BootstrapReplications, varianceFloor, active, k, out worst))
            : EliminateRange(n, m, options, boot, means, varianceFloor);
    }

    private delegate double? Step(int[] active, int count, out int worst);

    /// <summary>
    /// δ*_b,i = (1/T) Σ over resampled dates of (L_t,i − L̄_i), for every replication b and model i (row-major B × m).
    /// </summary>
    internal static double[] BootstrapMeanDeviations(ReadOnlySpan<double> losses, int m, ReadOnlySpan<double> means, ModelConfidenceSetOptions options)
    {
        var n = losses.Length / m;
        // Time-major prefix sums of the demeaned losses: a block's sum for every model is one subtraction per model.
        var prefix = ArrayPool<double>.Shared.Rent((n + 1) * m);
        prefix.AsSpan(0, m).Clear();
        for (var t = 0; t < n; t++)
        {
            var row = losses.Slice(t * m, m);
            var from = prefix.AsSpan(t * m, m);
            var to = prefix.AsSpan((t + 1) * m, m);
            for (var i = 0; i < m; i++)
            {
                to[i] = from[i] + (row[i] - means[i]);
            }
        }

        var replications = options.BootstrapReplications;
        var boot = new double[replications * m];
        var random = new Random(options.Seed);
        var blockLength = options.BlockLength;
        var stationary = options.Bootstrap == BootstrapScheme.Stationary;
        var logStay = blockLength > 1 ? Math.Log(1.0 - (1.0 / blockLength)) : 0.0;
        for (var b = 0; b < replications; b++)
        {
            var sums = boot.AsSpan(b * m, m);
            var filled = 0;
            while (filled < n)
            {
                int start, length;
                if (stationary)
                {
                    start = random.Next(n);
                    // Geometric length with mean blockLength: 1 + floor(ln U / ln(1 − 1/b)), U in (0, 1].
                    length = blockLength == 1 ? 1 : 1 + (int)Math.Min(n, Math.Floor(Math.Log(1.0 - random.NextDouble()) / logStay));
                }
                else
                {
                    start = random.Next(n - blockLength + 1);
                    length = blockLength;
                }

                length = Math.Min(length, n - filled);
                if (start + length <= n)
                {
                    AddSegment(prefix, m, start, length, sums);
                }
                else
                {
                    // Stationary blocks wrap around the end of the sample.
                    AddSegment(prefix, m, start, n - start, sums);
                    AddSegment(prefix, m, 0, start + length - n, sums);
                }

                filled += length;
            }

            for (var i = 0; i < m; i++)
            {
                sums[i] /= n;
            }
        }

        ArrayPool<double>.Shared.Return(prefix);
        return boot;
    }

    private static void AddSegment(double[] prefix, int m, int start, int length, Span<double> sums)
    {
        var from = prefix.AsSpan(start * m, m);
        var to = prefix.AsSpan((start + length) * m, m);
        var i = 0;
        // Element-wise, so vector width does not change the result.
        if (Vector.IsHardwareAccelerated)
        {
            var width = Vector<double>.Count;
            for (; i + width <= m; i += width)
            {
                var s = new Vector<double>(sums.Slice(i, width)) + (new Vector<double>(to.Slice(i, width)) - new Vector<double>(from.Slice(i, width)));
                s.CopyTo(sums.Slice(i, width));
            }
        }

        for (; i < m; i++)
        {
            sums[i] += to[i] - from[i];
        }
    }

    private static ModelConfidenceSetResult Eliminate(int n, int m, ModelConfidenceSetOptions options, Step step)
    {
        var active = new int[m];
        for (var i = 0; i < m; i++)
        {
            active[i] = i;
        }

        var k = m;
        var pValues = new double[m];
        var order = new List<int>(m);
        var stepPValues = new List<double>(m);
        var running = 0.0;
        while (k > 1)
        {
            var p = step(active, k, out var worst);
            if (p is null)
            {
                // No comparison left has any bootstrap variation: the rest are indistinguishable and stay.
                break;
            }

            running = Math.Max(running, p.Value);
            pValues[worst] = running;
            order.Add(worst);
            stepPValues.Add(p.Value);
            var position = Array.IndexOf(active, worst, 0, k);
            Array.Copy(active, position + 1, active, position, k - position - 1);
            k--;
        }

        for (var r = 0; r < k; r++)
        {
            pValues[active[r]] = 1.0;
            order.Add(active[r]);
            stepPValues.Add(1.0);
        }

        var inSet = new bool[m];
        for (var i = 0; i < m; i++)
        {
            inSet[i] = pValues[i] >= options.Alpha;
        }

        return new ModelConfidenceSetResult(n, [.. pValues], [.. inSet], [.. order], [.. stepPValues], options);
    }

    private static double? StepMax(double[] boot, double[] means, int m, int replications, double varianceFloor, int[] active, int k, out int worst)
    {
        worst = -1;
        var meanOfSet = 0.0;
        for (var r = 0; r < k; r++)
        {
            meanOfSet += means[active[r]];
        }

        meanOfSet /= k;
        var variance = new double[k];
        for (var b = 0; b < replications; b++)
        {
            var row = boot.AsSpan(b * m, m);
            var centre = 0.0;
            for (var r = 0; r < k; r++)
            {
                centre += row[active[r]];
            }

            centre /= k;
            for (var r = 0; r < k; r++)
            {
                var z = row[active[r]] - centre;
                variance[r] += z * z;
            }
        }

        var inverseSe = new double[k];
        var observed = double.NegativeInfinity;
        for (var r = 0; r < k; r++)
        {
            variance[r] /= replications;
            if (variance[r] > varianceFloor)
            {
                inverseSe[r] = 1.0 / Math.Sqrt(variance[r]);
                var t = (means[active[r]] - meanOfSet) * inverseSe[r];
                if (t > observed)
                {
                    observed = t;
                    worst = active[r];
                }
            }
        }

        if (worst < 0)
        {
            return null;
        }

        var exceed = 0;
        for (var b = 0; b < replications; b++)
        {
            var row = boot.AsSpan(b * m, m);
            var centre = 0.0;
            for (var r = 0; r < k; r++)
            {
                centre += row[active[r]];
            }

            centre /= k;
            var max = double.NegativeInfinity;
            for (var r = 0; r < k; r++)
            {
                if (inverseSe[r] > 0)
                {
                    max = Math.Max(max, (row[active[r]] - centre) * inverseSe[r]);
                }
            }

            if (max >= observed)
            {
                exceed++;
            }
        }

        return (double)exceed / replications;
    }

    private static ModelConfidenceSetResult EliminateRange(int n, int m, ModelConfidenceSetOptions options, double[] boot, double[] means, double varianceFloor)
    {
        // se(d̄_ij) does not depend on the set, so all pairs are estimated once: O(B m²/2).
        var replications = options.BootstrapReplications;
        var pairVariance = new double[m * m];
        for (var b = 0; b < replications; b++)
        {
            var row = boot.AsSpan(b * m, m);
            for (var i = 0; i < m; i++)
            {
                for (var j = i + 1; j < m; j++)
                {
                    var z = row[i] - row[j];
                    pairVariance[(i * m) + j] += z * z;
                }
            }
        }

        var inverseSe = new double[m * m];
        for (var i = 0; i < m; i++)
        {
            for (var j = i + 1; j < m; j++)
            {
                var v = pairVariance[(i * m) + j] / replications;
                var w = v > varianceFloor ? 1.0 / Math.Sqrt(v) : 0.0;
                inverseSe[(i * m) + j] = w;
                inverseSe[(j * m) + i] = w;
            }
        }

        return Eliminate(n, m, options, (int[] active, int k, out int worst) => StepRange(boot, means, inverseSe, m, replications, active, k, out worst));
    }

    private static double? StepRange(double[] boot, double[] means, double[] inverseSe, int m, int replications, int[] active, int k, out int worst)
    {
        worst = -1;
        var observed = double.NegativeInfinity;
        var worstScore = double.NegativeInfinity;
        for (var r = 0; r < k; r++)
        {
            var i = active[r];
            for (var s = 0; s < k; s++)
            {
                var j = active[s];
                var w = inverseSe[(i * m) + j];
                if (i == j || w == 0)
                {
                    continue;
                }

                var t = (means[i] - means[j]) * w;
                observed = Math.Max(observed, Math.Abs(t));
                if (t > worstScore)
                {
                    worstScore = t;
                    worst = i;
                }
            }
        }

        if (worst < 0)
        {
            return null;
        }

        var exceed = 0;
        for (var b = 0; b < replications; b++)
        {
            var row = boot.AsSpan(b * m, m);
            var max = 0.0;
            for (var r = 0; r < k; r++)
            {
                var i = active[r];
                var zi = row[i];
                var weights = inverseSe.AsSpan(i * m, m);
                for (var s = r + 1; s < k; s++)
                {
                    var j = active[s];
                    max = Math.Max(max, Math.Abs(zi - row[j]) * weights[j]);
                }
            }

            if (max >= observed)
            {
                exceed++;
            }
        }

        return (double)exceed / replications;
    }
}
