using System.Globalization;
using System.Net;
using System.Text;
using VolCast.Core.Scoring;
using VolCast.Reports.Model;

namespace VolCast.Reports.Html;

/// <summary>
/// Renders a <see cref="ReportModel"/> as one self-contained HTML page: inline CSS, charts as PNG data URIs, no
/// scripts, and a Content-Security-Policy that forbids loading anything from elsewhere.
/// </summary>
/// <remarks>
/// Sections, in order: now (today's reading), verdict, "Would the rule have paid?" (the rule as delta-hedged straddles, or why it was not
/// run), answers (common-date ranking, which lookback, by year, regime and events), metrics, charts, "Do the odds hold?" (probability calibration and range coverage),
/// data quality, run details, the terms used (each named test or loss, linked from its first use), cautions. Every string from the model is
/// HTML-escaped; numbers are formatted with the invariant culture, so the same model gives the same bytes.
/// </remarks>
internal static class HtmlReport
{
    /// <summary>The Content-Security-Policy the page declares: images only from data URIs, inline styles only, nothing else.</summary>
    public const string ContentSecurityPolicy = "default-src 'none'; img-src data:; style-src 'unsafe-inline'; base-uri 'none'; form-action 'none'";

    /// <summary>The section ids, in the order they appear.</summary>
    public static IReadOnlyList<string> SectionIds { get; } = ["now", "verdict", "pnl", "answers", "metrics", "charts", "odds", "data-quality", "run", "terms", "cautions"];

    private const string Css = """
        body{font-family:"DejaVu Sans",Arial,Helvetica,sans-serif;color:#111;background:#fff;max-width:1240px;margin:0 auto;padding:16px 24px;line-height:1.45}
        h1{font-size:1.7em;margin:.2em 0 .4em}
        h2{font-size:1.3em;border-bottom:2px solid #0072B2;padding-bottom:4px;margin-top:1.6em}
        h3{font-size:1.05em;margin:1.2em 0 .4em}
        .verdict{border:2px solid #0072B2;background:#eef6fb;padding:12px 18px;border-radius:4px}
        .verdict .headline{font-size:1.25em;font-weight:bold;margin:0 0 .4em}
        table{border-collapse:collapse;margin:.4em 0 .8em;font-size:.95em;display:block;max-width:100%;overflow-x:auto}
        th,td{border:1px solid #bbb;padding:4px 10px;text-align:right;vertical-align:top}
        th:first-child,td:first-child{text-align:left;white-space:nowrap}
        table.text th,table.text td{text-align:left}
        thead th{background:#f0f0f0}
        th .unit{display:block;font-weight:normal;font-size:.85em;color:#444}
        .note{font-size:.9em;color:#333}
        figure{margin:1em 0 1.6em;page-break-inside:avoid;break-inside:avoid}
        figure img{width:100%;max-width:1200px;height:auto;border:1px solid #ddd}
        figcaption{font-size:.92em;color:#333}
        figcaption strong{display:block;color:#111;font-size:1.05em}
        code{font-family:"DejaVu Sans Mono",monospace;font-size:.9em;word-break:break-all}
        .cautions{border-left:4px solid #D55E00;padding-left:14px}
        a{color:#0072B2}
        dl.terms dt{font-weight:bold;margin-top:.5em}
        dl.terms dd{margin:0 0 0 1.5em}
        @media print{body{max-width:none;padding:0}h2{page-break-after:avoid;break-after:avoid}table,.verdict{page-break-inside:avoid;break-inside:avoid}}
        """;

    /// <summary>Renders the report.</summary>
    /// <param name="model">The report's content.</param>
    /// <returns>The complete HTML document.</returns>
    public static string Render(ReportModel model)
    {
        ArgumentNullException.ThrowIfNull(model);
        var html = new StringBuilder(256 * 1024);
        html.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
        html.Append("<meta http-equiv=\"Content-Security-Policy\" content=\"").Append(ContentSecurityPolicy).Append("\">\n");
        html.Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n");
        html.Append("<title>").Append(E(model.Title)).Append("</title>\n<style>\n").Append(Css).Append("\n</style>\n</head>\n<body>\n");
        html.Append("<h1>").Append(E(model.Title)).Append("</h1>\n");

        Now(html, model.Now);
        Verdict(html, model.Verdict);
        Pnl(html, model.Pnl);
        Answers(html, model.Answers, model.YearChart);
        Metrics(html, model.Tables);
        Charts(html, model.Charts);
        Odds(html, model.Odds);
        Quality(html, model.DataQuality);
        Run(html, model.Run);

        // The first use of each named test or loss links to its entry in the terms section, just before the cautions.
        var page = Glossary.LinkFirstUses(html.ToString(), out var used);
        html.Clear().Append(page);
        Glossary.Section(html, used);
        Cautions(html, model.Cautions);
        html.Append("</body>\n</html>\n");
        return html.ToString();
    }

