using System.Globalization;
using Microsoft.Playwright;
using VolCast.IO.Results;
using VolCast.Reports.Batch;
using VolCast.Reports.Html;
using VolCast.Reports.Model;

namespace VolCast.Reports.Tests.Html;

/// <summary>
/// Opens the committed demo report and a batch page in Debian's Chromium, driven by Microsoft.Playwright with the
/// system browser as its executable (no browser is downloaded), and checks what a reader meets: no console error or
/// warning, no failed or blocked request, every image decoded, no text that runs out of the first column of a table,
/// no page wider than the window. A full-page screenshot of each is saved beside the test assembly (browser/*.png)
/// for a person to look at. Without Chromium the test fails under CI (CI=true), saying why, and is skipped elsewhere.
/// </summary>
public sealed class PageInBrowserTests : IDisposable
{
    private const string Chromium = "/usr/bin/chromium";

    private readonly TempFolder _temp = new("page-in-browser");

    public void Dispose() => _temp.Dispose();

    [SkippableFact]
    public async Task CommittedDemoReport_InChromium_NoConsoleErrorNoFailedRequestEveryImageDecodedAndFirstColumnsFit()
    {
        RequireBrowser();
        var report = Path.Combine(RepositoryRoot.Path, "reports", "demo", "report.html");
        Assert.True(File.Exists(report), $"{report} is missing; run volcast demo from the repository's root and commit reports/demo.");

        var seen = await OpenAsync(report, "demo-report.png");

        AssertClean(seen);
        // Eight forecast and odds charts, the loss-by-year chart and the four charts of "Would the rule have paid?".
        Assert.Equal(13, seen.Images);
        foreach (var id in HtmlReport.SectionIds)
        {
            Assert.Contains(id, seen.SectionIds);
        }
    }

    [SkippableFact]
    public async Task BatchPage_InChromium_NoConsoleErrorNoFailedRequestEveryImageDecodedAndFirstColumnsFit()
    {
        RequireBrowser();

        // Twenty names with the demo universe's kind of names, one without implied and one failed.
        var rows = new List<BatchAssetRow>();
        string[] names =
        [
            "aspen-hollow", "basalt-cove", "cedar-falls", "dune-harbor", "elm-crossing", "fern-valley", "granite-peak",
            "heron-marsh", "iris-point", "juniper-ridge", "kestrel-bay", "larch-meadow", "maple-terrace", "nettle-creek",
            "oak-terrace", "pine-landing", "quartz-hill", "rowan-fields", "sorrel-bend", "tamarack-glen",
        ];
        for (var i = 0; i < names.Length; i++)
        {
            var dm = (i % 7) - 3.5;
            rows.Add(new BatchAssetRow
            {
                Name = names[i],
                Succeeded = true,
                HasImplied = i != 5,
                Dates = 2047,
                BestQlike = i % 2 == 0 ? "adaptive:rogers-satchell" : "gjr-garch",
                BestQlikeValue = -3.4,
                BestDmStatistic = dm,
                BestDmPValue = 0.04 * (i + 1),
                McsMembers = ["implied", "yang-zhang:21", "adaptive:garman-klass"],
                Lookbacks = [new BatchLookback("rogers-satchell", "rogers-satchell:252", 0.41, 26)],
                MeanPremium = i == 5 ? null : ((i * 37) % 11 - 2) / 100.0,
                VersusImplied = i == 5 ? [] : [new BatchForecasterTest("gjr-garch", dm, 0.04 * (i + 1)), new BatchForecasterTest("adaptive:rogers-satchell", -dm, 0.5)],
            });
        }

        rows.Add(BatchRows.Failed("umber-flats", hasImplied: true, "umber-flats.csv, line 3, column 1: '2021-13-01' is not a date"));
        var page = _temp.Write("summary.html", BatchSummaryHtml.Render(rows, [new Setting("Horizon", "21 trading days")]));

        var seen = await OpenAsync(page, "batch-page.png");

        AssertClean(seen);
        Assert.Equal(2, seen.Images);
        foreach (var id in BatchSummaryHtml.SectionIds)
        {
            Assert.Contains(id, seen.SectionIds);
        }
    }

    [SkippableFact]
    public async Task BrokenPage_InChromium_EachCheckSeesItsFault()
    {
        RequireBrowser();

        // One fault per check: a console error and warning, a request for a file that is not there (which also leaves
        // its image undecoded), a long unbroken name in a fixed-width first column, and a block wider than the window.
        var page = _temp.Write("broken.html", """
            <!DOCTYPE html><html><head><meta charset="utf-8"><title>broken</title></head><body>
            <script>console.error("drawn wrong"); console.warn("careful");</script>
            <img src="missing.png" alt="missing chart">
            <table style="table-layout:fixed;width:200px"><tr><td style="width:60px;white-space:nowrap">adaptive:rogers-satchell</td><td>x</td></tr></table>
            <div style="width:3000px">wide</div>
            </body></html>
            """);

        var seen = await OpenAsync(page, "broken-page.png");

        Assert.Contains(seen.Console, m => m.Contains("drawn wrong", StringComparison.Ordinal));
        Assert.Contains(seen.Console, m => m.StartsWith("warning: careful", StringComparison.Ordinal));
        Assert.Contains(seen.Failed, f => f.Contains("missing.png", StringComparison.Ordinal));
        Assert.Equal(["missing chart"], seen.Undecoded);
        Assert.Contains(seen.Overflowing, o => o.StartsWith("adaptive:rogers-satchell", StringComparison.Ordinal));
        Assert.True(seen.PageWidth > seen.WindowWidth);
    }

