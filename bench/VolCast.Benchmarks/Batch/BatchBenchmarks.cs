using BenchmarkDotNet.Attributes;
using VolCast.Core.Scoring;
using VolCast.IO.Results;
using VolCast.IO.Tables;

namespace VolCast.Benchmarks.Batch;

/// <summary>
/// The batch's reduce step: the Benjamini-Hochberg adjustment and the per-forecaster table over the summary rows of a
/// universe (8 forecasters tested against implied per name). The wall-time and memory targets of the whole batch are
/// measured on the command line by measure-batch.sh beside this file (see bench/README.md, "Batch"); this class checks
/// that the reduce stays negligible as names grow.
/// </summary>
[MemoryDiagnoser]
public class BatchBenchmarks
{
    private double[] _p = [];
    private BatchAssetRow[] _rows = [];

    /// <summary>Number of names.</summary>
    [Params(50, 500, 5000)]
    public int Names { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        var random = new Random(20261201);
        _p = new double[Names];
        for (var i = 0; i < Names; i++)
        {
            _p[i] = random.NextDouble() < 0.2 ? random.NextDouble() * 0.01 : random.NextDouble();
        }

        _rows = new BatchAssetRow[Names];
        for (var i = 0; i < Names; i++)
        {
            var tests = new BatchForecasterTest[8];
            for (var f = 0; f < tests.Length; f++)
            {
                tests[f] = new BatchForecasterTest("f" + f, (random.NextDouble() * 6) - 3, random.NextDouble());
            }

            _rows[i] = new BatchAssetRow { Name = "n" + i, Succeeded = true, HasImplied = true, VersusImplied = [.. tests] };
        }
    }

    /// <summary>The definition read literally: each p-value's rank by counting, then the minimum of m·p/rank over all larger-or-equal p-values, O(m²).</summary>
    [Benchmark(Baseline = true)]
    public double[] BenjaminiHochbergNaive()
    {
        var m = _p.Length;
        var rank = new int[m];
        for (var j = 0; j < m; j++)
        {
            for (var k = 0; k < m; k++)
            {
                rank[j] += _p[k] <= _p[j] ? 1 : 0;
            }
        }

        var adjusted = new double[m];
        for (var i = 0; i < m; i++)
        {
            var best = 1.0;
            for (var j = 0; j < m; j++)
            {
                if (_p[j] >= _p[i])
                {
                    best = Math.Min(best, m * _p[j] / rank[j]);
                }
            }

            adjusted[i] = best;
        }

        return adjusted;
    }

    [Benchmark]
    public double[] BenjaminiHochberg() => FalseDiscoveryRate.BenjaminiHochberg(_p.AsSpan());

    [Benchmark]
    public IReadOnlyList<VersusImpliedFdrRow> FdrTable() => VersusImpliedTable.Rows(_rows);
}
