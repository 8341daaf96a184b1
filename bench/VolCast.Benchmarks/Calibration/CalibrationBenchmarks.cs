using BenchmarkDotNet.Attributes;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Data;

namespace VolCast.Benchmarks.Calibration;

/// <summary>
/// Probability calibration and range coverage at the size of the default backtest: 45 forecasters × 5 strikes over
/// 1,260 and 5,000 dates, 21-day horizon. Target: under 10% of the default backtest's 3 s budget, i.e. under 300 ms.
/// Baseline: per strike and forecaster, every probability computed through the checked public N(d2) and stored,
/// then decomposed; coverage the same in both. <see cref="OnDefaultBacktest"/> calibrates the result of the default
/// backtest itself (the same seeded data and settings as BacktestBenchmarks), to set against its run time.
/// </summary>
[MemoryDiagnoser]
public class CalibrationBenchmarks
{
    private const int Models = 45;
    private const int Horizon = 21;
    private HorizonOutcomes _outcomes = null!;
    private ForecasterVolatility[] _forecasters = [];
    private PriceHistory _prices = null!;
    private BacktestResult _backtest = null!;

    /// <summary>Number of scored dates.</summary>
    [Params(1260, 5000)]
    public int Dates { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        var random = new Random(19730101);
        var closes = new double[Dates + Horizon];
        var sigmas = new double[closes.Length];
        var logVariance = Math.Log(0.04);
        closes[0] = 100;
        for (var t = 0; t < closes.Length; t++)
        {
            logVariance = Math.Log(0.04) + (0.98 * (logVariance - Math.Log(0.04))) + (0.15 * Gaussian.Next(random));
            sigmas[t] = Math.Sqrt(Math.Exp(logVariance));
            if (t > 0)
            {
                var sd = sigmas[t - 1] / Math.Sqrt(252);
                closes[t] = closes[t - 1] * Math.Exp((-0.5 * sd * sd) + (sd * Gaussian.Next(random)));
            }
        }

        _outcomes = new HorizonOutcomes(Horizon, closes[..Dates], closes[Horizon..(Dates + Horizon)]);
        (_prices, var implied) = Backtest.BacktestBenchmarks.DefaultBacktestData(Dates);
        _backtest = Backtester.Run(_prices, implied, new BacktestSettings());
        _forecasters = new ForecasterVolatility[Models];
        for (var i = 0; i < Models; i++)
        {
            var values = new double?[Dates];
            for (var t = 0; t < Dates; t++)
            {
                // A warm-up gap at the start for half of them, as lookback forecasters have.
                values[t] = i % 2 == 0 && t < 10 * (i + 1) ? null : sigmas[t] * (1 + (0.005 * i)) * Math.Exp(0.1 * Gaussian.Next(random));
            }

            _forecasters[i] = new ForecasterVolatility("f" + i, values);
        }
    }

    [Benchmark(Baseline = true)]
    public double NaiveStoredProbabilities()
    {
        var options = new CalibrationOptions();
        var tau = Horizon / 252.0;
        var p = new double[Dates];
        var o = new bool[Dates];
        double total = 0;
        foreach (var f in _forecasters)
        {
            foreach (var m in options.Moneyness)
            {
                var n = 0;
                for (var t = 0; t < Dates; t++)
                {
                    if (f.AnnualizedVolatility[t] is { } sigma)
                    {
                        var s = _outcomes.StartClose[t];
                        p[n] = AboveStrikeProbability.Compute(s, m * s, sigma, tau);
                        o[n] = _outcomes.EndClose[t] > m * s;
                        n++;
                    }
                }

                total += ProbabilityCalibration.Decompose(p.AsSpan(0, n), o.AsSpan(0, n), options.BinCount).Brier;
            }

            total += MoveBandCoverage.Evaluate(_outcomes, f, options).ZScale ?? 0;
        }

        return total;
    }

    [Benchmark]
    public int Suite()
    {
        var options = new CalibrationOptions();
        var sum = 0;
        foreach (var f in _forecasters)
        {
            sum += BacktestCalibrator.Score(_outcomes, f, options).Coverage.Count;
        }

        return sum;
    }

    [Benchmark]
    public int CoverageOnly()
    {
        var sum = 0;
        foreach (var f in _forecasters)
        {
            sum += MoveBandCoverage.Evaluate(_outcomes, f).Count;
        }

        return sum;
    }

    [Benchmark]
    public BacktestCalibration OnDefaultBacktest() => BacktestCalibrator.Evaluate(_backtest, _prices);
}