    /// <summary>Escapes text for HTML content and attribute values.</summary>
    /// <param name="text">Any user or model text.</param>
    /// <returns>The text with &amp;, &lt;, &gt;, quotes and apostrophes escaped.</returns>
    public static string E(string text) => WebUtility.HtmlEncode(text);

    /// <summary>Formats a cell: the value with its format in the invariant culture, a dash when null, stars for significance.</summary>
    internal static string Cell(MetricCell cell)
    {
        var text = cell.Value is not double v ? "—"
            : cell.Format == MetricCell.PValue ? PValueText.Value(v)
            : v.ToString(cell.Format, CultureInfo.InvariantCulture);
        var stars = cell.Significance switch
        {
            Significance.OnePercent => "***",
            Significance.FivePercent => "**",
            Significance.TenPercent => "*",
            _ => string.Empty,
        };
        return stars.Length == 0 ? E(text) : E(text) + "<sup>" + stars + "</sup>";
    }

    private static void Verdict(StringBuilder html, Verdict verdict)
    {
        html.Append("<section id=\"verdict\">\n<h2>Verdict</h2>\n<div class=\"verdict\">\n<p class=\"headline\">")
            .Append(E(verdict.Headline)).Append("</p>\n<ul>\n");
        foreach (var point in verdict.Points)
        {
            html.Append("<li>").Append(E(point)).Append("</li>\n");
        }

        html.Append("</ul>\n</div>\n</section>\n");
    }

    private static void Now(StringBuilder html, NowSection? now)
    {
        html.Append("<section id=\"now\">\n<h2>Now: today's reading</h2>\n");
        if (now is null)
        {
            html.Append("<p class=\"note\">Today's reading was not built for this report.</p>\n</section>\n");
            return;
        }

        html.Append("<p class=\"cautions\">").Append(E(now.Caution)).Append("</p>\n<ul>\n");
        foreach (var point in now.Points)
        {
            html.Append("<li>").Append(E(point)).Append("</li>\n");
        }

        html.Append("</ul>\n");
        foreach (var table in now.Tables)
        {
            TextTable(html, table);
        }

        html.Append("</section>\n");
    }

    private static void Pnl(StringBuilder html, PnlSection? pnl)
    {
        html.Append("<section id=\"pnl\">\n<h2>Would the rule have paid?</h2>\n");
        if (pnl is null || pnl.Absence is not null)
        {
            html.Append("<p class=\"note\">").Append(E(pnl?.Absence ?? "The rule was not backtested as option trades for this report.")).Append("</p>\n</section>\n");
            return;
        }

        html.Append("<div class=\"cautions\">\n");
        foreach (var caution in pnl.Cautions)
        {
            html.Append("<p>").Append(E(caution)).Append("</p>\n");
        }

        html.Append("</div>\n<ul>\n");
        foreach (var point in pnl.Points)
        {
            html.Append("<li>").Append(E(point)).Append("</li>\n");
        }

        html.Append("</ul>\n");
        foreach (var table in pnl.Tables)
        {
            TextTable(html, table);
        }

        foreach (var chart in pnl.Charts)
        {
            Figure(html, chart);
        }

        html.Append("<h3>Settings and conventions of the trades</h3>\n<table class=\"text\">\n<tbody>\n");
        foreach (var setting in pnl.Settings)
        {
            Row(html, setting.Name, setting.Value);
        }

        html.Append("</tbody>\n</table>\n</section>\n");
    }

    private static void Answers(StringBuilder html, IReadOnlyList<TextTable> tables, ChartImage? yearChart)
    {
        html.Append("<section id=\"answers\">\n<h2>Which forecaster, which lookback, and when</h2>\n");
        if (tables.Count == 0)
        {
            html.Append("<p>No common dates to rank on.</p>\n");
        }

        foreach (var table in tables)
        {
            TextTable(html, table);
            if (yearChart is not null && table.Title == ReportAnswers.YearTitle)
            {
                Figure(html, yearChart);
            }
        }

        html.Append("</section>\n");
    }

