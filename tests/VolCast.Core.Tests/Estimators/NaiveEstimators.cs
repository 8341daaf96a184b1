using VolCast.Core.Data;
using VolCast.Core.Estimators;

namespace VolCast.Core.Tests.Estimators;

/// <summary>
/// The reference for the rolling implementation: every window recomputed from the prices directly, O(n·N),
/// with two-pass (mean first) sample variances and the formulas written out as in docs/methods.md#parkinson to #yang-zhang and docs/methods.md#close-to-close-and-annualisation.
/// Shared with the benchmarks as their baseline.
/// </summary>
public static class NaiveEstimators
{
    /// <summary>Daily variance of one estimator for the window of <paramref name="window"/> bars ending at index <paramref name="end"/>.</summary>
    public static double DailyVariance(PriceHistory prices, Estimator estimator, int window, int end, bool zeroMean = false)
    {
        var start = end - window + 1;
        var close = prices.Close;
        switch (estimator)
        {
            case Estimator.CloseToClose:
                {
                    var r = new double[window];
                    for (var i = 0; i < window; i++)
                    {
                        r[i] = Math.Log(close[start + i] / close[start + i - 1]);
                    }

                    return zeroMean ? SumOfSquares(r, 0.0) / window : SampleVariance(r);
                }

            case Estimator.Parkinson:
                {
                    double sum = 0;
                    for (var t = start; t <= end; t++)
                    {
                        var range = Math.Log(prices.High[t] / prices.Low[t]);
                        sum += range * range;
                    }

                    return sum / (4 * Math.Log(2) * window);
                }

            case Estimator.GarmanKlass:
                {
                    double sum = 0;
                    for (var t = start; t <= end; t++)
                    {
                        var range = Math.Log(prices.High[t] / prices.Low[t]);
                        var c = Math.Log(prices.Close[t] / prices.Open[t]);
                        sum += (0.5 * range * range) - (((2 * Math.Log(2)) - 1) * c * c);
                    }

                    return sum / window;
                }

            case Estimator.RogersSatchell:
                return RogersSatchell(prices, start, end) / window;

            case Estimator.YangZhang:
                {
                    var o = new double[window];
                    var c = new double[window];
                    for (var i = 0; i < window; i++)
                    {
                        var t = start + i;
                        o[i] = Math.Log(prices.Open[t] / close[t - 1]);
                        c[i] = Math.Log(close[t] / prices.Open[t]);
                    }

                    var k = 0.34 / (1.34 + ((window + 1.0) / (window - 1.0)));
                    return SampleVariance(o) + (k * SampleVariance(c)) + ((1 - k) * RogersSatchell(prices, start, end) / window);
                }

            default:
                throw new ArgumentOutOfRangeException(nameof(estimator), estimator, "Unknown estimator.");
        }
    }

    /// <summary>Annualized volatility for every date with a full window, recomputing each window from scratch.</summary>
    public static double[] AnnualizedSeries(PriceHistory prices, Estimator estimator, int window, double annualizationFactor = 252, bool zeroMean = false)
    {
        var first = estimator is Estimator.CloseToClose or Estimator.YangZhang ? window : window - 1;
        var values = new double[Math.Max(0, prices.Count - first)];
        for (var i = 0; i < values.Length; i++)
        {
            values[i] = Math.Sqrt(annualizationFactor * DailyVariance(prices, estimator, window, first + i, zeroMean));
        }

        return values;
    }

    private static double RogersSatchell(PriceHistory prices, int start, int end)
    {
        double sum = 0;
        for (var t = start; t <= end; t++)
        {
            double o = prices.Open[t], h = prices.High[t], l = prices.Low[t], c = prices.Close[t];
            sum += (Math.Log(h / c) * Math.Log(h / o)) + (Math.Log(l / c) * Math.Log(l / o));
        }

        return sum;
    }

    private static double SampleVariance(double[] x)
    {
        double mean = 0;
        foreach (var v in x)
        {
            mean += v;
        }

        mean /= x.Length;
        return SumOfSquares(x, mean) / (x.Length - 1);
    }

    private static double SumOfSquares(double[] x, double mean)
    {
        double sum = 0;
        foreach (var v in x)
        {
            sum += (v - mean) * (v - mean);
        }

        return sum;
    }
}
