using System.Collections.Immutable;
using System.Globalization;
using VolCast.Core.Numerics;

namespace VolCast.Core.Calibration;

/// <summary>Splits a coverage result into regimes of another variable, to say where ranges failed.</summary>
/// <remarks>
/// Terciles are by rank of the regime variable over the dates with a forecast: the lowest third is <c>calm</c>,
/// the highest <c>stressed</c> (ties are split by date order). With realized volatility over the same window as the
/// regime variable this is hindsight: it says in which periods the ranges failed, not a rule that could have been
/// applied at the time; large moves fall in the stressed third by construction, so read the stressed third's
/// shortfall against the calm third's excess rather than on its own.
/// </remarks>
internal static class CoverageRegimes
{
    private static readonly string[] Labels = ["calm", "middle", "stressed"];

    /// <summary>The |z| ≤ 1 coverage in each third of a regime variable.</summary>
    /// <param name="coverage">The coverage result.</param>
    /// <param name="regimeValues">The regime variable per aligned date (for example RV(t, h)), finite.</param>
    /// <param name="intervalZ">Normal quantile of the intervals, 1.96 for 95%.</param>
    /// <returns>Three rows (calm, middle, stressed), or none when fewer than three dates have a forecast.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">The regime values are not aligned with the coverage dates.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A regime value used is not finite.</exception>
    public static ImmutableArray<RegimeCoverage> ByTerciles(CoverageResult coverage, IReadOnlyList<double> regimeValues, double intervalZ = StandardNormal.Z95)
    {
        ArgumentNullException.ThrowIfNull(coverage);
        ArgumentNullException.ThrowIfNull(regimeValues);
        Preconditions.SameLength(regimeValues.Count, coverage.Z.Length, "the coverage dates", nameof(regimeValues));

        var keys = new List<double>(coverage.Count);
        var zs = new List<double>(coverage.Count);
        for (var t = 0; t < coverage.Z.Length; t++)
        {
            if (coverage.Z[t] is { } z)
            {
                Preconditions.FiniteAt(regimeValues[t], t, nameof(regimeValues));
                keys.Add(regimeValues[t]);
                zs.Add(z);
            }
        }

        var n = keys.Count;
        if (n < 3)
        {
            return [];
        }

        var order = new int[n];
        for (var i = 0; i < n; i++)
        {
            order[i] = i;
        }

        var keyArray = keys.ToArray();
        Array.Sort(keyArray, order);
        var nominal = MoveBandCoverage.NominalCoverage(1.0);
        var rows = ImmutableArray.CreateBuilder<RegimeCoverage>(3);
        for (var g = 0; g < 3; g++)
        {
            var from = g * n / 3;
            var to = (g + 1) * n / 3;
            int within = 0;
            double squares = 0;
            for (var r = from; r < to; r++)
            {
                var z = zs[order[r]];
                within += Math.Abs(z) <= 1 ? 1 : 0;
                squares += z * z;
            }

            var m = to - from;
            var share = (double)within / m;
            var (lo, hi) = WilsonInterval.Compute(share, (double)m / coverage.HorizonDays, intervalZ);
            rows.Add(new RegimeCoverage(Labels[g], keyArray[from], keyArray[to - 1], m, share, nominal, lo, hi, Math.Sqrt(squares / m)));
        }

        return rows.MoveToImmutable();
    }
}
