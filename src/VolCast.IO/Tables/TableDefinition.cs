using System.Text.Json;
using VolCast.IO.Csv;

namespace VolCast.IO.Tables;

/// <summary>An output table defined once: its columns in order, from which the CSV file and the JSON rows are both written.</summary>
/// <typeparam name="TRow">The row type.</typeparam>
public sealed class TableDefinition<TRow>
{
    /// <summary>Creates the definition.</summary>
    /// <param name="columns">The columns, in the order they are written.</param>
    /// <exception cref="ArgumentException">Two columns share a name, or there is none.</exception>
    public TableDefinition(IReadOnlyList<TableColumn<TRow>> columns)
    {
        ArgumentNullException.ThrowIfNull(columns);
        if (columns.Count == 0)
        {
            throw new ArgumentException("a table needs at least one column.", nameof(columns));
        }

        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var c in columns)
        {
            if (!seen.Add(c.Name))
            {
                throw new ArgumentException($"column names must be unique; '{c.Name}' appears twice.", nameof(columns));
            }
        }

        Columns = columns;
        Names = [.. columns.Select(c => c.Name)];
    }

    /// <summary>Gets the columns in order.</summary>
    public IReadOnlyList<TableColumn<TRow>> Columns { get; }

    /// <summary>Gets the column names in order (the CSV header and the JSON keys).</summary>
    public IReadOnlyList<string> Names { get; }

    /// <summary>Gets a column by name.</summary>
    /// <param name="name">The column name.</param>
    /// <returns>The column.</returns>
    /// <exception cref="KeyNotFoundException">No column has that name.</exception>
    public TableColumn<TRow> this[string name] =>
        Columns.FirstOrDefault(c => c.Name == name) ?? throw new KeyNotFoundException($"the table has no column '{name}'.");

    /// <summary>Writes the CSV: the header, then one record per row; LF line ends.</summary>
    /// <param name="writer">Where to write.</param>
    /// <param name="rows">The rows in order.</param>
    public void WriteCsv(TextWriter writer, IEnumerable<TRow> rows)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(rows);
        CsvText.WriteHeader(writer, Names);
        foreach (var row in rows)
        {
            // Cell by cell into the writer: the same text as joining ToCsv() with commas, without a string per cell.
            for (var c = 0; c < Columns.Count; c++)
            {
                if (c > 0)
                {
                    writer.Write(',');
                }

                Columns[c].Value(row).WriteCsv(writer);
            }

            writer.Write('\n');
        }
    }

    /// <summary>Writes one row as a JSON object whose keys are the column names, in order.</summary>
    /// <param name="json">The writer, where a value is expected.</param>
    /// <param name="row">The row.</param>
    public void WriteJson(Utf8JsonWriter json, TRow row)
    {
        ArgumentNullException.ThrowIfNull(json);
        json.WriteStartObject();
        foreach (var c in Columns)
        {
            c.Value(row).WriteJson(json, c.Name);
        }

        json.WriteEndObject();
    }
}
