using System.Globalization;
using ScottPlot;
using SkiaSharp;
using VolCast.Core.Trading;

namespace VolCast.Reports.Charts;

/// <summary>The report's look: one font, a colour-blind-safe palette, print-legible sizes, fixed pixel size.</summary>
internal static class ChartStyle
{
    /// <summary>Width of every chart in pixels.</summary>
    public const int Width = 1200;

    /// <summary>Height of every chart in pixels.</summary>
    public const int Height = 600;

    /// <summary>The font every label uses; Debian's fonts-dejavu-core ships it, and .ci/run installs it.</summary>
    public const string FontName = "DejaVu Sans";

    /// <summary>Black, for the realized series that everything else is judged against.</summary>
    public static readonly Color Realized = Color.FromHex("#000000");

    /// <summary>Okabe-Ito orange, for implied volatility (and the premium, which is implied's).</summary>
    public static readonly Color Implied = Color.FromHex("#E69F00");

    /// <summary>Okabe-Ito sky blue.</summary>
    public static readonly Color SkyBlue = Color.FromHex("#56B4E9");

    /// <summary>Okabe-Ito bluish green.</summary>
    public static readonly Color BluishGreen = Color.FromHex("#009E73");

    /// <summary>Okabe-Ito blue.</summary>
    public static readonly Color Blue = Color.FromHex("#0072B2");

    /// <summary>Okabe-Ito vermillion.</summary>
    public static readonly Color Vermillion = Color.FromHex("#D55E00");

    /// <summary>Okabe-Ito reddish purple.</summary>
    public static readonly Color ReddishPurple = Color.FromHex("#CC79A7");

    /// <summary>Dark grey for reference lines (zero, y = x, means of a whole sample).</summary>
    public static readonly Color Reference = Color.FromHex("#555555");

    /// <summary>Mid grey for secondary references and for bars that stand for no series.</summary>
    public static readonly Color Neutral = Color.FromHex("#8C8C8C");

    /// <summary>Light grey for shaded reference bands.</summary>
    public static readonly Color Band = Color.FromHex("#BDBDBD");

    /// <summary>
    /// The colour of each trading rule, the same in every P&amp;L chart: always-sell (the benchmark) dark grey, proposed
    /// blue, current vermillion, plain historical bluish green, walk-forward threshold reddish purple.
    /// </summary>
    public static Color Rule(TradingRule rule) => rule switch
    {
        TradingRule.AlwaysSell => Reference,
        TradingRule.Proposed => Blue,
        TradingRule.Current => Vermillion,
        TradingRule.Historical => BluishGreen,
        _ => ReddishPurple,
    };

    /// <summary>A new plot with the title, axis labels, font and sizes set.</summary>
    public static Plot NewPlot(string title, string xLabel, string yLabel)
    {
        var plot = new Plot();
        plot.Title(title, size: 24);
        plot.XLabel(xLabel, size: 19);
        plot.YLabel(yLabel, size: 19);
        plot.Axes.Bottom.TickLabelStyle.FontSize = 16;
        plot.Axes.Left.TickLabelStyle.FontSize = 16;
        plot.Legend.FontSize = 16;
        plot.Font.Set(FontName);
        return plot;
    }

    /// <summary>Puts the legend below the data area, laid out across, so it never covers data.</summary>
    public static void LegendBelow(Plot plot)
    {
        plot.Legend.FontName = FontName;
        plot.ShowLegend(Edge.Bottom);
        plot.Legend.Orientation = Orientation.Horizontal;
    }

    /// <summary>Turns the bottom axis into a date axis and labels it (the date axis replaces the old one and its label).</summary>
    public static void DateAxis(Plot plot, string label)
    {
        plot.Axes.DateTimeTicksBottom();
        plot.Axes.Bottom.Label.Text = label;
        plot.Axes.Bottom.Label.FontSize = 19;
        plot.Axes.Bottom.Label.FontName = FontName;
        plot.Axes.Bottom.TickLabelStyle.FontSize = 16;
        plot.Axes.Bottom.TickLabelStyle.FontName = FontName;
    }

    /// <summary>
    /// How the charts are compressed: the "up" filter alone at zlib level 3. Measured on the report's charts it encodes
    /// four to six times faster than the encoder's default (every filter tried per row, level 6) and the files come out
    /// about as large, because a chart's rows mostly repeat the row above (bench/README.md, "Reports").
    /// </summary>
    private static readonly SKPngEncoderOptions PngOptions = new(SKPngEncoderFilterFlags.Up, 3);

