using VolCast.Reports.Html;
using VolCast.Reports.Tests.Support;

namespace VolCast.Reports.Tests.Html;

public sealed class ReportFilesTests : IDisposable
{
    private readonly TempFolder _temp = new("report");

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void Write_NewFolder_WritesEveryChartAndTheReport()
    {
        var charts = SampleReport.Create(days: 1000, seed: 1).Charts();
        var target = _temp.Combine("out");

        var written = ReportFiles.Write(SampleReport.Model(charts), target, overwrite: false);

        Assert.Equal(charts.Select(c => Path.Combine(target, c.FileName)).Append(Path.Combine(target, "report.html")), written);
        foreach (var chart in charts)
        {
            Assert.Equal(chart.Png.ToArray(), File.ReadAllBytes(Path.Combine(target, chart.FileName)));
        }

        Assert.Empty(Directory.GetFiles(target, "*.tmp"));
    }

    [Fact]
    public void Write_FullSampleReport_WritesSevenChartsAndTheReportNoneNearlyEmpty()
    {
        // The full 20-year sample: every chart has data, so none of the files is a stub.
        var written = ReportFiles.Write(SampleReport.Model(SampleReport.Create().Charts()), _temp.Combine("full"), overwrite: true);

        Assert.Equal(8, written.Count);
        Assert.All(written, p => Assert.True(new FileInfo(p).Length > 1000, p));
    }

    [Fact]
    public void Write_ExistingReportWithoutOverwrite_ThrowsAndChangesNothing()
    {
        var charts = SampleReport.Create(days: 1000, seed: 1).Charts();
        File.WriteAllText(_temp.Combine("report.html"), "keep");

        var ex = Assert.Throws<IOException>(() => ReportFiles.Write(SampleReport.Model(charts), _temp.Path, overwrite: false));

        Assert.Contains("--force", ex.Message, StringComparison.Ordinal);
        Assert.Equal("keep", File.ReadAllText(_temp.Combine("report.html")));
        Assert.Empty(Directory.GetFiles(_temp.Path, "*.png"));
    }

    [Fact]
    public void Write_ExistingReportWithOverwrite_Replaces()
    {
        var charts = SampleReport.Create(days: 1000, seed: 1).Charts();
        File.WriteAllText(_temp.Combine("report.html"), "old");

        ReportFiles.Write(SampleReport.Model(charts), _temp.Path, overwrite: true);

        Assert.StartsWith("<!DOCTYPE html>", File.ReadAllText(_temp.Combine("report.html")), StringComparison.Ordinal);
    }
}
