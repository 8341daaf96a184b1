using VolCast.Reports.Charts;

namespace VolCast.Reports.Tests.Charts;

public sealed class ChartPointsTests
{
    private static (double[] Xs, double[] Ys) Walk(int n, int seed)
    {
        var random = new Random(seed);
        var xs = new double[n];
        var ys = new double[n];
        var y = 20.0;
        for (var i = 0; i < n; i++)
        {
            y += random.NextDouble() - 0.5;
            xs[i] = i;
            ys[i] = y;
        }

        return (xs, ys);
    }

    [Fact]
    public void Line_ShortSeries_IsDrawnPointForPoint()
    {
        var (xs, ys) = Walk(ChartPoints.MaxLinePoints, 1);

        var (drawnX, drawnY) = ChartPoints.Line(xs, ys);

        Assert.Same(xs, drawnX);
        Assert.Same(ys, drawnY);
    }

    [Theory]
    [InlineData(1_000_003)]
    [InlineData(5_171)]
    public void Line_LongSeries_KeepsEveryRunsExtremesAndEnds_WithAtMostTwoPointsPerPixelColumn(int n)
    {
        // Min/max thinning per pixel column is the usual way to draw a long line without losing spikes
        // (common practice, no source). A single spike must survive, in a million points and in 20 years of days.
        var (xs, ys) = Walk(n, 2);
        ys[(n * 2) / 3] = 1e6;
        ys[n / 9] = -1e6;

        var (drawnX, drawnY) = ChartPoints.Line(xs, ys);

        Assert.True(drawnX.Length <= (2 * 1200) + 2, drawnX.Length.ToString(System.Globalization.CultureInfo.InvariantCulture));
        Assert.True(drawnX.Length < n, "a line longer than two points per pixel column is thinned");
        Assert.Equal(xs[0], drawnX[0]);
        Assert.Equal(xs[^1], drawnX[^1]);
        Assert.Contains(1e6, drawnY);
        Assert.Contains(-1e6, drawnY);
        Assert.Equal(ys.Max(), drawnY.Max());
        Assert.Equal(ys.Min(), drawnY.Min());
        for (var i = 1; i < drawnX.Length; i++)
        {
            Assert.True(drawnX[i] > drawnX[i - 1], "the kept points stay in date order");
        }

        // Every kept point is a point of the series, at its own x.
        for (var i = 0; i < drawnX.Length; i++)
        {
            Assert.Equal(ys[(int)drawnX[i]], drawnY[i]);
        }
    }

    [Fact]
    public void Scatter_LongCloud_KeepsItsEdgesAndOnePointPerCell()
    {
        var random = new Random(3);
        var n = 500_000;
        var xs = new double[n];
        var ys = new double[n];
        for (var i = 0; i < n; i++)
        {
            xs[i] = random.NextDouble();
            ys[i] = xs[i] + (0.1 * random.NextDouble());
        }

        xs[77] = 50;
        ys[77] = -40;

        var (drawnX, drawnY) = ChartPoints.Scatter(xs, ys);

        Assert.True(drawnX.Length <= (1200 / 2) * (600 / 2));
        Assert.Contains(50.0, drawnX);
        Assert.Contains(-40.0, drawnY);
        Assert.True(drawnX.Length < n / 10);
    }
}