    private static void TextTable(StringBuilder html, TextTable table)
    {
        html.Append("<h3>").Append(E(table.Title)).Append("</h3>\n<table>\n<thead><tr>");
        foreach (var header in table.Headers)
        {
            html.Append("<th>").Append(E(header)).Append("</th>");
        }

        html.Append("</tr></thead>\n<tbody>\n");
        foreach (var row in table.Rows)
        {
            html.Append("<tr>");
            foreach (var cell in row)
            {
                html.Append("<td>").Append(E(cell)).Append("</td>");
            }

            html.Append("</tr>\n");
        }

        html.Append("</tbody>\n</table>\n");
        if (table.Note is not null)
        {
            html.Append("<p class=\"note\">").Append(E(table.Note)).Append("</p>\n");
        }
    }

    private static void Metrics(StringBuilder html, IReadOnlyList<MetricTable> tables)
    {
        html.Append("<section id=\"metrics\">\n<h2>Metrics</h2>\n");
        foreach (var table in tables)
        {
            Table(html, table);
        }

        html.Append("<p class=\"note\">Stars mark only better or worse than implied or than the baseline (Diebold-Mariano, Newey-West errors): * p &lt; 0.10, ** p &lt; 0.05, *** p &lt; 0.01. Every other test shows its p-value.</p>\n</section>\n");
    }

    private static void Odds(StringBuilder html, OddsSection? odds)
    {
        html.Append("<section id=\"odds\">\n<h2>Do the odds hold?</h2>\n");
        if (odds is null)
        {
            html.Append("<p class=\"note\">The probability-calibration and range-coverage checks were not run for this report.</p>\n</section>\n");
            return;
        }

        html.Append("<p>A volatility number implies odds: the chance that the price ends above a strike, and a range the price should stay in about two times out of three. This section checks, on this history, how often those odds held for implied volatility and the forecasters.</p>\n");
        if (odds.Verdicts.Count > 0)
        {
            html.Append("<ul>\n");
            foreach (var verdict in odds.Verdicts)
            {
                html.Append("<li>").Append(E(verdict)).Append("</li>\n");
            }

            html.Append("</ul>\n");
        }

        if (odds.Reliability is { } chart)
        {
            Figure(html, chart);
        }

        Table(html, odds.Coverage);
        foreach (var note in odds.Notes)
        {
            html.Append("<p class=\"note\">").Append(E(note)).Append("</p>\n");
        }

        html.Append("</section>\n");
    }

    private static void Table(StringBuilder html, MetricTable table)
    {
        html.Append("<h3>").Append(E(table.Title)).Append("</h3>\n<table>\n<thead><tr><th>&nbsp;</th>");
        foreach (var column in table.Columns)
        {
            html.Append("<th>").Append(E(column.Header)).Append("<span class=\"unit\">").Append(E(column.Unit)).Append("</span></th>");
        }

        html.Append("</tr></thead>\n<tbody>\n");
        foreach (var row in table.Rows)
        {
            html.Append("<tr><td>").Append(E(row.Label)).Append("</td>");
            foreach (var cell in row.Cells)
            {
                html.Append("<td>").Append(Cell(cell)).Append("</td>");
            }

            html.Append("</tr>\n");
        }

        html.Append("</tbody>\n</table>\n");
        if (table.Note is not null)
        {
            html.Append("<p class=\"note\">").Append(E(table.Note)).Append("</p>\n");
        }
    }

    private static void Charts(StringBuilder html, IReadOnlyList<ChartImage> charts)
    {
        html.Append("<section id=\"charts\">\n<h2>Charts</h2>\n");
        foreach (var chart in charts)
        {
            Figure(html, chart);
        }

        html.Append("</section>\n");
    }

    private static void Figure(StringBuilder html, ChartImage chart) =>
        html.Append("<figure>\n<img src=\"data:image/png;base64,").Append(Convert.ToBase64String(chart.Png.Span))
            .Append("\" width=\"1200\" height=\"600\" alt=\"").Append(E(chart.Description)).Append("\">\n<figcaption><strong>")
            .Append(E(chart.Title)).Append("</strong>").Append(E(chart.Description)).Append("</figcaption>\n</figure>\n");

