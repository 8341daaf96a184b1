using VolCast.IO.Results;

namespace VolCast.IO.Csv;

/// <summary>
/// Writes a batch's lookbacks.csv: the adaptive lookback choice of every estimator family on every asset, one row per
/// asset and family (long format): <c>asset, family, most_chosen, share_of_dates, changes</c>.
/// </summary>
public static class BatchLookbacksCsv
{
    /// <summary>The file's name in the batch folder.</summary>
    public const string FileName = "lookbacks.csv";

    /// <summary>Gets the column names.</summary>
    public static IReadOnlyList<string> Columns { get; } = ["asset", "family", "most_chosen", "share_of_dates", "changes"];

    /// <summary>Writes the CSV: the assets in the order given, each asset's families in its own order.</summary>
    /// <param name="writer">Where to write.</param>
    /// <param name="rows">The batch's rows; an asset without adaptive choices (or that failed) has no row.</param>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    public static void Write(TextWriter writer, IEnumerable<BatchAssetRow> rows)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(rows);
        writer.Write(string.Join(',', Columns));
        writer.Write('\n');
        foreach (var r in rows)
        {
            foreach (var l in r.Lookbacks)
            {
                writer.Write(string.Join(',', CsvText.Text(r.Name), CsvText.Text(l.Family), CsvText.Text(l.MostChosen), CsvText.Number(l.Share), CsvText.Integer(l.Changes)));
                writer.Write('\n');
            }
        }
    }
}
