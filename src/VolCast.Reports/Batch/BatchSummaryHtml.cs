using System.Globalization;
using System.Text;
using VolCast.Core.Scoring;
using VolCast.IO.Csv;
using VolCast.IO.Results;
using VolCast.IO.Tables;
using VolCast.Reports.Html;
using VolCast.Reports.Model;

namespace VolCast.Reports.Batch;

/// <summary>
/// Renders a batch's summary.html: the cross-asset picture, self-contained like report.html (inline CSS, charts as PNG
/// data URIs, no scripts, the same Content-Security-Policy), with relative links to each asset's report.
/// </summary>
/// <remarks>Every string from the rows is HTML-escaped; numbers use the invariant culture.</remarks>
public static class BatchSummaryHtml
{
    /// <summary>The section ids, in the order they appear.</summary>
    public static IReadOnlyList<string> SectionIds { get; } = ["overview", "beats-implied", "charts", "assets", "settings", "cautions"];

    private const string Css = """
        body{font-family:"DejaVu Sans",Arial,Helvetica,sans-serif;color:#111;background:#fff;max-width:1240px;margin:0 auto;padding:16px 24px;line-height:1.45}
        h1{font-size:1.7em;margin:.2em 0 .4em}
        h2{font-size:1.3em;border-bottom:2px solid #0072B2;padding-bottom:4px;margin-top:1.6em}
        table{border-collapse:collapse;margin:.4em 0 .8em;font-size:.95em}
        th,td{border:1px solid #bbb;padding:4px 10px;text-align:right;vertical-align:top}
        th:first-child,td:first-child{text-align:left;white-space:nowrap}
        td.text,th.text{text-align:left}
        thead th{background:#f0f0f0}
        tr.failed td{background:#fdf0e8}
        .note{font-size:.9em;color:#333}
        figure{margin:1em 0 1.6em;page-break-inside:avoid;break-inside:avoid}
        figure img{width:100%;max-width:1200px;height:auto;border:1px solid #ddd}
        figcaption{font-size:.92em;color:#333}
        figcaption strong{display:block;color:#111;font-size:1.05em}
        .cautions{border-left:4px solid #D55E00;padding-left:14px}
        """;

    /// <summary>Renders the page.</summary>
    /// <param name="rows">One row per asset, in the order to show.</param>
    /// <param name="settings">The batch's settings as name/value pairs (shown as given).</param>
    /// <param name="reportFileName">The file name of each asset's report inside <c>assets/NAME/</c>, linked relatively.</param>
    /// <returns>The complete HTML document.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    public static string Render(IReadOnlyList<BatchAssetRow> rows, IReadOnlyList<Setting> settings, string reportFileName = "report.html")
    {
        ArgumentNullException.ThrowIfNull(rows);
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentNullException.ThrowIfNull(reportFileName);
        var html = new StringBuilder(256 * 1024);
        html.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
        html.Append("<meta http-equiv=\"Content-Security-Policy\" content=\"").Append(HtmlReport.ContentSecurityPolicy).Append("\">\n");
        html.Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n");
        var title = Title(rows.Count);
        html.Append("<title>").Append(HtmlReport.E(title)).Append("</title>\n<style>\n").Append(Css).Append("\n</style>\n</head>\n<body>\n");
        html.Append("<h1>").Append(HtmlReport.E(title)).Append("</h1>\n");

        var done = rows.Count(r => r.Succeeded);
        var failed = rows.Count - done;
        var withoutImplied = rows.Count(r => r.Succeeded && !r.HasImplied);
        html.Append("<section id=\"overview\">\n<h2>Overview</h2>\n<ul>\n");
        Li(html, Outcome(rows.Count, done, failed));
        Li(html, withoutImplied == 0
            ? (done == 0 ? "No name was backtested, so none was compared with implied." : "Every name backtested had an implied file.")
            : I($"{Names(withoutImplied)} had no implied file: {(withoutImplied == 1 ? "its" : "their")} forecasters are ranked among themselves and take no part in the comparison with implied."));
        Li(html, "Every name was run with the same configuration; each name's own report holds its full results.");
        html.Append("</ul>\n</section>\n");

        FdrSection(html, rows);

        html.Append("<section id=\"charts\">\n<h2>Charts</h2>\n");
        Figure(html, BatchCharts.DmDistribution(rows));
        Figure(html, BatchCharts.PremiumByName(rows));
        html.Append("</section>\n");

        AssetsSection(html, rows, reportFileName);

        html.Append("<section id=\"settings\">\n<h2>Settings</h2>\n<table>\n<tbody>\n");
        foreach (var s in settings)
        {
            html.Append("<tr><th scope=\"row\">").Append(HtmlReport.E(s.Name)).Append("</th><td class=\"text\">").Append(HtmlReport.E(s.Value)).Append("</td></tr>\n");
        }

        html.Append("</tbody>\n</table>\n</section>\n");
        html.Append("<section id=\"cautions\">\n<h2>Cautions</h2>\n<div class=\"cautions\">\n");
        html.Append("<p>").Append(HtmlReport.E("A forecaster that beats implied on a few names out of many may have done so by luck; the share after the false discovery rate correction is the figure to read.")).Append("</p>\n");
        foreach (var caution in ReportText.Cautions)
        {
            html.Append("<p>").Append(HtmlReport.E(caution)).Append("</p>\n");
        }

        html.Append("</div>\n</section>\n</body>\n</html>\n");
        return html.ToString();
    }

