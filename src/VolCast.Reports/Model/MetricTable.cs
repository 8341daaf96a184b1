namespace VolCast.Reports.Model;

/// <summary>A table of metrics with units on every column.</summary>
/// <param name="Title">The table's caption.</param>
/// <param name="Columns">The columns after the row label.</param>
/// <param name="Rows">The rows, in the order to show them.</param>
/// <param name="Note">A sentence under the table, e.g. what the test's null hypothesis is; may be null.</param>
internal sealed record MetricTable(string Title, IReadOnlyList<MetricColumn> Columns, IReadOnlyList<MetricRow> Rows, string? Note = null);
