namespace VolCast.Core.Tests.Scoring;

/// <summary>Seeded simulated series for known-truth checks (invented data, only for statistical behaviour).</summary>
internal static class SimulatedSeries
{
    /// <summary>
    /// A zero-mean MA(h − 1) series d_t = Σ_{j=0..h−1} ε_{t−j}, ε i.i.d. N(0, 1): the dependence of a loss differential
    /// on overlapping h-day targets.
    /// </summary>
    public static double[] OverlappingSums(Random random, int count, int horizonDays)
    {
        var eps = new double[count + horizonDays - 1];
        for (var i = 0; i < eps.Length; i++)
        {
            eps[i] = Gaussian.Next(random);
        }

        var d = new double[count];
        for (var t = 0; t < count; t++)
        {
            for (var j = 0; j < horizonDays; j++)
            {
                d[t] += eps[t + j];
            }
        }

        return d;
    }
}
