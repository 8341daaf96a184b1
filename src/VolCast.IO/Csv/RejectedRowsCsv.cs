namespace VolCast.IO.Csv;

/// <summary>Writes <c>rejected-rows.csv</c>: every input row left out of the run, with why.</summary>
/// <remarks>
/// Columns: <c>file, line, date, kind, reason</c>. <c>kind</c> is <c>bad row</c> (failed a row check and left out
/// with --skip-bad-rows) or <c>suspect</c> (passed the row checks, found suspect and dropped with --suspect drop);
/// <c>date</c> is empty when the row's date could not be read. Rows in file and line order; LF line ends.
/// </remarks>
public static class RejectedRowsCsv
{
    /// <summary>The header row, without the line end.</summary>
    public const string Header = "file,line,date,kind,reason";

    /// <summary>Writes the table to a writer the caller owns.</summary>
    /// <param name="writer">Where the text goes.</param>
    /// <param name="rows">The rows left out.</param>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    public static void Write(TextWriter writer, IReadOnlyList<RejectedRow> rows)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(rows);
        writer.Write(Header);
        writer.Write('\n');
        foreach (var row in rows)
        {
            CsvText.WriteRecord(writer, [
                CsvText.Text(row.File),
                CsvText.Integer(row.Line),
                row.Date is DateOnly d ? CsvText.Date(d) : string.Empty,
                CsvText.Text(row.Kind),
                CsvText.Text(row.Reason, alwaysQuote: true),
            ]);
        }
    }
}