    private static void FdrSection(StringBuilder html, IReadOnlyList<BatchAssetRow> rows)
    {
        var table = VersusImpliedTable.Rows(rows);
        html.Append("<section id=\"beats-implied\">\n<h2>Where each forecaster beats implied</h2>\n");
        html.Append("<p class=\"note\">").Append(HtmlReport.E(I(
            $"Diebold-Mariano test on QLIKE against implied, one per name (two-sided, Newey-West variance). Testing many names at once makes some wins appear by chance, so the p-values of each forecaster are corrected across names with the Benjamini-Hochberg procedure, which keeps the expected share of false wins among the wins (the false discovery rate) at {VersusImpliedFdr.DefaultLevel:0%}. A win is a negative statistic (the forecaster's loss is lower) with an adjusted p-value of at most {VersusImpliedFdr.DefaultLevel:0.00}.")))
            .Append("</p>\n");
        if (table.Count == 0)
        {
            html.Append("<p class=\"note\">No name had both an implied file and a usable test, so nothing could be compared with implied.</p>\n");
            html.Append("</section>\n");
            return;
        }

        html.Append("<table>\n<thead><tr><th>Forecaster</th><th>Names tested</th><th>Beats implied, uncorrected p ≤ 0.05</th><th>Beats implied, BH-adjusted (FDR 5%)</th><th>Share of names, BH-adjusted</th><th>Implied better, BH-adjusted</th></tr></thead>\n<tbody>\n");
        foreach (var r in table)
        {
            html.Append("<tr><td>").Append(HtmlReport.E(r.Spec)).Append("</td><td>").Append(I($"{r.NamesTested}")).Append("</td><td>").Append(I($"{r.BeatsUncorrected}"))
                .Append("</td><td>").Append(I($"{r.BeatsAfterFdr}")).Append("</td><td>").Append(r.ShareBeatsAfterFdr is double s ? I($"{s:0.0%}") : "—")
                .Append("</td><td>").Append(I($"{r.LosesAfterFdr}")).Append("</td></tr>\n");
        }

        html.Append("</tbody>\n</table>\n</section>\n");
    }

