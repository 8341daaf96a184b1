using BenchmarkDotNet.Attributes;
using VolCast.Core.Data;
using VolCast.Core.Forecasters;
using VolCast.Core.Garch;

namespace VolCast.Benchmarks.Garch;

/// <summary>
/// GARCH(1,1) with mean: a cold fit on 2,000 returns (target &lt; 1 ms median), a warm-started refit on the window
/// shifted by one day (&lt; 0.3 ms), and a walk-forward over 5,000 days refitting every day on a 2,520-day rolling
/// window (&lt; 2 s). Data: a seeded simulated GARCH path (ω = 2e−6, α = 0.08, β = 0.9, μ = 0.0003).
/// </summary>
[MemoryDiagnoser]
public class GarchBenchmarks
{
    private static readonly GarchFitOptions Plain = new() { ComputeStandardErrors = false };
    private static readonly GarchFitOptions WithErrors = new();
    private double[] _returns = [];
    private GarchFit _previous = null!;
    private PriceHistory _prices = null!;
    private GarchLikelihood _likelihood = null!;
    private readonly double[] _gradient = new double[GarchLikelihood.Count];

    // A GJR point inside the constraints, on returns scaled to unit variance as a fit passes them.
    private readonly double[] _point = [0.01, 0.05, 0.05, 0.02, 0.9];

    [Params(2000)]
    public int Returns { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        _returns = Simulate(6000, seed: 42);
        _previous = GarchFitter.Fit(_returns.AsSpan(0, Returns), Plain);
        var closes = new double[5001];
        closes[0] = 100;
        for (var i = 0; i < 5000; i++)
        {
            closes[i + 1] = closes[i] * Math.Exp(_returns[i]);
        }

        var dates = new DateOnly[closes.Length];
        for (var i = 0; i < dates.Length; i++)
        {
            dates[i] = new DateOnly(2000, 1, 3).AddDays(i);
        }

        _prices = PriceHistory.FromCloses(dates, closes);
        var window = _returns.AsSpan(0, 2520);
        var mean = 0.0;
        foreach (var r in window)
        {
            mean += r / window.Length;
        }

        var variance = 0.0;
        foreach (var r in window)
        {
            variance += (r - mean) * (r - mean) / window.Length;
        }

        var scaled = window.ToArray();
        for (var i = 0; i < scaled.Length; i++)
        {
            scaled[i] /= Math.Sqrt(variance);
        }

        _likelihood = new GarchLikelihood(scaled, scaled.Length, VarianceStart.Backcast, conditionOnFirstReturn: false);
    }

    /// <summary>One evaluation of the GJR likelihood and its gradient on the default rolling window (2,520 returns): the
    /// unit of cost of every walk-forward refit.</summary>
    [Benchmark]
    public double LikelihoodWithGradient2520() => _likelihood.Evaluate(_point, _gradient);

    [Benchmark]
    public GarchFit ColdFit() => GarchFitter.Fit(_returns.AsSpan(0, Returns), Plain);

    [Benchmark]
    public GarchFit ColdFitWithStandardErrors() => GarchFitter.Fit(_returns.AsSpan(0, Returns), WithErrors);

    [Benchmark]
    public GarchFit WarmRefitNextDay() => GarchFitter.Fit(_returns.AsSpan(1, Returns), Plain, _previous);

    [Benchmark]
    public double WalkForward5000DaysDailyRefit()
    {
        var session = new GarchForecaster(GarchVariant.Garch, includeMean: true, refitEveryDays: 1, rollingWindowDays: 2520)
            .Start(new ForecastInput(_prices, null, 21));
        double sum = 0;
        for (var t = 0; t < _prices.Count; t++)
        {
            sum += session.Forecast(t) ?? 0;
        }

        return sum;
    }

    private static double[] Simulate(int n, int seed)
    {
        var random = new Random(seed);
        var p = new GarchParameters(0.0003, 2e-6, 0.08, 0.9);
        var h = p.LongRunVariance!.Value;
        var result = new double[n];
        for (var t = 0; t < n; t++)
        {
            var e = Math.Sqrt(h) * Gaussian.Next(random);
            result[t] = p.Mu + e;
            h = p.NextVariance(h, e);
        }

        return result;
    }
}
