using BenchmarkDotNet.Attributes;
using VolCast.Core.Trading.Snooping;

namespace VolCast.Benchmarks.Snooping;

/// <summary>
/// The data-snooping tests of a rule search at the size of a large sweep: K = 200 rules (thresholds × forecasters ×
/// sides) over T = 5,000 days, B = 1,000 stationary-bootstrap replications, mean block length 21 (a 21-day horizon)
/// and 1 (the worst case: one block per date). Seeded simulated daily P&amp;L. Target: the mean test (Reality Check,
/// SPA, StepM) in well under a second.
/// </summary>
[MemoryDiagnoser]
public class SnoopingBenchmarks
{
    private const int Rules = 200;
    private const int Days = 5000;
    private double[][] _differences = [];
    private double[][] _paths = [];
    private double[] _benchmark = [];
    private DataSnoopingOptions _options = new(21, seed: 1);

    /// <summary>Mean block length of the stationary bootstrap.</summary>
    [Params(21.0, 1.0)]
    public double MeanBlockLength { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        var random = new Random(20050101);
        _options = new DataSnoopingOptions(MeanBlockLength, seed: 7);
        _benchmark = new double[Days];
        var common = new double[Days];
        for (var t = 0; t < Days; t++)
        {
            common[t] = Gaussian.Next(random);
            _benchmark[t] = 0.02 + common[t];
        }

        _differences = new double[Rules][];
        _paths = new double[Rules][];
        for (var k = 0; k < Rules; k++)
        {
            _differences[k] = new double[Days];
            _paths[k] = new double[Days];
            for (var t = 0; t < Days; t++)
            {
                // Each rule: the benchmark's P&L on some days and its own on others, a small edge or loss.
                _paths[k][t] = (0.0001 * (k - 100)) + (0.8 * common[t]) + (0.6 * Gaussian.Next(random));
                _differences[k][t] = _paths[k][t] - _benchmark[t];
            }
        }
    }

    /// <summary>Drawing the B resamples alone (shared by both tests).</summary>
    [Benchmark]
    // Returned as object: the draws type is internal to Core, and a benchmark method must be public.
    public object Draw() => DataSnooping.Draw(Days, _options);

    /// <summary>Reality Check, SPA (l, c, u) and StepM on the mean P&amp;L differences, draws included.</summary>
    [Benchmark(Baseline = true)]
    public DataSnoopingResult MeanTest() => DataSnooping.TestMeans(_differences, _options);

    /// <summary>The same on Sharpe ratios (rule and benchmark paths resampled jointly), draws included.</summary>
    [Benchmark]
    public DataSnoopingResult SharpeTest() => DataSnooping.TestSharpeRatios(_paths, _benchmark, _options);
}
