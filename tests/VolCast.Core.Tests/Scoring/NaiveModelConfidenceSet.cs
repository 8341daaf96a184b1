using VolCast.Core.Scoring;

namespace VolCast.Core.Tests.Scoring;

/// <summary>
/// A deliberately plain model confidence set (Hansen, Lunde and Nason 2011) used as the reference for the fast one:
/// explicit resampled date indices per replication (same random draws), and every elimination step recomputed
/// from the loss series. Slow; tests only.
/// </summary>
internal static class NaiveModelConfidenceSet
{
    public static (double[] PValues, int[] Order) Compute(double[][] losses, ModelConfidenceSetOptions options)
    {
        var m = losses.Length;
        var n = losses[0].Length;
        var indices = DrawIndices(n, options);
        var active = Enumerable.Range(0, m).ToList();
        var pValues = new double[m];
        var order = new List<int>();
        var running = 0.0;
        while (active.Count > 1)
        {
            var (p, worst) = options.Statistic == ModelConfidenceSetStatistic.TMax
                ? StepMax(losses, active, indices, n)
                : StepRange(losses, active, indices, n);
            running = Math.Max(running, p);
            pValues[worst] = running;
            order.Add(worst);
            active.Remove(worst);
        }

        pValues[active[0]] = 1.0;
        order.Add(active[0]);
        return (pValues, order.ToArray());
    }

    private static (double P, int Worst) StepMax(double[][] losses, List<int> active, int[][] indices, int n)
    {
        // d_i,t = L_i,t − mean over the set at t.
        var d = active.Select(i => Enumerable.Range(0, n).Select(t => losses[i][t] - active.Average(j => losses[j][t])).ToArray()).ToArray();
        var dBar = d.Select(s => s.Average()).ToArray();
        var boot = indices.Select(idx => d.Select(s => idx.Average(t => s[t])).ToArray()).ToArray();
        var se = Enumerable.Range(0, active.Count).Select(r => Math.Sqrt(boot.Average(b => Math.Pow(b[r] - dBar[r], 2)))).ToArray();
        var t = Enumerable.Range(0, active.Count).Select(r => dBar[r] / se[r]).ToArray();
        var observed = t.Max();
        var worst = active[Array.IndexOf(t, observed)];
        var exceed = boot.Count(b => Enumerable.Range(0, active.Count).Max(r => (b[r] - dBar[r]) / se[r]) >= observed);
        return ((double)exceed / indices.Length, worst);
    }

    private static (double P, int Worst) StepRange(double[][] losses, List<int> active, int[][] indices, int n)
    {
        var k = active.Count;
        var mean = active.Select(i => losses[i].Average()).ToArray();
        var boot = indices.Select(idx => active.Select(i => idx.Average(t => losses[i][t])).ToArray()).ToArray();
        var se = new double[k, k];
        var observed = double.NegativeInfinity;
        var worstScore = double.NegativeInfinity;
        var worst = -1;
        for (var a = 0; a < k; a++)
        {
            for (var b = 0; b < k; b++)
            {
                if (a == b)
                {
                    continue;
                }

                var dij = mean[a] - mean[b];
                se[a, b] = Math.Sqrt(boot.Average(x => Math.Pow(x[a] - x[b] - dij, 2)));
                var tij = dij / se[a, b];
                observed = Math.Max(observed, Math.Abs(tij));
                if (tij > worstScore)
                {
                    worstScore = tij;
                    worst = active[a];
                }
            }
        }

        var exceed = boot.Count(x =>
        {
            var max = 0.0;
            for (var a = 0; a < k; a++)
            {
                for (var b = a + 1; b < k; b++)
                {
                    max = Math.Max(max, Math.Abs(x[a] - x[b] - (mean[a] - mean[b])) / se[a, b]);
                }
            }

            return max >= observed;
        });
        return ((double)exceed / indices.Length, worst);
    }

    private static int[][] DrawIndices(int n, ModelConfidenceSetOptions options)
    {
        // The same draws as the specification of the scheme: moving blocks start in 0..n−b; stationary blocks start
        // anywhere, have length 1 + floor(ln U / ln(1 − 1/b)) with U = 1 − NextDouble(), and wrap around.
        var random = new Random(options.Seed);
        var result = new int[options.BootstrapReplications][];
        var b = options.BlockLength;
        for (var r = 0; r < result.Length; r++)
        {
            var idx = new List<int>(n);
            while (idx.Count < n)
            {
                int start, length;
                if (options.Bootstrap == BootstrapScheme.Stationary)
                {
                    start = random.Next(n);
                    length = b == 1 ? 1 : 1 + (int)Math.Min(n, Math.Floor(Math.Log(1.0 - random.NextDouble()) / Math.Log(1.0 - (1.0 / b))));
                }
                else
                {
                    start = random.Next(n - b + 1);
                    length = b;
                }

                length = Math.Min(length, n - idx.Count);
                for (var q = 0; q < length; q++)
                {
                    idx.Add((start + q) % n);
                }
            }

            result[r] = idx.ToArray();
        }

        return result;
    }
}
