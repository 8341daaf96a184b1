namespace VolCast.Reports.Charts;

/// <summary>
/// Thins long series before they are drawn, in one linear pass, so that drawing costs the same for a million dates as
/// for a few thousand. A 1200-pixel chart cannot show more than a few points per pixel column; short series (up to
/// <see cref="MaxDrawn"/> points, which covers decades of daily data) are drawn exactly as given.
/// </summary>
internal static class ChartPoints
{
    /// <summary>Series with at most this many points are drawn point for point.</summary>
    public const int MaxDrawn = 10_000;

    /// <summary>Longer lines are cut into this many runs of consecutive points, each drawn by at most four of its points.</summary>
    public const int Buckets = 2_000;

    /// <summary>
    /// Thins a line whose x values rise: each of <see cref="Buckets"/> runs of consecutive points keeps its first,
    /// lowest, highest and last point, in their original order, so every spike and the whole range stay visible and
    /// neighbouring runs still join up.
    /// </summary>
    /// <returns>The arrays themselves when they have at most <see cref="MaxDrawn"/> points; otherwise the kept points.</returns>
    public static (double[] Xs, double[] Ys) Line(double[] xs, double[] ys)
    {
        ArgumentNullException.ThrowIfNull(xs);
        ArgumentNullException.ThrowIfNull(ys);
        var n = xs.Length;
        if (n <= MaxDrawn || ys.Length != n)
        {
            return (xs, ys);
        }

        var keptX = new double[4 * Buckets];
        var keptY = new double[4 * Buckets];
        var count = 0;
        Span<int> picks = stackalloc int[4];
        for (var b = 0; b < Buckets; b++)
        {
            var start = (int)((long)n * b / Buckets);
            var end = (int)((long)n * (b + 1) / Buckets);
            int low = start, high = start;
            for (var i = start + 1; i < end; i++)
            {
                if (ys[i] < ys[low])
                {
                    low = i;
                }

                if (ys[i] > ys[high])
                {
                    high = i;
                }
            }

            picks[0] = start;
            picks[1] = Math.Min(low, high);
            picks[2] = Math.Max(low, high);
            picks[3] = end - 1;
            var previous = -1;
            foreach (var index in picks)
            {
                if (index != previous)
                {
                    keptX[count] = xs[index];
                    keptY[count] = ys[index];
                    count++;
                    previous = index;
                }
            }
        }

        return (keptX[..count], keptY[..count]);
    }

    /// <summary>
    /// Thins a scatter: the plotting area is cut into cells of about 2 × 2 pixels and each cell keeps the first point
    /// that falls in it, so the cloud, its edges and its outliers look the same while at most one point per cell is drawn.
    /// </summary>
    /// <returns>The arrays themselves when they have at most <see cref="MaxDrawn"/> points; otherwise the kept points in their original order.</returns>
    public static (double[] Xs, double[] Ys) Scatter(double[] xs, double[] ys)
    {
        ArgumentNullException.ThrowIfNull(xs);
        ArgumentNullException.ThrowIfNull(ys);
        var n = xs.Length;
        if (n <= MaxDrawn || ys.Length != n)
        {
            return (xs, ys);
        }

        double minX = double.PositiveInfinity, maxX = double.NegativeInfinity, minY = double.PositiveInfinity, maxY = double.NegativeInfinity;
        for (var i = 0; i < n; i++)
        {
            minX = Math.Min(minX, xs[i]);
            maxX = Math.Max(maxX, xs[i]);
            minY = Math.Min(minY, ys[i]);
            maxY = Math.Max(maxY, ys[i]);
        }

        const int Columns = ChartStyle.Width / 2;
        const int Rows = ChartStyle.Height / 2;
        var spanX = maxX > minX ? maxX - minX : 1.0;
        var spanY = maxY > minY ? maxY - minY : 1.0;
        var taken = new bool[Columns * Rows];
        var keptX = new List<double>();
        var keptY = new List<double>();
        for (var i = 0; i < n; i++)
        {
            if (!double.IsFinite(xs[i]) || !double.IsFinite(ys[i]))
            {
                continue;
            }

            var column = Math.Min(Columns - 1, (int)((xs[i] - minX) / spanX * Columns));
            var row = Math.Min(Rows - 1, (int)((ys[i] - minY) / spanY * Rows));
            if (!taken[(row * Columns) + column])
            {
                taken[(row * Columns) + column] = true;
                keptX.Add(xs[i]);
                keptY.Add(ys[i]);
            }
        }

        return ([.. keptX], [.. keptY]);
    }
}
