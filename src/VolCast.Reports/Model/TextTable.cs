namespace VolCast.Reports.Model;

/// <summary>A table of cells already formatted as text (numbers, dates and words mixed), with its caption and a note.</summary>
/// <param name="Title">The table's caption.</param>
/// <param name="Headers">The column headers, the first one over the row labels.</param>
/// <param name="Rows">The rows, each with one cell per header; the first cell is the row label.</param>
/// <param name="Note">A sentence under the table saying how to read it; may be null.</param>
public sealed record TextTable(string Title, IReadOnlyList<string> Headers, IReadOnlyList<IReadOnlyList<string>> Rows, string? Note = null);
