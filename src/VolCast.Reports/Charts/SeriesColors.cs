using ScottPlot;
using VolCast.Core.Backtest;

namespace VolCast.Reports.Charts;

/// <summary>
/// The one colour map of a report and of the batch page: each series name keeps its colour, line pattern and marker
/// in every chart. Realized volatility is black and implied orange; each forecaster family has a hue of its own where
/// there are enough (garch blue, gjr-garch vermillion, EWMA bluish green, har reddish purple, yang-zhang sky blue), the
/// other families share those hues, and series that share a hue differ by line pattern and marker, in the order the
/// names were first given. Reference lines are grey (<see cref="ChartStyle.Reference"/>).
/// </summary>
/// <remarks>
/// The hues are Okabe and Ito's colour-blind-safe set (Okabe, M. and Ito, K., 2008, "Color Universal Design (CUD):
/// how to make figures and presentations that are friendly to colorblind people", https://jfly.uni-koeln.de/color/),
/// without its yellow, which is too light for thin lines and markers on white.
/// </remarks>
internal sealed class SeriesColors
{
    /// <summary>Line patterns in the order series of one hue receive them.</summary>
    internal static readonly LinePattern[] Patterns = [LinePattern.Solid, LinePattern.Dashed, LinePattern.Dotted, LinePattern.DenselyDashed];

    /// <summary>Marker shapes in the same order as <see cref="Patterns"/>.</summary>
    internal static readonly MarkerShape[] Markers = [MarkerShape.FilledCircle, MarkerShape.FilledSquare, MarkerShape.FilledTriangleUp, MarkerShape.FilledDiamond];

    private static readonly Color[] Hues = [ChartStyle.Blue, ChartStyle.Vermillion, ChartStyle.BluishGreen, ChartStyle.ReddishPurple, ChartStyle.SkyBlue];

    private static readonly Dictionary<string, int> FamilyHue = new(StringComparer.Ordinal)
    {
        ["garch"] = 0,
        ["gjr-garch"] = 1,
        ["ewma"] = 2,
        ["har"] = 3,
        ["yang-zhang"] = 4,
        ["close-to-close"] = 0,
        ["parkinson"] = 2,
        ["garman-klass"] = 3,
        ["rogers-satchell"] = 1,
    };

    private readonly Dictionary<string, SeriesStyle> _styles = new(StringComparer.Ordinal);
    private readonly int[] _usedPerHue = new int[Hues.Length];

    /// <summary>Initializes a map that gives each name its style in the order given; later names get theirs when first asked for.</summary>
    /// <param name="names">Series names (forecaster specs, <c>implied</c>, realized), in the order they should receive patterns.</param>
    public SeriesColors(IEnumerable<string> names)
    {
        ArgumentNullException.ThrowIfNull(names);
        foreach (var name in names)
        {
            _ = Style(name);
        }
    }

    /// <summary>The map of one backtest's report: its forecasters in the order the run lists them, so that every chart of the report, built from the same result, agrees.</summary>
    /// <param name="result">The backtest.</param>
    /// <returns>The map.</returns>
    public static SeriesColors For(BacktestResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        return new SeriesColors(result.Forecasts.Select(f => f.Spec));
    }

    /// <summary>The style of a series, the same on every call for the same name.</summary>
    /// <param name="name">A forecaster spec (<c>garch</c>, <c>yang-zhang:21</c>, <c>adaptive:ewma</c>), <c>implied</c> or a label that starts with it, or a label that starts with <c>realized</c>.</param>
    /// <returns>Its colour, line pattern and marker.</returns>
    public SeriesStyle Style(string name)
    {
        ArgumentNullException.ThrowIfNull(name);
        if (name.StartsWith("realized", StringComparison.Ordinal))
        {
            return new SeriesStyle(ChartStyle.Realized, LinePattern.Solid, MarkerShape.FilledCircle);
        }

        if (name.StartsWith("implied", StringComparison.Ordinal))
        {
            return new SeriesStyle(ChartStyle.Implied, LinePattern.Solid, MarkerShape.FilledDiamond);
        }

        if (_styles.TryGetValue(name, out var style))
        {
            return style;
        }

        var hue = HueOf(name);
        var slot = _usedPerHue[hue]++ % Patterns.Length;
        style = new SeriesStyle(Hues[hue], Patterns[slot], Markers[slot]);
        _styles[name] = style;
        return style;
    }

    /// <summary>The hue index of a spec: by its family (the part before the first colon, after an <c>adaptive:</c> prefix), or a stable hash of the family for families not listed.</summary>
    internal static int HueOf(string name)
    {
        var family = name.StartsWith("adaptive:", StringComparison.Ordinal) ? name["adaptive:".Length..] : name;
        var colon = family.IndexOf(':', StringComparison.Ordinal);
        if (colon >= 0)
        {
            family = family[..colon];
        }

        if (FamilyHue.TryGetValue(family, out var hue))
        {
            return hue;
        }

        // FNV-1a: the same on every run and machine, unlike string.GetHashCode.
        var hash = 2166136261u;
        foreach (var c in family)
        {
            hash = (hash ^ c) * 16777619u;
        }

        return (int)(hash % (uint)Hues.Length);
    }
}
