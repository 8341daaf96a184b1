using ScottPlot;

namespace VolCast.Reports.Charts;

/// <summary>How one named series is drawn in every chart: its colour, its line pattern and its marker shape.</summary>
/// <param name="Color">The colour of its lines and markers.</param>
/// <param name="Pattern">The line pattern; series that share a colour differ here.</param>
/// <param name="Marker">The marker shape where it is drawn as points; series that share a colour differ here too.</param>
internal readonly record struct SeriesStyle(Color Color, LinePattern Pattern, MarkerShape Marker);
