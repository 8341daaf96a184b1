using System.Collections.Immutable;
using VolCast.Core.Scoring;

namespace VolCast.Core.Backtest;

/// <summary>Computes the rows of <see cref="RuleTestResult"/>.</summary>
internal static class RuleTest
{
    public static ImmutableArray<RuleTestRow> Rows(
        string source, IReadOnlyList<int> dates, double?[] implied, double?[] forecast, double?[] realized, double threshold, int lag)
    {
        var all = new List<int>();
        var sell = new List<int>();
        var buy = new List<int>();
        foreach (var t in dates)
        {
            var gap = implied[t]!.Value - forecast[t]!.Value;
            all.Add(t);
            if (gap > threshold)
            {
                sell.Add(t);
            }
            else if (-gap > threshold)
            {
                buy.Add(t);
            }
        }

        return
        [
            Row(source, RuleSignal.AllDates, all, implied, realized, lag),
            Row(source, RuleSignal.SellVolatility, sell, implied, realized, lag),
            Row(source, RuleSignal.BuyVolatility, buy, implied, realized, lag),
        ];
    }

    private static RuleTestRow Row(string source, RuleSignal signal, List<int> dates, double?[] implied, double?[] realized, int lag)
    {
        var n = dates.Count;
        if (n == 0)
        {
            return new RuleTestRow(source, signal, 0, null, null, null, null, null, null);
        }

        var hit = new double[n];
        var vol = new double[n];
        var variance = new double[n];
        for (var i = 0; i < n; i++)
        {
            var iv = implied[dates[i]]!.Value;
            var rv = realized[dates[i]]!.Value;
            var right = signal == RuleSignal.BuyVolatility ? iv < rv : iv > rv;
            hit[i] = right ? 1 : 0;
            vol[i] = iv - rv;
            variance[i] = (iv * iv) - (rv * rv);
        }

        var (hitMean, hitSe) = MeanAndError(hit, lag);
        var (volMean, volSe) = MeanAndError(vol, lag);
        var (varMean, varSe) = MeanAndError(variance, lag);
        return new RuleTestRow(source, signal, n, hitMean, hitSe, volMean, volSe, varMean, varSe);
    }

    /// <summary>The mean and its Newey-West standard error √(LRV / n) (Bartlett, the lag capped at n − 1); no error with fewer than 2 values.</summary>
    private static (double Mean, double? Error) MeanAndError(double[] values, int lag)
    {
        double sum = 0;
        for (var i = 0; i < values.Length; i++)
        {
            sum += values[i];
        }

        var mean = sum / values.Length;
        if (values.Length < 2)
        {
            return (mean, null);
        }

        var lrv = NeweyWest.LongRunVariance(values, Math.Min(lag, values.Length - 1));
        return (mean, lrv >= 0 ? Math.Sqrt(lrv / values.Length) : null);
    }
}
