using System.Diagnostics;
using System.Text.RegularExpressions;
using SkiaSharp;
using VolCast.Reports.Html;
using VolCast.Reports.Tests.Support;

namespace VolCast.Reports.Tests.Html;

/// <summary>
/// Opens a written report in headless Chromium (Debian's package, which .ci/run installs) and checks what a reader
/// would get: every section, decodable images, nothing loaded from elsewhere, and a page that is not blank.
/// Without the browser the test fails under CI (CI=true), saying why, and otherwise reports itself skipped.
/// </summary>
public sealed partial class BrowserTests : IDisposable
{
    private const string Chromium = "/usr/bin/chromium";

    private readonly TempFolder _temp = new("browser");

    public void Dispose() => _temp.Dispose();

    [GeneratedRegex("<img [^>]*src=\"([^\"]*)\"")]
    private static partial Regex ImagePattern();

    [GeneratedRegex("(src|href)=\"https?:", RegexOptions.IgnoreCase)]
    private static partial Regex RemotePattern();

    [SkippableFact]
    public void Report_InHeadlessChromium_ShowsEverySectionAndEveryImage()
    {
        RequireBrowser();

        var report = ReportFiles.Write(SampleReport.Model(SampleReport.Create().Charts(), "<script>alert(1)</script>.csv"), _temp.Combine("out"), overwrite: false)[^1];
        var dom = CheckInChromium(report, "browser-screenshot.png", images: 7);

        // The hostile file name arrived as text, not as a script element.
        Assert.Contains("&lt;script&gt;alert(1)&lt;/script&gt;.csv", dom, StringComparison.Ordinal);
    }

    [SkippableFact]
    public void ReportWithRulePnl_InHeadlessChromium_ShowsTheSectionAndItsCharts()
    {
        RequireBrowser();

        var folder = _temp.Combine("pnl");
        var written = ReportWriter.Write(folder, Pnl.PnlSectionTests.RunWith(Pnl.PnlSectionTests.BuildReport(seed: 3, days: 400)));
        var report = Path.Combine(folder, ReportFiles.ReportFileName);

        // Every PNG written is on the page: the forecast charts, the reliability diagram and the section's three charts.
        var dom = CheckInChromium(report, "pnl-screenshot.png", images: written.Count(f => f.EndsWith(".png", StringComparison.Ordinal)));
        Assert.Contains(VolCast.Reports.Charts.PnlCharts.YearsFileName, written);

        Assert.Contains("<h2>Would the rule have paid?</h2>", dom, StringComparison.Ordinal);
        Assert.Contains("switching from the current rule", dom, StringComparison.OrdinalIgnoreCase);
    }

    [SkippableFact]
    public void CommittedDemoReport_InHeadlessChromium_ShowsEverySectionAndEveryImage()
    {
        RequireBrowser();

        // The report the README shows: reports/demo/report.html as committed, written by volcast demo.
        var report = Path.Combine(RepositoryRoot.Path, "reports", "demo", "report.html");
        Assert.True(File.Exists(report), $"{report} is missing; run volcast demo from the repository's root and commit reports/demo.");
        // Eight forecast and odds charts, the loss-by-year chart and the four charts of "Would the rule have paid?"; every section.
        var dom = CheckInChromium(report, "demo-screenshot.png", images: 13, HtmlReport.SectionIds);

        Assert.Contains("candidate garch against baseline yang-zhang:21", dom, StringComparison.Ordinal);

        // The demo runs the odds checks: the section has its heading, the reliability diagram and implied's verdict.
        Assert.Contains("<h2>Do the odds hold?</h2>", dom, StringComparison.Ordinal);
        Assert.Contains("Move bands from implied were too wide", dom, StringComparison.Ordinal);
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

    /// <summary>Opens the report in headless Chromium, checks sections, images, remote loads and the screenshot, and returns the DOM.</summary>
    private string CheckInChromium(string report, string screenshotName, int images, IReadOnlyList<string>? sections = null)
    {
        var url = new Uri(report).AbsoluteUri;

        var dom = RunChromium("--dump-dom", url);
        var shot = _temp.Combine("shot.png");
        RunChromium($"--screenshot={shot}", "--window-size=1200,3000", url);

        Assert.Contains("ranks first on QLIKE", Glossary.WithoutLinks(dom), StringComparison.Ordinal);
        foreach (var id in sections ?? HtmlReport.SectionIds)
        {
            Assert.Contains($"<section id=\"{id}\">", dom, StringComparison.Ordinal);
        }

        Assert.DoesNotContain("<script", dom, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotMatch(RemotePattern(), dom);

        var sources = ImagePattern().Matches(dom).Select(m => m.Groups[1].Value).ToArray();
        Assert.Equal(images, sources.Length);
        foreach (var source in sources)
        {
            Assert.StartsWith("data:image/png;base64,", source, StringComparison.Ordinal);
            using var image = SKBitmap.Decode(Convert.FromBase64String(source["data:image/png;base64,".Length..]));
            Assert.NotNull(image);
            Assert.True(image.Width > 0 && image.Height > 0);
        }

        using var screenshot = SKBitmap.Decode(shot);
        Assert.NotNull(screenshot);
        Assert.Equal(1200, screenshot.Width);
        Assert.True(LumaVariance(screenshot) > 100, "the screenshot is blank or nearly so");
        File.Copy(shot, Path.Combine(AppContext.BaseDirectory, screenshotName), overwrite: true);
        return dom;
    }

    private static double LumaVariance(SKBitmap bitmap)
    {
        double sum = 0, sumSquares = 0;
        var count = 0;
        for (var y = 0; y < bitmap.Height; y += 4)
        {
            for (var x = 0; x < bitmap.Width; x += 4)
            {
                var c = bitmap.GetPixel(x, y);
                var luma = (0.299 * c.Red) + (0.587 * c.Green) + (0.114 * c.Blue);
                sum += luma;
                sumSquares += luma * luma;
                count++;
            }
        }

        var mean = sum / count;
        return (sumSquares / count) - (mean * mean);
    }

    private string RunChromium(params string[] args)
    {
        var profile = Directory.CreateTempSubdirectory("volcast-chromium-").FullName;
        try
        {
            var start = new ProcessStartInfo(Chromium)
            {
                RedirectStandardOutput = true,
                RedirectStandardError = true,
                UseShellExecute = false,
                WorkingDirectory = _temp.Path,
            };
            foreach (var flag in new[]
            {
                "--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update",
                "--disable-sync", "--no-first-run", "--hide-scrollbars", $"--user-data-dir={profile}",
            })
            {
                start.ArgumentList.Add(flag);
            }

            foreach (var arg in args)
            {
                start.ArgumentList.Add(arg);
            }

            using var process = Process.Start(start)!;
            var stdout = process.StandardOutput.ReadToEndAsync();
            var stderr = process.StandardError.ReadToEndAsync();
            if (!process.WaitForExit(TimeSpan.FromSeconds(90)))
            {
                process.Kill(entireProcessTree: true);
                throw new TimeoutException("chromium did not finish within 90 s.");
            }

            Assert.True(process.ExitCode == 0, $"chromium exited {process.ExitCode}: {stderr.Result}");
            return stdout.Result;
        }
        finally
        {
            Directory.Delete(profile, recursive: true);
        }
    }
}