    private static void Quality(StringBuilder html, DataQuality quality)
    {
        html.Append("<section id=\"data-quality\">\n<h2>Data quality</h2>\n<table class=\"text\">\n<tbody>\n");
        Row(html, "Price rows read", quality.RowsRead.ToString(CultureInfo.InvariantCulture));
        Row(html, "Dates scored", quality.ScoredDates.ToString(CultureInfo.InvariantCulture));
        Row(html, "Implied coverage of scored dates", quality.ImpliedCoverage is double c
            ? c.ToString("0.0%", CultureInfo.InvariantCulture) + (quality.ScoredDatesWithImplied is int withImplied ? string.Create(CultureInfo.InvariantCulture, $" ({withImplied} of the {quality.ScoredDates} scored dates have an implied quote)") : string.Empty)
            : "no implied file");
        Row(html, "Suspect rows", quality.Suspect switch { "drop" => "dropped (--suspect drop)", "stop" => "refused (--suspect stop)", _ => "kept; any found are among the warnings below (suspect: warn)" });
        if (quality.RowsLeftOut > 0)
        {
            Row(html, "Rows left out", quality.RowsLeftOut.ToString(CultureInfo.InvariantCulture) + " (listed in rejected-rows.csv)");
        }

        Row(html, "Warnings", quality.Warnings.Count == 0 ? "none" : quality.Warnings.Count.ToString(CultureInfo.InvariantCulture) + " (listed below)");
        Row(html, "Routine notes", quality.RoutineNotes.Count.ToString(CultureInfo.InvariantCulture) + " (listed below)");
        html.Append("</tbody>\n</table>\n");
        if (quality.Notes.Count > 0)
        {
            html.Append("<p>How the inputs were read:</p>\n<ul>\n");
            foreach (var note in quality.Notes)
            {
                html.Append("<li>").Append(E(note)).Append("</li>\n");
            }

            html.Append("</ul>\n");
        }

        if (quality.Warnings.Count > 0)
        {
            html.Append("<p>Warnings:</p>\n<ul>\n");
            foreach (var warning in quality.Warnings)
            {
                html.Append("<li>").Append(E(warning)).Append("</li>\n");
            }

            html.Append("</ul>\n");
        }

        if (quality.RoutineNotes.Count > 0)
        {
            html.Append("<p>Routine notes:</p>\n<ul>\n");
            foreach (var note in quality.RoutineNotes)
            {
                html.Append("<li>").Append(E(note)).Append("</li>\n");
            }

            html.Append("</ul>\n");
        }

        html.Append("</section>\n");
    }

    private static void Run(StringBuilder html, RunInfo run)
    {
        html.Append("<section id=\"run\">\n<h2>Settings and inputs</h2>\n<table class=\"text\">\n<tbody>\n");
        Row(html, "Tool version", "volcast " + run.ToolVersion);
        Row(html, "Run started (UTC)", run.StartedAt.ToUniversalTime().ToString("yyyy-MM-dd HH:mm:ss", CultureInfo.InvariantCulture));
        Row(html, "Run time", run.Elapsed.TotalSeconds.ToString("0.00", CultureInfo.InvariantCulture) + " s");
        foreach (var setting in run.Settings)
        {
            Row(html, setting.Name, setting.Value);
        }

        html.Append("</tbody>\n</table>\n<h3>Input files</h3>\n<table class=\"text\">\n<thead><tr><th>Role</th><th>File</th><th>SHA-256</th></tr></thead>\n<tbody>\n");
        foreach (var input in run.Inputs)
        {
            html.Append("<tr><td>").Append(E(input.Role)).Append("</td><td><code>").Append(E(input.Path))
                .Append("</code></td><td><code>").Append(E(input.Sha256)).Append("</code></td></tr>\n");
        }

        html.Append("</tbody>\n</table>\n</section>\n");
    }

    private static void Cautions(StringBuilder html, IReadOnlyList<string> cautions)
    {
        html.Append("<section id=\"cautions\">\n<h2>Cautions</h2>\n<div class=\"cautions\">\n");
        foreach (var caution in cautions)
        {
            html.Append("<p>").Append(E(caution)).Append("</p>\n");
        }

        html.Append("</div>\n</section>\n");
    }

    private static void Row(StringBuilder html, string name, string value) =>
        html.Append("<tr><th scope=\"row\">").Append(E(name)).Append("</th><td>").Append(E(value)).Append("</td></tr>\n");
}
