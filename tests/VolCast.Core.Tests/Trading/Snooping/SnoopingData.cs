using VolCast.Core.Tests.Scoring;

namespace VolCast.Core.Tests.Trading.Snooping;

/// <summary>
/// Seeded simulated daily P&amp;L differences of a rule search (invented data, only for the tests' statistical
/// behaviour): each rule's series is its mean plus a scaled mix of one factor common to all rules and its own noise,
/// both MA(h − 1) like the P&amp;L of overlapping h-day trades, so neighbouring rules and days are correlated.
/// </summary>
internal static class SnoopingData
{
    /// <summary>K rows of T days: row k has mean means[k], standard deviation scales[k] and correlation rho with the others.</summary>
    public static double[][] Differences(Random random, int days, int horizon, double[] means, double[] scales, double rho)
    {
        var common = Normalized(random, days, horizon);
        var rows = new double[means.Length][];
        for (var k = 0; k < means.Length; k++)
        {
            var own = Normalized(random, days, horizon);
            rows[k] = new double[days];
            for (var t = 0; t < days; t++)
            {
                rows[k][t] = means[k] + (scales[k] * ((Math.Sqrt(rho) * common[t]) + (Math.Sqrt(1 - rho) * own[t])));
            }
        }

        return rows;
    }

    /// <summary>K rows of T days with the same mean and unit scale.</summary>
    public static double[][] Differences(Random random, int days, int horizon, int rules, double mean, double rho)
    {
        return Differences(random, days, horizon, Filled(rules, mean), Filled(rules, 1.0), rho);
    }

    /// <summary>An array of n copies of a value.</summary>
    public static double[] Filled(int n, double value)
    {
        var a = new double[n];
        Array.Fill(a, value);
        return a;
    }

    /// <summary>A zero-mean MA(h − 1) series with unit variance.</summary>
    public static double[] Normalized(Random random, int days, int horizon)
    {
        var series = SimulatedSeries.OverlappingSums(random, days, horizon);
        var scale = 1.0 / Math.Sqrt(horizon);
        for (var t = 0; t < days; t++)
        {
            series[t] *= scale;
        }

        return series;
    }
}
