using System.Globalization;
using VolCast.IO;
using VolCast.IO.Csv;
using VolCast.IO.Results;
using VolCast.Reports.Batch;
using VolCast.Reports.Model;

namespace VolCast.Cli.Batch;

/// <summary>
/// Writes summary.csv, lookbacks.csv, beats-implied.csv, forecasts-long.csv and summary.html into the batch's folder, each atomically (temporary file, then a
/// move). The files depend only on the rows and the request's inputs and settings (not on how many jobs or shards ran),
/// so a single-process batch and shards followed by the reduce write the same bytes.
/// </summary>
internal static class BatchSummaryWriter
{
    /// <summary>Writes the summary files.</summary>
    /// <param name="request">The batch's request.</param>
    /// <param name="rows">One row per name, in name order.</param>
    /// <param name="missing">The names left out of a partial summary (the reduce's --allow-missing), or none.</param>
    public static void Write(BatchRequest request, IReadOnlyList<BatchAssetRow> rows, IReadOnlyList<string>? missing = null)
    {
        Directory.CreateDirectory(request.OutputFolder);
        AtomicFile.WriteText(Path.Combine(request.OutputFolder, "summary.csv"), w => BatchSummaryCsv.Write(w, rows), overwrite: true);
        AtomicFile.WriteText(Path.Combine(request.OutputFolder, BatchLookbacksCsv.FileName), w => BatchLookbacksCsv.Write(w, rows), overwrite: true);
        AtomicFile.WriteText(Path.Combine(request.OutputFolder, BeatsImpliedCsv.FileName), w => BeatsImpliedCsv.Write(w, rows), overwrite: true);
        var assets = Path.Combine(request.OutputFolder, BatchRunner.AssetsFolder);
        AtomicFile.WriteText(Path.Combine(request.OutputFolder, BatchForecastsLongCsv.FileName),
            w => BatchForecastsLongCsv.Write(w, rows.Where(r => r.Succeeded).Select(r => (r.Name, Path.Combine(assets, r.Name)))), overwrite: true);
        if (request.Reports == BatchReports.None)
        {
            return;
        }

        var s = request.Settings;
        List<Setting> settings =
        [
            new("Tool version", "volcast " + BacktestPipeline.ToolVersion()),
            new("Prices folder", request.PricesFolder),
            new("Implied folder", request.ImpliedFolder ?? "none (forecasters ranked among themselves)"),
            new("Configuration", request.Config ?? "defaults"),
            new("Horizon", s.Horizon.TradingDays is int h ? h.ToString(CultureInfo.InvariantCulture) + " trading days" : s.Horizon.ToString()),
            new("Names", rows.Count.ToString(CultureInfo.InvariantCulture)),
        ];
        if (missing is { Count: > 0 })
        {
            settings.Add(new("Partial summary", string.Create(CultureInfo.InvariantCulture,
                $"{missing.Count} names had no finished results and are marked as not finished: {string.Join(", ", missing)}")));
        }

        // Without per-name pages, each name links to its folder of data files.
        var html = BatchSummaryHtml.Render(rows, settings, request.Reports == BatchReports.Full ? BatchAssetJob.ReportPage : string.Empty);
        AtomicFile.WriteText(Path.Combine(request.OutputFolder, "summary.html"), w => w.Write(html), overwrite: true);
    }
}
