using System.Collections.Immutable;
using VolCast.Core.Options;
using VolCast.Core.Scoring;

namespace VolCast.Core.Trading;

/// <summary>The statistics of paths and trades; every undefined value is null, never NaN.</summary>
internal static class PnlStatisticsCalculator
{
    /// <summary>A Newey-West (Bartlett) test of a zero mean with the lag capped at n − 1; p-value from the standard normal.</summary>
    public static NeweyWestMeanTest MeanTest(ReadOnlySpan<double> values, int lag)
    {
        var n = values.Length;
        double sum = 0;
        for (var i = 0; i < n; i++)
        {
            sum += values[i];
        }

        var mean = n > 0 ? sum / n : 0;
        var used = Math.Max(0, Math.Min(lag, n - 1));
        if (n < 2)
        {
            return new NeweyWestMeanTest(n, used, mean, null, null, null);
        }

        var lrv = NeweyWest.LongRunVariance(values, used);
        if (!(lrv > 0))
        {
            return new NeweyWestMeanTest(n, used, mean, null, null, null);
        }

        var error = Math.Sqrt(lrv / n);
        var t = mean / error;
        return new NeweyWestMeanTest(n, used, mean, error, t, 2 * StandardNormal.Cdf(-Math.Abs(t)));
    }

    /// <summary>The total, the P&amp;L per year and the annualized Sharpe ratio of a daily path (all a threshold sweep row needs).</summary>
    public static (double Total, double PerYear, double? Sharpe) Summary(ReadOnlySpan<double> path, double annualizationDays)
    {
        var n = path.Length;
        double sum = 0;
        for (var i = 0; i < n; i++)
        {
            sum += path[i];
        }

        var mean = sum / n;
        double squares = 0;
        for (var i = 0; i < n; i++)
        {
            squares += (path[i] - mean) * (path[i] - mean);
        }

        var sd = n > 1 ? Math.Sqrt(squares / (n - 1)) : 0;
        return (sum, sum / (n / annualizationDays), sd > 0 ? mean / sd * Math.Sqrt(annualizationDays) : null);
    }

    public static PathStatistics Path(ReadOnlySpan<double> path, ReadOnlySpan<DateOnly> dates, double annualizationDays)
    {
        var n = path.Length;
        double cumulative = 0, peak = 0, drawdown = 0;
        int peakIndex = -1, troughIndex = -1, runningPeak = -1;
        var byYear = new List<YearPnl>();
        var worstMonth = new DateOnly(dates[0].Year, dates[0].Month, 1);
        var worstMonthPnl = double.PositiveInfinity;
        var month = worstMonth;
        double monthSum = 0, yearSum = 0;
        var year = dates[0].Year;
        for (var i = 0; i < n; i++)
        {
            var x = path[i];
            cumulative += x;
            if (cumulative > peak)
            {
                peak = cumulative;
                runningPeak = i;
            }

            if (peak - cumulative > drawdown)
            {
                drawdown = peak - cumulative;
                peakIndex = runningPeak;
                troughIndex = i;
            }

            var m = new DateOnly(dates[i].Year, dates[i].Month, 1);
            if (m != month)
            {
                if (monthSum < worstMonthPnl)
                {
                    (worstMonth, worstMonthPnl) = (month, monthSum);
                }

                (month, monthSum) = (m, 0);
            }

            if (dates[i].Year != year)
            {
                byYear.Add(new YearPnl(year, yearSum));
                (year, yearSum) = (dates[i].Year, 0);
            }

            monthSum += x;
            yearSum += x;
        }

        if (monthSum < worstMonthPnl)
        {
            (worstMonth, worstMonthPnl) = (month, monthSum);
        }

        byYear.Add(new YearPnl(year, yearSum));
        var (sum, perYear, sharpe) = Summary(path, annualizationDays);
        var mean = sum / n;
        double downside = 0;
        for (var i = 0; i < n; i++)
        {
            var loss = Math.Min(path[i], 0);
            downside += loss * loss;
        }

        var downsideDeviation = Math.Sqrt(downside / n);
        double? sortino = downsideDeviation > 0 ? mean / downsideDeviation * Math.Sqrt(annualizationDays) : null;
        return new PathStatistics(
            n,
            sum,
            perYear,
            sharpe,
            sortino,
            drawdown,
            troughIndex >= 0 ? dates[Math.Max(peakIndex, 0)] : null,
            troughIndex >= 0 ? dates[troughIndex] : null,
            worstMonth,
            worstMonthPnl,
            [.. byYear]);
    }

    /// <summary>Statistics of trades given their P&amp;L in vol points and in percent of spot, and their stress P&amp;L.</summary>
    public static TradeStatistics Trades(double[] volPoints, double[] percentOfSpot, DateOnly[] entryDates, double meanStressLoss)
    {
        var n = volPoints.Length;
        if (n == 0)
        {
            return new TradeStatistics(0, null, null, null, null, null, null, null, null, null, null, null);
        }

        double sum = 0, sumPercent = 0;
        var hits = 0;
        var worst = 0;
        for (var i = 0; i < n; i++)
        {
            sum += volPoints[i];
            sumPercent += percentOfSpot[i];
            hits += volPoints[i] > 0 ? 1 : 0;
            worst = volPoints[i] < volPoints[worst] ? i : worst;
        }

        var mean = sum / n;
        double m2 = 0, m3 = 0;
        for (var i = 0; i < n; i++)
        {
            var d = volPoints[i] - mean;
            m2 += d * d;
            m3 += d * d * d;
        }

        m2 /= n;
        m3 /= n;
        double? skewness = n >= 3 && m2 > 0 ? m3 / Math.Pow(m2, 1.5) : null;
        var sorted = (double[])volPoints.Clone();
        Array.Sort(sorted);
        var tail = Math.Max(1, (int)Math.Ceiling(0.05 * n));
        double tailSum = 0;
        for (var i = 0; i < tail; i++)
        {
            tailSum += sorted[i];
        }

        var sortedPercent = (double[])percentOfSpot.Clone();
        Array.Sort(sortedPercent);
        return new TradeStatistics(
            n,
            (double)hits / n,
            mean,
            Median(sorted),
            sumPercent / n,
            Median(sortedPercent),
            volPoints[worst],
            entryDates[worst],
            tailSum / tail,
            skewness,
            n >= 2 ? MeanTest(volPoints, 2) : null,
            meanStressLoss > 0 ? mean / meanStressLoss : null);
    }

    private static double Median(double[] sorted)
    {
        var n = sorted.Length;
        return n % 2 == 1 ? sorted[n / 2] : 0.5 * (sorted[(n / 2) - 1] + sorted[n / 2]);
    }
}
