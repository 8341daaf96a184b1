using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Configs;
using VolCast.Core.Data;
using VolCast.Core.Estimators;
using VolCast.Core.Tests.Estimators;

namespace VolCast.Benchmarks.Estimators;

/// <summary>
/// The five estimators over a daily history: one window, and a sweep of 8 windows × 5 estimators.
/// Targets: one window, all five, &lt; 0.5 ms single-threaded; the sweep &lt; 2 ms. Baselines recompute
/// every window from the prices (the tests' naive reference).
/// </summary>
[MemoryDiagnoser]
[GroupBenchmarksBy(BenchmarkLogicalGroupRule.ByCategory)]
[CategoriesColumn]
public class EstimatorBenchmarks
{
    private const int OneWindow = 21;
    private static readonly int[] SweepWindows = [5, 10, 15, 21, 42, 63, 126, 252];
    private static readonly Estimator[] Estimators = [Estimator.CloseToClose, Estimator.Parkinson, Estimator.GarmanKlass, Estimator.RogersSatchell, Estimator.YangZhang];

    private PriceHistory _prices = null!;
    private double[] _buffer = null!;
    private EstimatorTerms _terms = null!;

    /// <summary>Daily bars; 5,550 is the length of the TTR sample the targets are stated for.</summary>
    [Params(5_550)]
    public int Bars { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        _prices = SeededBars(seed: 42, Bars);
        _buffer = new double[Bars];
        _terms = EstimatorTerms.From(_prices);
    }

    [Benchmark(Baseline = true)]
    [BenchmarkCategory("OneWindow")]
    public double NaiveAllFive()
    {
        double checksum = 0;
        foreach (var estimator in Estimators)
        {
            checksum += NaiveEstimators.AnnualizedSeries(_prices, estimator, OneWindow)[^1];
        }

        return checksum;
    }

    /// <summary>The terms of the history, then every estimator into one caller-owned buffer.</summary>
    [Benchmark]
    [BenchmarkCategory("OneWindow")]
    public double AllFive()
    {
        var terms = EstimatorTerms.From(_prices);
        double checksum = 0;
        foreach (var estimator in Estimators)
        {
            var count = terms.RollingAnnualizedVolatility(estimator, OneWindow, _buffer);
            checksum += _buffer[count - 1];
        }

        return checksum;
    }

    /// <summary>The convenience entry point, which builds the terms again on each call and allocates each series.</summary>
    [Benchmark]
    [BenchmarkCategory("OneWindow")]
    public double AllFiveThroughCompute()
    {
        double checksum = 0;
        foreach (var estimator in Estimators)
        {
            checksum += RollingVolatility.Compute(_prices, estimator, OneWindow).AnnualizedVolatility[^1];
        }

        return checksum;
    }

    /// <summary>Building the per-bar terms alone (the logarithms and prefix sums), the fixed cost per history.</summary>
    [Benchmark]
    [BenchmarkCategory("Parts")]
    // Returned as object: the terms type is internal to Core, and a benchmark method must be public.
    public object TermsOnly() => EstimatorTerms.From(_prices);

    /// <summary>Reading all five estimators at one window from terms built once.</summary>
    [Benchmark]
    [BenchmarkCategory("Parts")]
    public double RollingOnlyAllFive()
    {
        double checksum = 0;
        foreach (var estimator in Estimators)
        {
            var count = _terms.RollingAnnualizedVolatility(estimator, OneWindow, _buffer);
            checksum += _buffer[count - 1];
        }

        return checksum;
    }

    [Benchmark(Baseline = true)]
    [BenchmarkCategory("Sweep")]
    public double NaiveSweep()
    {
        double checksum = 0;
        foreach (var window in SweepWindows)
        {
            foreach (var estimator in Estimators)
            {
                checksum += NaiveEstimators.AnnualizedSeries(_prices, estimator, window)[^1];
            }
        }

        return checksum;
    }

    [Benchmark]
    [BenchmarkCategory("Sweep")]
    public double Sweep()
    {
        var terms = EstimatorTerms.From(_prices);
        double checksum = 0;
        foreach (var window in SweepWindows)
        {
            foreach (var estimator in Estimators)
            {
                var count = terms.RollingAnnualizedVolatility(estimator, window, _buffer);
                checksum += _buffer[count - 1];
            }
        }

        return checksum;
    }

    private static PriceHistory SeededBars(int seed, int days)
    {
        // A seeded random walk with intraday extremes from 24 steps a day; only realistic shapes matter here.
        var random = new Random(seed);
        var open = new double[days];
        var high = new double[days];
        var low = new double[days];
        var close = new double[days];
        var dates = Weekdays.From(new DateOnly(2000, 1, 3), days);
        var x = Math.Log(100.0);
        for (var d = 0; d < days; d++)
        {
            x += 0.003 * ((random.NextDouble() * 2) - 1);
            double o = x, hi = x, lo = x;
            for (var s = 0; s < 24; s++)
            {
                x += 0.004 * ((random.NextDouble() * 2) - 1);
                hi = Math.Max(hi, x);
                lo = Math.Min(lo, x);
            }

            open[d] = Math.Exp(o);
            close[d] = Math.Exp(x);
            high[d] = Math.Max(Math.Exp(hi), Math.Max(open[d], close[d]));
            low[d] = Math.Min(Math.Exp(lo), Math.Min(open[d], close[d]));
        }

        return PriceHistory.FromBars(dates, open, high, low, close);
    }
}
