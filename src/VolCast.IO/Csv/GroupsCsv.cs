using VolCast.Core.Backtest;

namespace VolCast.IO.Csv;

/// <summary>Writes groups.csv: each forecaster against implied by calendar year, by volatility regime and by event windows (<see cref="GroupedResults"/>).</summary>
public static class GroupsCsv
{
    /// <summary>The file's name in the results folder.</summary>
    public const string FileName = "groups.csv";

    /// <summary>The columns, in order.</summary>
    public static IReadOnlyList<string> Columns { get; } = ["grouping", "group", "forecaster", "n", "qlike", "implied_qlike", "dm_qlike_stat", "dm_qlike_p"];

    /// <summary>Writes the table.</summary>
    /// <param name="writer">Where to write.</param>
    /// <param name="groups">The groups.</param>
    public static void Write(TextWriter writer, GroupedResults groups)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(groups);
        CsvText.WriteHeader(writer, Columns);
        foreach (var r in groups.Rows)
        {
            CsvText.WriteRecord(writer, [
                CsvText.Text(r.Grouping), CsvText.Text(r.Group), CsvText.Text(r.Spec), CsvText.Integer(r.Count), CsvText.Number(r.Qlike),
                CsvText.Number(r.ImpliedQlike), CsvText.Number(r.Dm?.Statistic), CsvText.Number(r.Dm?.PValue)]);
        }
    }
}
