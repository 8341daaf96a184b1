using ScottPlot;
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

    /// <summary>Okabe and Ito's colour-blind-safe palette without black: orange, sky blue, bluish green, yellow, blue, vermillion, reddish purple.</summary>
    public static readonly Color[] Palette =
    [
        Color.FromHex("#E69F00"),
        Color.FromHex("#56B4E9"),
        Color.FromHex("#009E73"),
        Color.FromHex("#0072B2"),
        Color.FromHex("#D55E00"),
        Color.FromHex("#CC79A7"),
        Color.FromHex("#F0E442"),
    ];

    /// <summary>Grey for reference lines (zero, 45°).</summary>
    public static readonly Color Reference = Color.FromHex("#555555");

    /// <summary>
    /// The colour of each trading rule, the same in every P&amp;L chart: always-sell (the benchmark) black, proposed
    /// blue, current orange, plain historical bluish green, walk-forward threshold reddish purple.
    /// </summary>
    public static Color Rule(TradingRule rule) => rule switch
    {
        TradingRule.AlwaysSell => Realized,
        TradingRule.Proposed => Palette[3],
        TradingRule.Current => Palette[0],
        TradingRule.Historical => Palette[2],
        _ => Palette[5],
    };

    /// <summary>The colour of the i-th series after realized.</summary>
    public static Color Series(int index) => Palette[index % Palette.Length];

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

    /// <summary>Renders a plot at the fixed size as PNG bytes.</summary>
    public static byte[] Png(Plot plot) => plot.GetImageBytes(Width, Height, ImageFormat.Png);

    /// <summary>A date as the x coordinate ScottPlot's date axis reads.</summary>
    public static double X(DateOnly date) => date.ToDateTime(TimeOnly.MinValue).ToOADate();
}
