using System.Collections.Immutable;

namespace VolCast.Core.Calibration;

/// <summary>
/// Running sums per probability bin (count, Σf, Σo, Σf², Σfo) from which the Brier decomposition and the reliability
/// table follow in one pass, with no per-forecast storage.
/// </summary>
internal sealed class BinAccumulator
{
    private readonly int _bins;
    private readonly double[] _count;
    private readonly double[] _sumF;
    private readonly double[] _sumO;
    private readonly double[] _sumFF;
    private readonly double[] _sumFO;
    private double _sumSquaredError;
    private double _sumLog;
    private int _clipped;
    private int _total;

    public BinAccumulator(int bins)
    {
        _bins = bins;
        _count = new double[bins];
        _sumF = new double[bins];
        _sumO = new double[bins];
        _sumFF = new double[bins];
        _sumFO = new double[bins];
    }

    /// <summary>Adds one forecast p of an outcome (1 when it happened).</summary>
    public void Add(double p, bool happened, double clip)
    {
        var k = (int)(p * _bins);
        if (k >= _bins)
        {
            k = _bins - 1;
        }
        else if (k < 0)
        {
            k = 0;
        }

        var o = happened ? 1.0 : 0.0;
        _count[k] += 1;
        _sumF[k] += p;
        _sumO[k] += o;
        _sumFF[k] += p * p;
        _sumFO[k] += p * o;
        var e = p - o;
        _sumSquaredError += e * e;

        // ln of the probability given to what happened; 1 − p loses relative accuracy only below about 1e-12,
        // where the clip takes over anyway.
        var q = happened ? p : 1 - p;
        if (q < clip)
        {
            q = clip;
            _clipped++;
        }
        else if (q > 1 - clip)
        {
            q = 1 - clip;
            _clipped++;
        }

        _sumLog += Math.Log(q);
        _total++;
    }

    public int Total => _total;

    public int Clipped => _clipped;

    public double LogScore => _total == 0 ? 0 : -_sumLog / _total;

    public double MeanPredicted()
    {
        double s = 0;
        for (var k = 0; k < _bins; k++)
        {
            s += _sumF[k];
        }

        return s / _total;
    }

    public double ObservedFrequency()
    {
        double s = 0;
        for (var k = 0; k < _bins; k++)
        {
            s += _sumO[k];
        }

        return s / _total;
    }

    public BrierDecomposition Decompose()
    {
        var n = (double)_total;
        var baseRate = ObservedFrequency();
        double rel = 0, res = 0, wbv = 0, wbc = 0;
        for (var k = 0; k < _bins; k++)
        {
            var nk = _count[k];
            if (nk == 0)
            {
                continue;
            }

            var fk = _sumF[k] / nk;
            var ok = _sumO[k] / nk;
            rel += nk * (fk - ok) * (fk - ok);
            res += nk * (ok - baseRate) * (ok - baseRate);
            wbv += _sumFF[k] - (nk * fk * fk);
            wbc += 2 * (_sumFO[k] - (nk * fk * ok));
        }

        return new BrierDecomposition(_total, _sumSquaredError / n, rel / n, res / n, baseRate * (1 - baseRate), Math.Max(0, wbv / n), wbc / n);
    }

    public ImmutableArray<ReliabilityBin> Table(int horizonDays, double z)
    {
        var rows = ImmutableArray.CreateBuilder<ReliabilityBin>(_bins);
        for (var k = 0; k < _bins; k++)
        {
            var lower = (double)k / _bins;
            var upper = (double)(k + 1) / _bins;
            var nk = _count[k];
            var effective = nk / horizonDays;
            if (nk == 0)
            {
                rows.Add(new ReliabilityBin(k, lower, upper, 0, 0, null, null, null, null));
                continue;
            }

            var frequency = _sumO[k] / nk;
            var (lo, hi) = WilsonInterval.Compute(frequency, effective, z);
            rows.Add(new ReliabilityBin(k, lower, upper, (int)nk, effective, _sumF[k] / nk, frequency, lo, hi));
        }

        return rows.MoveToImmutable();
    }
}
