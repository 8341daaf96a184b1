using BenchmarkDotNet.Attributes;
using VolCast.Core.Backtest;
using VolCast.Core.Data;

namespace VolCast.Benchmarks.Backtest;

/// <summary>
/// The default backtest (target: 5,000 days in under 3 s on 2 cores, peak memory under 500 MB): configured
/// forecasters (close-to-close:21, yang-zhang:21, ewma:0.94, GARCH and GJR refit every 5 days, HAR), the sweep of
/// 5 estimators × 8 lookbacks and the EWMA grid, six adaptive choices, implied, MCS with B = 1,000.
/// </summary>
[MemoryDiagnoser]
public class BacktestBenchmarks
{
    private PriceHistory _prices = null!;
    private ImpliedSeries _implied = null!;

    [Params(1260, 5000)]
    public int Days { get; set; }

    [GlobalSetup]
    public void Setup() => (_prices, _implied) = DefaultBacktestData(Days);

    [Benchmark]
    public BacktestResult DefaultBacktest() => Backtester.Run(_prices, _implied, new BacktestSettings());

    /// <summary>The seeded GARCH(1,1) OHLC path with an implied series near the conditional vol (invented data), shared with CalibrationBenchmarks.</summary>
    internal static (PriceHistory Prices, ImpliedSeries Implied) DefaultBacktestData(int n)
    {
        var random = new Random(42);
        var dates = Weekdays.From(new DateOnly(2000, 1, 3), n);
        var open = new double[n];
        var high = new double[n];
        var low = new double[n];
        var close = new double[n];
        var iv = new double[n];
        var h = 1e-4;
        var previous = 100.0;
        for (var i = 0; i < n; i++)
        {
            var e = Math.Sqrt(h) * Gaussian.Next(random);
            open[i] = previous * Math.Exp(0.2 * Math.Sqrt(h) * Gaussian.Next(random));
            close[i] = previous * Math.Exp(e);
            high[i] = Math.Max(open[i], close[i]) * Math.Exp(0.5 * Math.Sqrt(h) * Math.Abs(Gaussian.Next(random)));
            low[i] = Math.Min(open[i], close[i]) * Math.Exp(-0.5 * Math.Sqrt(h) * Math.Abs(Gaussian.Next(random)));
            iv[i] = Math.Sqrt(252 * h) * 1.1;
            previous = close[i];
            h = 2e-6 + (0.08 * e * e) + (0.9 * h);
        }

        return (PriceHistory.FromBars(dates, open, high, low, close), new ImpliedSeries(dates, iv));
    }
}