    private static void AssetsSection(StringBuilder html, IReadOnlyList<BatchAssetRow> rows, string reportFileName)
    {
        html.Append("<section id=\"assets\">\n<h2>Names</h2>\n<table>\n<thead><tr><th>Name</th><th>Status</th><th>Dates scored</th><th>Best on QLIKE</th><th>DM vs implied</th><th>p-value</th><th>Mean implied − realized (vol pts)</th><th class=\"text\">Model confidence set</th><th class=\"text\">Lookbacks chosen (stability)</th></tr></thead>\n<tbody>\n");
        foreach (var r in rows)
        {
            var href = "assets/" + Uri.EscapeDataString(r.Name) + "/" + Uri.EscapeDataString(reportFileName);
            html.Append(r.Succeeded ? "<tr>" : "<tr class=\"failed\">").Append("<td>");
            if (r.Succeeded)
            {
                html.Append("<a href=\"").Append(HtmlReport.E(href)).Append("\">").Append(HtmlReport.E(r.Name)).Append("</a>");
            }
            else
            {
                html.Append(HtmlReport.E(r.Name));
            }

            html.Append("</td>");
            if (!r.Succeeded)
            {
                html.Append("<td class=\"text\" colspan=\"8\">failed: ").Append(HtmlReport.E(r.Error ?? "unknown error")).Append("</td></tr>\n");
                continue;
            }

            html.Append("<td class=\"text\">").Append(r.HasImplied ? "done" : "done, no implied").Append("</td>")
                .Append("<td>").Append(r.Dates is int n ? I($"{n}") : "—").Append("</td>")
                .Append("<td class=\"text\">").Append(HtmlReport.E(r.BestQlike ?? "—")).Append("</td>")
                .Append("<td>").Append(Num(r.BestDmStatistic, "0.00")).Append("</td>")
                .Append("<td>").Append(r.BestDmPValue is double p && double.IsFinite(p) ? HtmlReport.E(PValueText.Value(p)) : "—").Append("</td>")
                .Append("<td>").Append(Num(r.MeanPremium * 100.0, "0.00")).Append("</td>")
                .Append("<td class=\"text\">").Append(HtmlReport.E(string.Join(", ", r.McsMembers))).Append("</td>")
                .Append("<td class=\"text\">").Append(HtmlReport.E(string.Join("; ", r.Lookbacks.Select(BatchSummaryCsv.Lookback)))).Append("</td></tr>\n");
        }

        html.Append("</tbody>\n</table>\n<p class=\"note\">Best on QLIKE: the forecaster (implied excluded) with the lowest mean QLIKE on its own scored dates. DM: d = L(forecaster) − L(implied), negative favours the forecaster; the p-value here is for that one name, uncorrected.</p>\n</section>\n");
    }

    private static void Figure(StringBuilder html, ChartImage chart) =>
        html.Append("<figure>\n<img src=\"data:image/png;base64,").Append(Convert.ToBase64String(chart.Png.Span))
            .Append("\" width=\"1200\" height=\"").Append(PngHeight(chart.Png.Span).ToString(CultureInfo.InvariantCulture)).Append("\" alt=\"").Append(HtmlReport.E(chart.Description)).Append("\">\n<figcaption><strong>")
            .Append(HtmlReport.E(chart.Title)).Append("</strong>").Append(HtmlReport.E(chart.Description)).Append("</figcaption>\n</figure>\n");

    /// <summary>A PNG's height from its header (bytes 20–23 of the IHDR chunk, big-endian): a chart may be taller than 600 pixels.</summary>
    private static int PngHeight(ReadOnlySpan<byte> png) => System.Buffers.Binary.BinaryPrimitives.ReadInt32BigEndian(png.Slice(20, 4));

    /// <summary>The page's title: "Volatility forecast backtest across N names".</summary>
    /// <param name="names">How many names the batch holds.</param>
    /// <returns>The title.</returns>
    public static string Title(int names) => "Volatility forecast backtest across " + Names(names);

    private static string Outcome(int names, int done, int failed) => (names, done, failed) switch
    {
        (0, _, _) => "The prices folder held no name to backtest.",
        (_, _, 0) => names == 1 ? "The one name was backtested." : I($"All {names} names were backtested."),
        (_, 0, _) => I($"No name could be backtested: {(failed == 1 ? "it" : I($"all {failed}"))} failed (the error is in the table below and in summary.csv)."),
        _ => I($"{Names(done)} backtested, {failed} failed (the {(failed == 1 ? "error is" : "errors are")} in the table below and in summary.csv)."),
    };

    private static string Names(int count) => count == 1 ? "1 name" : I($"{count} names");

    private static void Li(StringBuilder html, string text) => html.Append("<li>").Append(HtmlReport.E(text)).Append("</li>\n");

    private static string Num(double? value, string format) => value is double v && double.IsFinite(v) ? v.ToString(format, CultureInfo.InvariantCulture) : "—";

    private static string I(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
