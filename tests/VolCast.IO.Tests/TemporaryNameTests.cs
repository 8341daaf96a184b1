namespace VolCast.IO.Tests;

public sealed class TemporaryNameTests
{
    [Theory]
    [InlineData("metrics.csv", "tmp")]
    [InlineData("out.v2", "old")]
    public void For_ReadsBackAsTheTargetThisProcessAndTheKind(string target, string kind)
    {
        var name = TemporaryName.For(target, kind);

        Assert.StartsWith(".", name, StringComparison.Ordinal);
        Assert.True(TemporaryName.TryParse(name, out var read, out var pid, out var readKind));
        Assert.Equal(target, read);
        Assert.Equal(Environment.ProcessId, pid);
        Assert.Equal(kind, readKind);
    }

    [Theory]
    [InlineData("metrics.csv")]
    [InlineData(".metrics.csv.12.0123.tmp")]
    [InlineData(".metrics.csv.x.0123456789abcdef0123456789abcdef.tmp")]
    [InlineData(".metrics.csv.12.0123456789abcdef0123456789abcdef.bak")]
    public void TryParse_AnyOtherName_IsNotATemporary(string name) =>
        Assert.False(TemporaryName.TryParse(name, out _, out _, out _));
}
