using System.Globalization;
using VolCast.IO;
using VolCast.IO.Csv;
using VolCast.IO.Results;
using VolCast.Reports.Model;
using VolCast.Reports.Scan;

namespace VolCast.Cli.Scan;

/// <summary>Writes summary.csv, beats-implied.csv and summary.html into the scan's folder, each atomically (temporary file, then a move).</summary>
internal static class ScanSummaryWriter
{
    public static void Write(ScanRequest request, IReadOnlyList<ScanAssetRow> rows)
    {
        Directory.CreateDirectory(request.OutputFolder);
        AtomicFile.WriteText(Path.Combine(request.OutputFolder, "summary.csv"), w => ScanSummaryCsv.Write(w, rows), overwrite: true);
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
        var html = ScanSummaryHtml.Render(rows, settings);
        AtomicFile.WriteText(Path.Combine(request.OutputFolder, "summary.html"), w => w.Write(html), overwrite: true);
    }
}