    private static void AssertClean(Seen seen)
    {
        Assert.True(seen.Console.Count == 0, "console messages: " + string.Join(" | ", seen.Console));
        Assert.True(seen.Failed.Count == 0, "failed or blocked requests: " + string.Join(" | ", seen.Failed));
        Assert.True(seen.Undecoded.Count == 0, "images not decoded: " + string.Join(" | ", seen.Undecoded));
        Assert.True(seen.Overflowing.Count == 0, "text wider than its first-column cell: " + string.Join(" | ", seen.Overflowing));
        Assert.True(seen.PageWidth <= seen.WindowWidth, string.Create(CultureInfo.InvariantCulture, $"the page is {seen.PageWidth} px wide in a {seen.WindowWidth} px window"));
        Assert.True(seen.Images > 0);
    }

    /// <summary>Returns when Chromium is there; fails under CI and skips elsewhere when it is missing.</summary>
    private static void RequireBrowser()
    {
        if (File.Exists(Chromium))
        {
            return;
        }

        Assert.False(
            string.Equals(Environment.GetEnvironmentVariable("CI"), "true", StringComparison.OrdinalIgnoreCase),
            $"{Chromium} is missing; .ci/run installs Debian's chromium package, so under CI the browser check must run.");
        Skip.If(true, $"{Chromium} is missing; install Debian's chromium (apt-get install chromium) to run the browser check.");
    }

    /// <summary>Loads a page in Chromium and collects what went wrong, the images, the sections, the widths, and a screenshot.</summary>
    private static async Task<Seen> OpenAsync(string file, string screenshotName)
    {
        using var playwright = await Playwright.CreateAsync();
        await using var browser = await playwright.Chromium.LaunchAsync(new BrowserTypeLaunchOptions
        {
            ExecutablePath = Chromium,
            Headless = true,
            Args = ["--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update"],
            Timeout = 90_000,
        });
        var page = await browser.NewPageAsync(new BrowserNewPageOptions { ViewportSize = new ViewportSize { Width = 1280, Height = 900 } });
        page.SetDefaultTimeout(90_000);
        var console = new List<string>();
        var failed = new List<string>();
        page.Console += (_, m) =>
        {
            if (m.Type is "error" or "warning")
            {
                console.Add($"{m.Type}: {m.Text}");
            }
        };
        page.PageError += (_, e) => console.Add("page error: " + e);
        page.RequestFailed += (_, r) => failed.Add($"{r.Url[..Math.Min(80, r.Url.Length)]}: {r.Failure}");
        page.Response += (_, r) =>
        {
            if (r.Status >= 400)
            {
                failed.Add(string.Create(CultureInfo.InvariantCulture, $"{r.Url}: HTTP {r.Status}"));
            }
        };

        await page.GotoAsync(new Uri(file).AbsoluteUri, new PageGotoOptions { WaitUntil = WaitUntilState.Load });

        var images = await page.EvaluateAsync<string[]>(
            "() => [...document.images].map(i => (i.complete && i.naturalWidth > 0 && i.naturalHeight > 0) ? '' : (i.alt || i.src.slice(0, 60)))");

        // The text of each first-column cell, measured as laid out (a Range's box), must fit inside the cell's content box.
        var overflowing = await page.EvaluateAsync<string[]>(@"() => {
            const out = [];
            for (const table of document.querySelectorAll('table')) {
                for (const row of table.rows) {
                    const cell = row.cells[0];
                    if (!cell) continue;
                    const style = getComputedStyle(cell);
                    const inner = cell.clientWidth - parseFloat(style.paddingLeft) - parseFloat(style.paddingRight);
                    const range = document.createRange();
                    range.selectNodeContents(cell);
                    const text = range.getBoundingClientRect().width;
                    if (cell.scrollWidth > cell.clientWidth + 1 || text > inner + 1) out.push(cell.textContent.trim() + ' (' + Math.round(text) + ' px in ' + Math.round(inner) + ' px)');
                }
            }
            return out;
        }");
        var sections = await page.EvaluateAsync<string[]>("() => [...document.querySelectorAll('section[id]')].map(s => s.id)");
        var pageWidth = await page.EvaluateAsync<int>("() => document.documentElement.scrollWidth");
        var windowWidth = await page.EvaluateAsync<int>("() => window.innerWidth");

        var folder = Path.Combine(AppContext.BaseDirectory, "browser");
        Directory.CreateDirectory(folder);
        await page.ScreenshotAsync(new PageScreenshotOptions { Path = Path.Combine(folder, screenshotName), FullPage = true });

        return new Seen(console, failed, [.. images.Where(i => i.Length > 0)], images.Length, [.. overflowing], [.. sections], pageWidth, windowWidth);
    }

    private sealed record Seen(
        List<string> Console,
        List<string> Failed,
        List<string> Undecoded,
        int Images,
        List<string> Overflowing,
        List<string> SectionIds,
        int PageWidth,
        int WindowWidth);
}
