using System.Globalization;
using VolCast.IO;
using VolCast.IO.Csv;
using VolCast.IO.Results;
using VolCast.Reports.Batch;
using VolCast.Reports.Model;

namespace VolCast.Cli.Batch;

/// <summary>Writes summary.csv, lookbacks.csv, beats-implied.csv and summary.html into the batch's folder, each atomically (temporary file, then a move).</summary>
internal static class BatchSummaryWriter
{
    public static void Write(BatchRequest request, IReadOnlyList<BatchAssetRow> rows)
    {
        Directory.CreateDirectory(request.OutputFolder);
        AtomicFile.WriteText(Path.Combine(request.OutputFolder, "summary.csv"), w => BatchSummaryCsv.Write(w, rows), overwrite: true);
        AtomicFile.WriteText(Path.Combine(request.OutputFolder, BatchLookbacksCsv.FileName), w => BatchLookbacksCsv.Write(w, rows), overwrite: true);
        AtomicFile.WriteText(Path.Combine(request.OutputFolder, BeatsImpliedCsv.FileName), w => BeatsImpliedCsv.Write(w, rows), overwrite: true);
        var s = request.Settings;
        Setting[] settings =
        [
            new("Tool version", "volcast " + BacktestPipeline.ToolVersion()),
            new("Prices folder", request.PricesFolder),
            new("Implied folder", request.ImpliedFolder ?? "none (forecasters ranked among themselves)"),
            new("Configuration", request.Config ?? "defaults"),
            new("Horizon", s.Horizon.TradingDays is int h ? h.ToString(CultureInfo.InvariantCulture) + " trading days" : s.Horizon.ToString()),
            new("Names", rows.Count.ToString(CultureInfo.InvariantCulture)),
            new("Parallel jobs", request.Jobs.ToString(CultureInfo.InvariantCulture)),
        ];
        var html = BatchSummaryHtml.Render(rows, settings);
        AtomicFile.WriteText(Path.Combine(request.OutputFolder, "summary.html"), w => w.Write(html), overwrite: true);
    }
}
