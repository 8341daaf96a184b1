using System.Globalization;
using VolCast.IO;
using VolCast.IO.Csv;
using VolCast.IO.Results;
using VolCast.Reports.Batch;
using VolCast.Reports.Model;

namespace VolCast.Cli.Batch;

/// <summary>
/// Writes summary.csv, lookbacks.csv, beats-implied.csv, forecasts-long.csv and summary.html into the batch's folder as one set: each is
/// written in full to a temporary sibling, then all are moved into place where a second Ctrl-C waits for the moves, so the
/// folder never holds files of two summaries. The files depend only on the rows and the batch's plan, its inputs and settings (not on how many jobs or shards ran),
/// so a single-process batch and shards followed by the reduce write the same bytes.
/// </summary>
internal static class BatchSummaryWriter
{
    /// <summary>
    /// Removes what killed batches or reduces left beside the summary files (hidden temporary files of processes that no
    /// longer run), and temporary plan files by age (<see cref="BatchPlan.RemoveStaleTemporaries"/>: shards on other
    /// machines write the plan too, and their process ids mean nothing here); a batch and a reduce do this when they start.
    /// </summary>
    /// <param name="outputFolder">The batch's output folder.</param>
    public static void RemoveStaleTemporaries(string outputFolder)
    {
        foreach (var name in new[] { "summary.csv", BatchLookbacksCsv.FileName, BeatsImpliedCsv.FileName, BatchForecastsLongCsv.FileName, "summary.html" })
        {
            AtomicFile.RemoveStaleTemporaries(Path.Combine(outputFolder, name));
        }

        BatchPlan.RemoveStaleTemporaries(outputFolder, DateTime.UtcNow);
    }

    /// <summary>Writes the summary files.</summary>
    /// <param name="outputFolder">The batch's output folder.</param>
    /// <param name="plan">The batch's plan: its inputs, configuration, horizon and report pages, as shown on the summary page.</param>
    /// <param name="rows">One row per name, in name order.</param>
    /// <param name="missing">The names left out of a partial summary (the reduce's --allow-missing), or none.</param>
    /// <param name="cancellationToken">Checked before each file: until all are written none is in place, so a stop then leaves the earlier summary whole.</param>
    /// <exception cref="OperationCanceledException">The token was cancelled before the files were moved into place; none was replaced.</exception>
    public static void Write(string outputFolder, BatchPlan plan, IReadOnlyList<BatchAssetRow> rows, IReadOnlyList<string>? missing = null, CancellationToken cancellationToken = default)
    {
        Directory.CreateDirectory(outputFolder);
        using var files = new AtomicFileSet();
        void Text(string name, Action<TextWriter> write)
        {
            cancellationToken.ThrowIfCancellationRequested();
            files.AddText(Path.Combine(outputFolder, name), write, overwrite: true);
        }

        Text("summary.csv", w => BatchSummaryCsv.Write(w, rows));
        Text(BatchLookbacksCsv.FileName, w => BatchLookbacksCsv.Write(w, rows));
        Text(BeatsImpliedCsv.FileName, w => BeatsImpliedCsv.Write(w, rows));
        var assets = Path.Combine(outputFolder, BatchRunner.AssetsFolder);
        Text(BatchForecastsLongCsv.FileName, w => BatchForecastsLongCsv.Write(w, rows.Where(r => r.Succeeded).Select(r => (r.Name, Path.Combine(assets, r.Name)))));
        if (plan.Reports != BatchReports.None)
        {
            Text("summary.html", w => w.Write(Page(plan, rows, missing)));
        }

        // Once every file is written in full, the set goes into place even if a stop comes now: the renames take milliseconds.
        cancellationToken.ThrowIfCancellationRequested();
        Interruption.Process.Uninterrupted(files.Commit);
    }

    private static string Page(BatchPlan plan, IReadOnlyList<BatchAssetRow> rows, IReadOnlyList<string>? missing)
    {

        List<Setting> settings =
        [
            new("Tool version", "volcast " + plan.Version),
            new("Prices folder", plan.PricesFolder),
            new("Implied folder", plan.ImpliedFolder ?? "none (forecasters ranked among themselves)"),
            new("Configuration", plan.Config ?? "defaults"),
            new("Horizon", plan.Horizon),
            new("Names", rows.Count.ToString(CultureInfo.InvariantCulture)),
        ];
        if (missing is { Count: > 0 })
        {
            settings.Add(new("Partial summary", string.Create(CultureInfo.InvariantCulture,
                $"{missing.Count} names had no finished results and are marked as not finished: {string.Join(", ", missing)}")));
        }

        // Without per-name pages, each name links to its folder of data files.
        return BatchSummaryHtml.Render(rows, settings, plan.Reports == BatchReports.Full ? BatchAssetJob.ReportPage : string.Empty);
    }
}
