using System.Collections.Immutable;
using VolCast.Core.Scoring;

namespace VolCast.Core.Backtest;

/// <summary>Computes <see cref="RuleTestResult"/>.</summary>
internal static class RuleTest
{
    /// <summary>The rule test on <paramref name="ruleDates"/> (indices into the full-history arrays), rows and per-date series.</summary>
    public static RuleTestResult Compute(
        double threshold,
        string forecastSpec,
        string historicalSpec,
        IReadOnlyList<int> ruleDates,
        DateOnly[] dates,
        double?[] implied,
        double?[] forecast,
        double?[] historical,
        double?[] realized,
        int lag)
    {
        var rows = Rows(forecastSpec, ruleDates, implied, forecast, realized, threshold, lag)
            .AddRange(Rows(historicalSpec, ruleDates, implied, historical, realized, threshold, lag));
        return new RuleTestResult(
            threshold,
            forecastSpec,
            historicalSpec,
            rows,
            [.. ruleDates.Select(t => dates[t])],
            At(implied, ruleDates),
            At(realized, ruleDates),
            At(forecast, ruleDates),
            At(historical, ruleDates));
    }

    /// <summary>Which side the rule takes on a date: sell when implied exceeds the forecast by more than the threshold, buy for the mirror, else none.</summary>
    public static RuleSignal? SignalOf(double implied, double forecast, double threshold)
    {
        var gap = implied - forecast;
        return gap > threshold ? RuleSignal.SellVolatility : -gap > threshold ? RuleSignal.BuyVolatility : null;
    }

    private static ImmutableArray<double> At(double?[] values, IReadOnlyList<int> ruleDates) => [.. ruleDates.Select(t => values[t]!.Value)];

    private static ImmutableArray<RuleTestRow> Rows(
        string source, IReadOnlyList<int> dates, double?[] implied, double?[] forecast, double?[] realized, double threshold, int lag)
    {
        var all = new List<int>();
        var sell = new List<int>();
        var buy = new List<int>();
        foreach (var t in dates)
        {
            all.Add(t);
            var signal = SignalOf(implied[t]!.Value, forecast[t]!.Value, threshold);
            if (signal == RuleSignal.SellVolatility)
            {
                sell.Add(t);
            }
            else if (signal == RuleSignal.BuyVolatility)
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
