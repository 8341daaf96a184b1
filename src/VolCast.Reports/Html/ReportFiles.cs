using VolCast.IO;
using VolCast.Reports.Model;

namespace VolCast.Reports.Html;

/// <summary>Writes a report into a folder: report.html and every chart (the P&amp;L section's and the reliability diagram included) as its own PNG, each file atomically.</summary>
internal static class ReportFiles
{
    /// <summary>The report's file name inside the output folder.</summary>
    public const string ReportFileName = "report.html";

    /// <summary>Writes report.html and the chart PNGs into <paramref name="folder"/>.</summary>
    /// <param name="model">The report.</param>
    /// <param name="folder">The output folder; created when missing.</param>
    /// <param name="overwrite">Replace files that already exist; without it an existing file stops the write.</param>
    /// <param name="cancellationToken">Stops before the page is rendered and between files.</param>
    /// <returns>The paths written, report.html last.</returns>
    /// <exception cref="IOException">A file exists and <paramref name="overwrite"/> is false.</exception>
    /// <exception cref="OperationCanceledException">The token was cancelled.</exception>
    public static IReadOnlyList<string> Write(ReportModel model, string folder, bool overwrite, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(folder);
        cancellationToken.ThrowIfCancellationRequested();
        var html = HtmlReport.Render(model);
        var written = new List<string>();
        IReadOnlyList<ChartImage> charts = [.. model.Pnl?.Charts ?? [], .. model.Charts];
        if (model.YearChart is { } years)
        {
            charts = [.. charts, years];
        }

        if (model.Odds?.Reliability is { } reliability)
        {
            charts = [.. charts, reliability];
        }

        var reportPath = Path.Combine(folder, ReportFileName);
        if (!overwrite)
        {
            // Check every target first, so a refused write leaves nothing half-written.
            foreach (var target in charts.Select(c => Path.Combine(folder, c.FileName)).Append(reportPath))
            {
                if (File.Exists(target))
                {
                    throw new IOException($"{target}: the output file already exists; choose another --out or pass --force to replace it.");
                }
            }
        }

        foreach (var chart in charts)
        {
            cancellationToken.ThrowIfCancellationRequested();
            var path = Path.Combine(folder, chart.FileName);
            AtomicFile.WriteBytes(path, chart.Png, overwrite);
            written.Add(path);
        }

        cancellationToken.ThrowIfCancellationRequested();
        AtomicFile.WriteText(reportPath, w => w.Write(html), overwrite);
        written.Add(reportPath);
        return written;
    }
}
