namespace VolCast.IO.Reading;

/// <summary>One non-blank record of a CSV file.</summary>
/// <param name="Line">The 1-based physical line it was read from.</param>
/// <param name="Cells">The cells, unquoted but not trimmed.</param>
internal readonly record struct CsvRow(int Line, string[] Cells);
