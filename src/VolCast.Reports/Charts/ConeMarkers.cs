using ScottPlot;
using ScottPlot.Plottables;

namespace VolCast.Reports.Charts;

/// <summary>
/// The cone's markers for today (implied and the forecasts), each at its own horizon. They are placed when the chart
/// is drawn, in pixels: a marker is drawn on its horizon unless it would cover a marker already drawn there or the
/// latest realized circle, and then it moves the least it must, one marker width at a time, right then left
/// (<see cref="Offsets"/>, <see cref="BoxPlacement"/>). The markers keep their true horizon as their location.
/// </summary>
internal sealed class ConeMarkers : IPlottable
{
    /// <summary>Pixels kept clear around each marker.</summary>
    public const float Pad = 1;

    /// <summary>The most marker widths a marker moves to either side of its horizon.</summary>
    public const int MaxSteps = 6;

    private readonly List<Marker> _markers = [];
    private readonly List<(Coordinates Location, float Size)> _obstacles = [];

    /// <summary>The markers in the order they are placed (earlier markers keep their horizon first).</summary>
    public IReadOnlyList<Marker> Markers => _markers;

    /// <summary>Where the markers were drawn when the chart was last drawn: each one's centre in pixels, in the order of <see cref="Markers"/>.</summary>
    public IReadOnlyList<Pixel> Drawn { get; private set; } = [];

    /// <inheritdoc/>
    public bool IsVisible { get; set; } = true;

    /// <inheritdoc/>
    public IAxes Axes { get; set; } = new Axes();

    /// <inheritdoc/>
    public IEnumerable<LegendItem> LegendItems => _markers.SelectMany(m => m.LegendItems);

    /// <summary>Adds a marker at its horizon (log10 of the days across) and value.</summary>
    public Marker Add(double x, double y)
    {
        var marker = new Marker { Location = new Coordinates(x, y) };
        _markers.Add(marker);
        return marker;
    }

    /// <summary>Marks a point drawn by another plottable (a latest realized circle) that no marker may cover.</summary>
    public void Avoid(double x, double y, float size) => _obstacles.Add((new Coordinates(x, y), size));

    /// <inheritdoc/>
    public AxisLimits GetAxisLimits()
    {
        var limits = AxisLimits.NoLimits;
        foreach (var marker in _markers)
        {
            limits = limits.Expanded(marker.Location);
        }

        return limits;
    }

    /// <summary>The pixel offsets across a marker may take, best first: on its horizon, then one step right, one left, two right, and so on.</summary>
    public static IReadOnlyList<float> Offsets(float step)
    {
        var offsets = new List<float>((2 * MaxSteps) + 1) { 0 };
        for (var k = 1; k <= MaxSteps; k++)
        {
            offsets.Add(k * step);
            offsets.Add(-k * step);
        }

        return offsets;
    }

    /// <inheritdoc/>
    public void Render(RenderPack rp)
    {
        ArgumentNullException.ThrowIfNull(rp);
        var blocked = _obstacles.Select(o => Box(Axes.GetPixel(o.Location), o.Size, 0)).ToList();
        var candidates = new List<IReadOnlyList<PixelRect>>(_markers.Count);
        foreach (var marker in _markers)
        {
            var at = Axes.GetPixel(marker.Location);
            candidates.Add([.. Offsets(marker.MarkerSize + (2 * Pad)).Select(dx => Box(at, marker.MarkerSize, dx))]);
        }

        // A marker with no free place is drawn on its horizon, over whatever is there.
        var boxes = BoxPlacement.PlaceOrFirst(candidates, rp.DataRect, blocked);
        using var paint = Paint.NewDisposablePaint();
        var drawn = new Pixel[_markers.Count];
        for (var i = 0; i < _markers.Count; i++)
        {
            drawn[i] = boxes[i].Center;
            _markers[i].MarkerStyle.Render(rp.Canvas, boxes[i].Center, paint);
        }

        Drawn = drawn;
    }

    private static PixelRect Box(Pixel center, float size, float dx) =>
        new(new Pixel(center.X + dx, center.Y), (size / 2) + Pad);
}
