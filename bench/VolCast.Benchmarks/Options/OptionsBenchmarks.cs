using BenchmarkDotNet.Attributes;
using VolCast.Core.Options;

namespace VolCast.Benchmarks.Options;

/// <summary>
/// Implied-volatility solves over a realistic grid: spot 100, strikes 100·e^{U(−0.3, 0.3)}, 1 to 730 calendar
/// days, σ from 8% to 80%, calls and puts at random (so about half in the money), r = 3%, q = 1%.
/// Target: one million solves in under 1 s on one thread.
/// </summary>
[MemoryDiagnoser]
public class OptionsBenchmarks
{
    private double[] _price = [];
    private double[] _strike = [];
    private double[] _years = [];
    private OptionType[] _type = [];

    [Params(100_000, 1_000_000)]
    public int Count { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        var random = new Random(42);
        _price = new double[Count];
        _strike = new double[Count];
        _years = new double[Count];
        _type = new OptionType[Count];
        for (var i = 0; i < Count; i++)
        {
            _strike[i] = 100 * Math.Exp((random.NextDouble() * 0.6) - 0.3);
            _years[i] = (1 + random.Next(730)) / 365.0;
            _type[i] = random.Next(2) == 0 ? OptionType.Call : OptionType.Put;
            var vol = 0.08 + (0.72 * random.NextDouble());
            _price[i] = BlackScholesMerton.Price(_type[i], 100, _strike[i], _years[i], vol, 0.03, 0.01);
        }
    }

    /// <summary>Plain bisection on σ in [1e-4, 5] to 1e-10, the naive way.</summary>
    [Benchmark(Baseline = true)]
    public double Bisection()
    {
        var sum = 0.0;
        for (var i = 0; i < _price.Length; i++)
        {
            double lo = 1e-4, hi = 5;
            while (hi - lo > 1e-10)
            {
                var mid = 0.5 * (lo + hi);
                if (BlackScholesMerton.Price(_type[i], 100, _strike[i], _years[i], mid, 0.03, 0.01) < _price[i])
                {
                    lo = mid;
                }
                else
                {
                    hi = mid;
                }
            }

            sum += 0.5 * (lo + hi);
        }

        return sum;
    }

    /// <summary>The solver VolCast uses: bracketed Halley with typed failures.</summary>
    [Benchmark]
    public double Solver()
    {
        var sum = 0.0;
        for (var i = 0; i < _price.Length; i++)
        {
            var result = ImpliedVolatility.FromBlackScholesMerton(_type[i], _price[i], 100, _strike[i], _years[i], 0.03, 0.01);
            if (result.Volatility is double vol)
            {
                sum += vol;
            }
        }

        return sum;
    }
}
