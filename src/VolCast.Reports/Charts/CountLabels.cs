using ScottPlot;

namespace VolCast.Reports.Charts;

/// <summary>
/// The reliability diagram's bin counts, written upright beside the interval bars and placed when the chart is drawn,
/// in pixels, so that no label covers another: each goes just above its bar if that space is free, else just below
/// it, else a little further up or down the bar's line (<see cref="Candidates"/>, <see cref="BoxPlacement"/>).
/// </summary>
internal sealed class CountLabels : IPlottable
{
    /// <summary>The labels' font size in pixels.</summary>
    public const float FontSize = 11;

    /// <summary>Pixels between a bar's end and its label.</summary>
    public const float Gap = 4;

    /// <summary>Pixels between one candidate place along the bar's line and the next.</summary>
    public const float Step = 5;

    /// <summary>Pixels kept clear around each label's digits.</summary>
    public const float Pad = 1;

    private readonly List<CountLabel> _labels = [];

    /// <summary>The labels in the order they are placed (earlier labels get their first choice).</summary>
    public IReadOnlyList<CountLabel> Labels => _labels;

    /// <summary>Where the labels were written when the chart was last drawn: each one's box, in the order of <see cref="Labels"/>.</summary>
    public IReadOnlyList<PixelRect> Placed { get; private set; } = [];

    /// <inheritdoc/>
    public bool IsVisible { get; set; } = true;

    /// <inheritdoc/>
    public IAxes Axes { get; set; } = new Axes();

    /// <inheritdoc/>
    public IEnumerable<LegendItem> LegendItems => LegendItem.None;

    /// <summary>Adds a label; it is placed after those added before it.</summary>
    public void Add(CountLabel label) => _labels.Add(label);

    /// <summary>The labels take no part in the axis limits (the diagram sets its own).</summary>
    public AxisLimits GetAxisLimits() => AxisLimits.NoLimits;

    /// <summary>
    /// The places a label may take, best first, as pixel boxes of its digits: just above the bar's upper end, just below
    /// its lower end, then one <see cref="Step"/> further up, one further down, and so on until both run out of
    /// <paramref name="area"/>.
    /// </summary>
    /// <param name="x">The bar's pixel column.</param>
    /// <param name="top">The pixel row of the bar's upper end.</param>
    /// <param name="bottom">The pixel row of the bar's lower end.</param>
    /// <param name="thickness">The digits' extent across (the font's cap height), padding included.</param>
    /// <param name="length">The label's extent along the bar (its text width), padding included.</param>
    /// <param name="area">The data area: no candidate is made wholly beyond it.</param>
    public static IReadOnlyList<PixelRect> Candidates(float x, float top, float bottom, float thickness, float length, PixelRect area)
    {
        var left = x - (thickness / 2);
        var right = x + (thickness / 2);
        var candidates = new List<PixelRect>();
        for (var k = 0; ; k++)
        {
            var upper = top - Gap - (k * Step);
            var lower = bottom + Gap + (k * Step);
            var roomAbove = upper - length >= area.Top;
            var roomBelow = lower + length <= area.Bottom;
            if (!roomAbove && !roomBelow)
            {
                // The first two are always offered so that every label has a place to fall back on.
                if (k == 0)
                {
                    candidates.Add(new PixelRect(left, right, upper, upper - length));
                    candidates.Add(new PixelRect(left, right, lower + length, lower));
                }

                return candidates;
            }

            if (roomAbove || k == 0)
            {
                candidates.Add(new PixelRect(left, right, upper, upper - length));
            }

            if (roomBelow || k == 0)
            {
                candidates.Add(new PixelRect(left, right, lower + length, lower));
            }
        }
    }

    /// <inheritdoc/>
    public void Render(RenderPack rp)
    {
        ArgumentNullException.ThrowIfNull(rp);
        using var paint = Paint.NewDisposablePaint();
        var style = new LabelStyle { FontName = ChartStyle.FontName, FontSize = FontSize, Rotation = -90, Alignment = Alignment.MiddleLeft };
        style.ApplyToPaint(paint);
        var (lineHeight, metrics) = paint.GetFontMetrics();

        // Turned a quarter left, the text's baseline runs up the image and its digits stand to the baseline's left, the
        // cap height wide; with the label anchored middle-left, the baseline sits (line height / 2 − descent) right of
        // the anchor. The boxes are the digits themselves, so neighbouring forecasters' labels may stand side by side.
        var baseline = (lineHeight / 2) - metrics.Bottom;
        var thickness = metrics.CapHeight + (2 * Pad);
        var candidates = new List<IReadOnlyList<PixelRect>>(_labels.Count);
        foreach (var label in _labels)
        {
            var length = style.Measure(label.Text, paint).Width + (2 * Pad);
            candidates.Add(Candidates(Axes.GetPixelX(label.X), Axes.GetPixelY(label.Top), Axes.GetPixelY(label.Bottom), thickness, length, rp.DataRect));
        }

        // A label with no free place is still written at its first choice, over another: the pooled counts are written
        // nowhere else (calibration.csv has them per strike, the report's tables not at all).
        var placed = BoxPlacement.PlaceOrFirst(candidates, rp.DataRect);
        for (var i = 0; i < _labels.Count; i++)
        {
            var box = placed[i];
            style.ForeColor = _labels[i].Color;
            var anchor = new Pixel(box.HorizontalCenter - baseline + (metrics.CapHeight / 2), box.Bottom - Pad);
            style.Render(rp.Canvas, anchor, paint, _labels[i].Text);
        }

        Placed = placed;
    }
}