    /// <summary>Renders a plot at the fixed size as PNG bytes.</summary>
    public static byte[] Png(Plot plot) => Png(plot, Height);

    /// <summary>Renders a plot at the fixed width and the given height as PNG bytes.</summary>
    public static byte[] Png(Plot plot, int height)
    {
        ArgumentNullException.ThrowIfNull(plot);
        return Png(height, canvas => plot.Render(canvas, new PixelRect(0, Width, height, 0)));
    }

    /// <summary>
    /// Draws onto a white canvas of the fixed width and the given height and encodes it once as PNG, without an alpha
    /// channel (the white ground makes every pixel opaque, so the alpha bytes would only be compressed away).
    /// </summary>
    public static byte[] Png(int height, Action<SKCanvas> draw)
    {
        ArgumentNullException.ThrowIfNull(draw);
        using var surface = SKSurface.Create(new SKImageInfo(Width, height, SKColorType.Rgba8888, SKAlphaType.Premul))
            ?? throw new InvalidOperationException($"Could not create a {Width}×{height} drawing surface.");
        surface.Canvas.Clear(SKColors.White);
        draw(surface.Canvas);
        using var image = surface.Snapshot();
        using var pixels = image.PeekPixels();
        using var opaque = new SKPixmap(pixels.Info.WithAlphaType(SKAlphaType.Opaque), pixels.GetPixels(), pixels.RowBytes);
        using var data = opaque.Encode(PngOptions)
            ?? throw new InvalidOperationException($"Could not encode a {Width}×{height} chart as PNG.");
        return data.ToArray();
    }

    /// <summary>
    /// Turns the bottom axis into a log scale: the caller draws log10 of its x values, and the ticks stand at the given
    /// values (for example the lookbacks swept), labelled in plain numbers.
    /// </summary>
    public static void LogTicksBottom(Plot plot, IEnumerable<double> values) =>
        plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericManual(LogTicks(values));

    /// <summary>Turns the left axis into a log scale with ticks at the given values (the caller draws log10 of its y values).</summary>
    public static void LogTicksLeft(Plot plot, IEnumerable<double> values) =>
        plot.Axes.Left.TickGenerator = new ScottPlot.TickGenerators.NumericManual(LogTicks(values));

    /// <summary>Round values (1, 2, 5 times a power of ten) from below <paramref name="low"/> to above <paramref name="high"/>, for a log axis.</summary>
    public static double[] RoundLogValues(double low, double high)
    {
        var values = new List<double>();
        if (!(low > 0) || !(high >= low))
        {
            return [];
        }

        for (var power = Math.Floor(Math.Log10(low)); power <= Math.Ceiling(Math.Log10(high)); power++)
        {
            foreach (var step in new[] { 1.0, 2.0, 5.0 })
            {
                var value = step * Math.Pow(10, power);
                if (value >= low / 2.5 && value <= high * 2.5)
                {
                    values.Add(value);
                }
            }
        }

        return [.. values];
    }

    private static Tick[] LogTicks(IEnumerable<double> values) =>
        [.. values.Where(v => v > 0).Distinct().Order().Select(v => new Tick(Math.Log10(v), v.ToString("0.###", System.Globalization.CultureInfo.InvariantCulture)))];

    /// <summary>Draws the thin reference line at zero that every chart with a signed axis has.</summary>
    public static void ZeroLine(Plot plot)
    {
        var zero = plot.Add.HorizontalLine(0);
        zero.Color = Reference;
        zero.LineWidth = 1;
    }

    /// <summary>
    /// One bar of a chart by calendar year with several series side by side: series <paramref name="series"/> of
    /// <paramref name="seriesCount"/> takes its slot within the 0.8-wide group centred on the year.
    /// </summary>
    public static Bar YearBar(int year, int series, int seriesCount, double value, Color color)
    {
        var slot = 0.8 / Math.Max(1, seriesCount);
        return new Bar { Position = year - 0.4 + (slot * (series + 0.5)), Value = value, Size = slot * 0.95, FillColor = color, LineWidth = 0 };
    }

    /// <summary>Labels the bottom axis with the calendar years, one tick each.</summary>
    public static void YearTicks(Plot plot, IEnumerable<int> years)
    {
        var ticks = years.Select(y => new Tick(y, y.ToString(CultureInfo.InvariantCulture))).ToArray();
        plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericManual(ticks);
    }

    /// <summary>A date as the x coordinate ScottPlot's date axis reads.</summary>
    public static double X(DateOnly date) => date.ToDateTime(TimeOnly.MinValue).ToOADate();
}
