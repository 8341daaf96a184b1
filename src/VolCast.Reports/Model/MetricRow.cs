namespace VolCast.Reports.Model;

/// <summary>A row of a metric table: usually one forecaster, named by its spec.</summary>
/// <param name="Label">The row label, e.g. <c>ewma:0.94</c>.</param>
/// <param name="Cells">One cell per column.</param>
internal sealed record MetricRow(string Label, IReadOnlyList<MetricCell> Cells);
