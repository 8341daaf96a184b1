namespace VolCast.Reports.Model;

/// <summary>A column of a metric table: what it measures and in which unit.</summary>
/// <param name="Header">The column name, e.g. <c>QLIKE</c>.</param>
/// <param name="Unit">The unit, e.g. <c>vol points</c> or <c>unitless</c>; shown under the header.</param>
internal sealed record MetricColumn(string Header, string Unit);
