using VolCast.Reports.Html;
using VolCast.Reports.Tests.Support;

namespace VolCast.Reports.Tests.Html;

public sealed class ReportFilesTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("volcast-report-").FullName;

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Fact]
    public void Write_NewFolder_WritesEveryChartAndTheReport()
    {
        var charts = SampleReport.Create(days: 1000, seed: 1).Charts();
        var target = Path.Combine(_folder, "out");

        var written = ReportFiles.Write(SampleReport.Model(charts), target, overwrite: false);

        Assert.Equal(charts.Select(c => Path.Combine(target, c.FileName)).Append(Path.Combine(target, "report.html")), written);
        foreach (var chart in charts)
        {
            Assert.Equal(chart.Png.ToArray(), File.ReadAllBytes(Path.Combine(target, chart.FileName)));
        }

        Assert.Empty(Directory.GetFiles(target, "*.tmp"));
    }

    [Fact]
    public void Write_ExistingReportWithoutOverwrite_ThrowsAndChangesNothing()
    {
        var charts = SampleReport.Create(days: 1000, seed: 1).Charts();
        File.WriteAllText(Path.Combine(_folder, "report.html"), "keep");

        var ex = Assert.Throws<IOException>(() => ReportFiles.Write(SampleReport.Model(charts), _folder, overwrite: false));

        Assert.Contains("--force", ex.Message, StringComparison.Ordinal);
        Assert.Equal("keep", File.ReadAllText(Path.Combine(_folder, "report.html")));
        Assert.Empty(Directory.GetFiles(_folder, "*.png"));
    }

    [Fact]
    public void Write_ExistingReportWithOverwrite_Replaces()
    {
        var charts = SampleReport.Create(days: 1000, seed: 1).Charts();
        File.WriteAllText(Path.Combine(_folder, "report.html"), "old");

        ReportFiles.Write(SampleReport.Model(charts), _folder, overwrite: true);

        Assert.StartsWith("<!DOCTYPE html>", File.ReadAllText(Path.Combine(_folder, "report.html")), StringComparison.Ordinal);
    }
}
