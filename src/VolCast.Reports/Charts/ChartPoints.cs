namespace VolCast.Reports.Charts;

/// <summary>
/// Thins long series before they are drawn, in one linear pass. A line cannot show more than its lowest and highest
/// point in each pixel column, and a stroke about two pixels wide shows little more than that in each pair of columns,
/// so a line with more than two points per pair of pixel columns of the image is cut into one run per pair and each run
/// drawn by those two points: a 20-year daily series is stroked with under a quarter of its segments (antialiased
/// strokes cost in proportion to their segments). On the demo's charts this moved up to 4.5% of the pixels along the
/// lines' edges and left the rest of every chart unchanged (bench/README.md, "Third session (2026-12-02): trades
/// priced once for both timings, the second core used"). Scatters up
/// to <see cref="MaxDrawn"/> points are drawn exactly as given, since their overlapping translucent markers show density.
/// </summary>
internal static class ChartPoints
{
    /// <summary>A long line is cut into this many runs of consecutive points: one per pair of pixel columns of the image (the data area is narrower, so a run covers a little less than two columns).</summary>
    public const int Buckets = ChartStyle.Width / 2;

    /// <summary>Lines with at most this many points (two per run) are drawn point for point.</summary>
    public const int MaxLinePoints = 2 * Buckets;

    /// <summary>Scatters with at most this many points are drawn point for point.</summary>
    public const int MaxDrawn = 10_000;

    /// <summary>
    /// Thins a line whose x values rise: each of <see cref="Buckets"/> runs of consecutive points keeps its lowest and
    /// highest point, in their original order, and the line keeps its first and last point, so every spike and the whole
    /// range stay visible and neighbouring runs still join up.
    /// </summary>
    /// <returns>The arrays themselves when they have at most <see cref="MaxLinePoints"/> points; otherwise the kept points.</returns>
    public static (double[] Xs, double[] Ys) Line(double[] xs, double[] ys)
    {
        ArgumentNullException.ThrowIfNull(xs);
        ArgumentNullException.ThrowIfNull(ys);
        var n = xs.Length;
        if (n <= MaxLinePoints || ys.Length != n)
        {
            return (xs, ys);
        }

        var keptX = new double[(2 * Buckets) + 2];
        var keptY = new double[keptX.Length];
        var count = 0;
        var previous = -1;
        void Keep(int index)
        {
            if (index != previous)
            {
                keptX[count] = xs[index];
                keptY[count] = ys[index];
                count++;
                previous = index;
            }
        }

        Keep(0);
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

            Keep(Math.Min(low, high));
            Keep(Math.Max(low, high));
        }

        Keep(n - 1);
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
