using System.Globalization;

namespace VolCast.Core.Cone;

/// <summary>
/// The volatility cone of Burghardt and Lane (1990): for each horizon h, the distribution of realized volatility
/// over every rolling h-day window of the history.
/// </summary>
/// <remarks>
/// Each window's volatility is zero-mean close-to-close: sqrt(A/h × Σ r²) over the window's h log returns, the same
/// convention as the backtest's realized target. Percentiles use R's type 7 rule. The adjusted cone multiplies every
/// window's variance by the Hodges-Tompkins (2002) factor m(T, h); because percentiles commute with an increasing
/// map, that is the same as multiplying each volatility percentile by √m, which is how it is computed. A horizon is
/// drawn only when the sample gives at least 2h windows (T ≥ 3h − 1); shorter samples leave it out and list it.
/// </remarks>
public static class VolatilityCone
{
    /// <summary>The horizons drawn when none are given: 5, 10, 21, 42, 63, 126 and 252 trading days.</summary>
    public static IReadOnlyList<int> DefaultHorizons { get; } = [5, 10, 21, 42, 63, 126, 252];

    /// <summary>Draws the cone from a series of daily log returns.</summary>
    /// <param name="logReturns">Daily log returns, oldest first; every value finite.</param>
    /// <param name="horizons">Window lengths in trading days, each at least 1, strictly increasing.</param>
    /// <param name="annualizationFactor">A, trading days per year (252 by default).</param>
    /// <returns>The cone, one row per horizon the sample is long enough for.</returns>
    /// <exception cref="ArgumentException">A return is not finite, or the horizons are not strictly increasing.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A horizon is below 1, or the annualization factor is not positive.</exception>
    public static VolatilityConeResult Compute(ReadOnlySpan<double> logReturns, IReadOnlyList<int> horizons, double annualizationFactor = 252.0)
    {
        ArgumentNullException.ThrowIfNull(horizons);
        Preconditions.Finite(annualizationFactor);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(annualizationFactor);
        for (var i = 0; i < horizons.Count; i++)
        {
            ArgumentOutOfRangeException.ThrowIfLessThan(horizons[i], 1, nameof(horizons));
            if (i > 0 && horizons[i] <= horizons[i - 1])
            {
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"horizons must be strictly increasing: {horizons[i]} follows {horizons[i - 1]}."), nameof(horizons));
            }
        }

        var count = logReturns.Length;
        var squares = new double[count];
        for (var i = 0; i < count; i++)
        {
            if (!double.IsFinite(logReturns[i]))
            {
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"logReturns[{i}] must be finite, was {logReturns[i]}."), nameof(logReturns));
            }

            squares[i] = logReturns[i] * logReturns[i];
        }

        var rows = new List<ConeHorizon>(horizons.Count);
        var skipped = new List<int>();
        foreach (var h in horizons)
        {
            var windows = count - h + 1;
            if (windows < 2 * h)
            {
                skipped.Add(h);
                continue;
            }

            rows.Add(Horizon(squares, h, annualizationFactor));
        }

        return new VolatilityConeResult(count, annualizationFactor, rows, skipped);
    }

    private static ConeHorizon Horizon(double[] squares, int h, double annualizationFactor)
    {
        var windows = squares.Length - h + 1;
        var vols = new double[windows];
        var scale = annualizationFactor / h;

        // Each window's sum is added up afresh from its h squares: O(T·h) but free of the drift a running
        // sum accumulates over decades, and h ≤ 252 keeps it cheap.
        for (var start = 0; start < windows; start++)
        {
            var sum = 0.0;
            for (var k = start; k < start + h; k++)
            {
                sum += squares[k];
            }

            vols[start] = Math.Sqrt(scale * sum);
        }

        var latest = vols[^1];
        Array.Sort(vols);
        var raw = new ConePercentiles(
            vols[0],
            Quantile.Type7(vols, 0.10),
            Quantile.Type7(vols, 0.25),
            Quantile.Type7(vols, 0.50),
            Quantile.Type7(vols, 0.75),
            Quantile.Type7(vols, 0.90),
            vols[^1]);
        var m = HodgesTompkins.VarianceFactor(squares.Length, h);
        return new ConeHorizon(h, windows, m, raw, raw.Scale(Math.Sqrt(m)), latest);
    }
}
