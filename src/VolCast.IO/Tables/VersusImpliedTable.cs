using VolCast.Core.Scoring;
using VolCast.IO.Results;

namespace VolCast.IO.Tables;

/// <summary>
/// The batch's cross-name table, defined once: per forecaster, on how many names it beats implied on QLIKE before and
/// after the Benjamini-Hochberg correction (<see cref="VersusImpliedFdr"/>). beats-implied.csv is this table, and the
/// summary page shows the same rows.
/// </summary>
public static class VersusImpliedTable
{
    /// <summary>Gets the definition.</summary>
    public static TableDefinition<VersusImpliedFdrRow> Definition { get; } = new(
    [
        new("forecaster", "the forecaster's spec", r => TableCell.Text(r.Spec)),
        new("names_tested", "count of names with a Diebold-Mariano test against implied", r => TableCell.Count(r.NamesTested)),
        new("beats_uncorrected", "count of names with a negative statistic and a raw two-sided p-value at most the level", r => TableCell.Count(r.BeatsUncorrected)),
        new("beats_after_fdr", "count of names with a negative statistic and a Benjamini-Hochberg adjusted p-value at most the level", r => TableCell.Count(r.BeatsAfterFdr)),
        new("share_beats_after_fdr", "share of the names tested, 0 to 1", r => TableCell.Number(r.ShareBeatsAfterFdr)),
        new("loses_after_fdr", "count of names with a positive statistic (implied better) and an adjusted p-value at most the level", r => TableCell.Count(r.LosesAfterFdr)),
        new("fdr_level", "the false discovery rate level q", _ => TableCell.Number(VersusImpliedFdr.DefaultLevel)),
    ]);

    /// <summary>The rows of a batch: every name's tests of each forecaster against implied, counted per forecaster.</summary>
    /// <param name="rows">The batch's rows (failed rows and rows without implied contribute nothing).</param>
    /// <returns>One row per forecaster, in the order forecasters first appear.</returns>
    public static IReadOnlyList<VersusImpliedFdrRow> Rows(IEnumerable<BatchAssetRow> rows)
    {
        ArgumentNullException.ThrowIfNull(rows);
        return VersusImpliedFdr.Count(rows.SelectMany(r => r.VersusImplied).Select(t => (t.Spec, t.Statistic, t.PValue)));
    }
}
