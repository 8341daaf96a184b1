using System.Globalization;
using VolCast.IO.Results;

namespace VolCast.IO.Csv;

/// <summary>
/// Writes a batch's summary.csv: one row per asset, in name order, invariant culture, empty cells where undefined; data
/// only (<c>implied</c> is yes or no), the lookback choices are in <see cref="BatchLookbacksCsv"/>.
/// </summary>
public static class BatchSummaryCsv
{
    /// <summary>Gets the column names.</summary>
    public static IReadOnlyList<string> Columns { get; } =
    [
        "asset", "status", "implied", "n", "best_qlike", "best_qlike_value", "best_dm_qlike_stat", "best_dm_qlike_p",
        "mcs", "mean_iv_minus_rv_vol", "error",
    ];

    /// <summary>Writes the CSV.</summary>
    /// <param name="writer">Where to write.</param>
    /// <param name="rows">The rows, already in the order wanted.</param>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    public static void Write(TextWriter writer, IEnumerable<BatchAssetRow> rows)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(rows);
        writer.Write(string.Join(',', Columns));
        writer.Write('\n');
        foreach (var r in rows)
        {
            string[] cells =
            [
                CsvText.Text(r.Name),
                r.Succeeded ? "done" : "failed",
                r.HasImplied ? "yes" : "no",
                CsvText.Integer(r.Dates),
                CsvText.Text(r.BestQlike ?? string.Empty),
                CsvText.Number(r.BestQlikeValue),
                CsvText.Number(r.BestDmStatistic),
                CsvText.Number(r.BestDmPValue),
                CsvText.Text(string.Join(';', r.McsMembers)),
                CsvText.Number(r.MeanPremium),
                CsvText.Text(r.Error ?? string.Empty),
            ];
            writer.Write(string.Join(',', cells));
            writer.Write('\n');
        }
    }

    /// <summary>Formats one lookback choice as <c>spec (share% of dates, N changes)</c>, as the summary page shows it.</summary>
    /// <param name="lookback">The choice.</param>
    /// <returns>The text.</returns>
    public static string Lookback(BatchLookback lookback)
    {
        ArgumentNullException.ThrowIfNull(lookback);
        return string.Create(CultureInfo.InvariantCulture, $"{lookback.MostChosen} ({lookback.Share:0%} of dates, {lookback.Changes} changes)");
    }
}
