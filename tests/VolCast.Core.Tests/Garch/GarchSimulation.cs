using VolCast.Core.Garch;

namespace VolCast.Core.Tests.Garch;

/// <summary>Seeded GARCH / GJR-GARCH paths with Gaussian shocks, for tests with known parameters.</summary>
internal static class GarchSimulation
{
    /// <summary>Simulates n returns after a burn-in of 500 days, starting at the long-run variance.</summary>
    public static double[] Returns(GarchParameters p, int n, int seed)
    {
        var random = new Random(seed);
        var h = p.LongRunVariance!.Value;
        var result = new double[n];
        for (var t = -500; t < n; t++)
        {
            var e = Math.Sqrt(h) * Gaussian.Next(random);
            if (t >= 0)
            {
                result[t] = p.Mu + e;
            }

            h = p.NextVariance(h, e);
        }

        return result;
    }

    /// <summary>Closing prices 100·exp(cumulative returns), with one more price than returns.</summary>
    public static double[] Closes(double[] returns)
    {
        var closes = new double[returns.Length + 1];
        closes[0] = 100;
        for (var i = 0; i < returns.Length; i++)
        {
            closes[i + 1] = closes[i] * Math.Exp(returns[i]);
        }

        return closes;
    }
}
