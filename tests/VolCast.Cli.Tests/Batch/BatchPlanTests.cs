using VolCast.Cli.Batch;

namespace VolCast.Cli.Tests.Batch;

public sealed class BatchPlanTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("volcast-plan-").FullName;

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Fact]
    public void Write_RemovesTheTemporaryPlanOfAKilledShard_AndLeavesOneBeingWritten()
    {
        // A shard killed while writing its plan leaves .batch-plan.json.PID.GUID.tmp; the next run removes it once it is
        // old enough that no shard can still be writing it, and never touches other files.
        var stale = Touch(".batch-plan.json.4242.0123456789abcdef0123456789abcdef.tmp", TimeSpan.FromHours(1));
        var fresh = Touch(".batch-plan.json.4343.fedcba9876543210fedcba9876543210.tmp", TimeSpan.FromSeconds(5));
        var otherName = Touch(".ALPHA.4242.0123.tmp", TimeSpan.FromHours(1));
        var plan = new BatchPlan("0.0.0", "prices", null, null, null, BatchReports.Summary, "21 trading days", "horizon=21\n", []);

        plan.Write(_folder);

        Assert.False(File.Exists(stale));
        Assert.True(File.Exists(fresh));
        Assert.True(File.Exists(otherName));
        Assert.True(File.Exists(Path.Combine(_folder, BatchPlan.FileName)));
    }

    private string Touch(string name, TimeSpan age)
    {
        var path = Path.Combine(_folder, name);
        File.WriteAllText(path, "{");
        File.SetLastWriteTimeUtc(path, DateTime.UtcNow - age);
        return path;
    }
}
