using VolCast.Reports.Html;
using VolCast.Reports.Tests.Support;

namespace VolCast.Reports.Tests;

/// <summary>Writes the sample report where a person can look at it (bin/.../look/), and checks it was written.</summary>
public sealed class LookTests
{
    [Fact]
    public void Write_SampleReport_LeavesFilesForAPersonToLook()
    {
        var folder = Path.Combine(AppContext.BaseDirectory, "look");
        var sample = SampleReport.Create();

        var written = ReportFiles.Write(SampleReport.Model(sample.Charts()), folder, overwrite: true);

        Assert.Equal(8, written.Count);
        Assert.All(written, p => Assert.True(new FileInfo(p).Length > 1000, p));
    }
}
