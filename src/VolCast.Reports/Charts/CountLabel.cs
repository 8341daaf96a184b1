using ScottPlot;

namespace VolCast.Reports.Charts;

/// <summary>One bin's count on the reliability diagram, written beside its interval bar.</summary>
/// <param name="Text">The count as written.</param>
/// <param name="X">The bar's position across (percent).</param>
/// <param name="Top">The bar's upper end (percent): the label's first choice is just above it.</param>
/// <param name="Bottom">The bar's lower end (percent): the label's second choice is just below it.</param>
/// <param name="Color">The forecaster's colour.</param>
internal readonly record struct CountLabel(string Text, double X, double Top, double Bottom, Color Color);
