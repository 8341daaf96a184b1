using BenchmarkDotNet.Attributes;
using VolCast.Core.Scoring;

namespace VolCast.Benchmarks.Scoring;

/// <summary>
/// The scoring layer at the size of the default backtest: 45 forecasters (5 estimators × 8 lookbacks, the EWMA grid,
/// GARCH, GJR, HAR, adaptive, implied) over about 5,000 dates, 21-day horizon (HAC lag 20, bootstrap block 21),
/// MCS with B = 1,000. Target: the whole default backtest in under 3 s, so scoring should take a small share of it.
/// </summary>
[MemoryDiagnoser]
public class ScoringBenchmarks
{
    private const int Models = 45;
    private const int Horizon = 21;
    private double[] _realized = [];
    private double[][] _forecasts = [];
    private double[][] _qlike = [];
    private double[][] _mse = [];
    private double[] _lossMatrix = [];
    private double[] _means = [];

    /// <summary>Number of scored dates.</summary>
    [Params(1260, 5000)]
    public int Dates { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        var random = new Random(20110301);
        _realized = new double[Dates];
        _forecasts = new double[Models][];
        for (var i = 0; i < Models; i++)
        {
            _forecasts[i] = new double[Dates];
        }

        var mu = Math.Log(0.04);
        var logVariance = mu;
        for (var t = 0; t < Dates; t++)
        {
            logVariance = mu + (0.98 * (logVariance - mu)) + (0.15 * Gaussian.Next(random));
            var sigma = Math.Sqrt(Math.Exp(logVariance));
            _realized[t] = sigma * Math.Sqrt(Math.Max(0.05, 1 + (0.4 * Gaussian.Next(random))));
            for (var i = 0; i < Models; i++)
            {
                // Each forecaster: the truth with its own bias and noise.
                _forecasts[i][t] = sigma * (1 + (0.005 * i)) * Math.Exp(0.1 * Gaussian.Next(random));
            }
        }

        _qlike = new double[Models][];
        _mse = new double[Models][];
        _lossMatrix = new double[Dates * Models];
        _means = new double[Models];
        for (var i = 0; i < Models; i++)
        {
            _qlike[i] = Losses.Compute(LossFunction.Qlike, _realized, _forecasts[i]);
            _mse[i] = Losses.Compute(LossFunction.SquaredErrorVariance, _realized, _forecasts[i]);
            for (var t = 0; t < Dates; t++)
            {
                _lossMatrix[(t * Models) + i] = _qlike[i][t];
                _means[i] += _qlike[i][t] / Dates;
            }
        }
    }

    /// <summary>MCS, T_max, moving blocks of 21, B = 1,000 (the default).</summary>
    [Benchmark]
    public ModelConfidenceSetResult McsTMax() =>
        ModelConfidenceSet.Compute(_qlike, new ModelConfidenceSetOptions(Horizon, 1));

    /// <summary>MCS, T_R, moving blocks of 21, B = 1,000.</summary>
    [Benchmark]
    public ModelConfidenceSetResult McsTRange() =>
        ModelConfidenceSet.Compute(_qlike, new ModelConfidenceSetOptions(Horizon, 1, statistic: ModelConfidenceSetStatistic.TRange));

    /// <summary>MCS, T_max, stationary bootstrap with mean block 21, B = 1,000.</summary>
    [Benchmark]
    public ModelConfidenceSetResult McsTMaxStationary() =>
        ModelConfidenceSet.Compute(_qlike, new ModelConfidenceSetOptions(Horizon, 1, bootstrap: BootstrapScheme.Stationary));

    /// <summary>MCS, T_max, block 1 (a one-day horizon): the most blocks per replication.</summary>
    [Benchmark]
    public ModelConfidenceSetResult McsTMaxBlockOne() =>
        ModelConfidenceSet.Compute(_qlike, new ModelConfidenceSetOptions(1, 1));

    /// <summary>Bootstrap means by summing every resampled date (the plain way), B = 1,000, block 21.</summary>
    [Benchmark(Baseline = true)]
    public double[] BootstrapMeansPerDate()
    {
        var options = new ModelConfidenceSetOptions(Horizon, 1);
        var n = Dates;
        var boot = new double[options.BootstrapReplications * Models];
        var random = new Random(options.Seed);
        for (var b = 0; b < options.BootstrapReplications; b++)
        {
            var sums = boot.AsSpan(b * Models, Models);
            var filled = 0;
            while (filled < n)
            {
                var start = random.Next(n - Horizon + 1);
                var length = Math.Min(Horizon, n - filled);
                for (var t = start; t < start + length; t++)
                {
                    var row = _lossMatrix.AsSpan(t * Models, Models);
                    for (var i = 0; i < Models; i++)
                    {
                        sums[i] += row[i] - _means[i];
                    }
                }

                filled += length;
            }

            for (var i = 0; i < Models; i++)
            {
                sums[i] /= n;
            }
        }

        return boot;
    }

    /// <summary>Bootstrap means from prefix sums, one subtraction per block and model, as the MCS does.</summary>
    [Benchmark]
    public double[] BootstrapMeansPrefixSums() =>
        ModelConfidenceSet.BootstrapMeanDeviations(_lossMatrix, Models, _means, new ModelConfidenceSetOptions(Horizon, 1));

    /// <summary>Diebold-Mariano of each of 44 forecasters against the last ("implied") on QLIKE and on MSE, Bartlett lag 20.</summary>
    [Benchmark]
    public double DieboldMarianoAgainstImplied()
    {
        var sum = 0.0;
        for (var i = 0; i < Models - 1; i++)
        {
            sum += DieboldMariano.Test(_qlike[i], _qlike[Models - 1], Horizon).Statistic ?? 0;
            sum += DieboldMariano.Test(_mse[i], _mse[Models - 1], Horizon).Statistic ?? 0;
        }

        return sum;
    }

    /// <summary>Mincer-Zarnowitz on variance with HAC lag 20 for all 45 forecasters.</summary>
    [Benchmark]
    public double MincerZarnowitzAll()
    {
        var sum = 0.0;
        for (var i = 0; i < Models; i++)
        {
            sum += MincerZarnowitz.Fit(_realized, _forecasts[i], Horizon).WaldPValue;
        }

        return sum;
    }

    /// <summary>Encompassing regression with HAC lag 20 for 44 forecasters against the last ("implied").</summary>
    [Benchmark]
    public double EncompassingAll()
    {
        var sum = 0.0;
        for (var i = 0; i < Models - 1; i++)
        {
            sum += EncompassingRegression.Fit(_realized, _forecasts[Models - 1], _forecasts[i], Horizon).ForecastPValue;
        }

        return sum;
    }

    /// <summary>Mean losses (bias, MAE, RMSE, MSE, QLIKE) for all 45 forecasters.</summary>
    [Benchmark]
    public double LossSummariesAll()
    {
        var sum = 0.0;
        for (var i = 0; i < Models; i++)
        {
            sum += Losses.Summarize(_realized, _forecasts[i]).Qlike;
        }

        return sum;
    }
}
