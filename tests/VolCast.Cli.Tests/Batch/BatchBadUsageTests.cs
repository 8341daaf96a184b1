using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Batch;

/// <summary>What a careless or hostile user types for shards and the reduce: refused with exit 2 before anything is read or written.</summary>
public sealed class BatchBadUsageTests : IDisposable
{
    private readonly TempFolder _temp = new("batch-usage");

    public void Dispose() => _temp.Dispose();

    [Theory]
    [InlineData("3/3", "shard 3 does not exist among 3 shards")]
    [InlineData("-1/4", "not two whole numbers")]
    [InlineData("1/0", "at least one shard")]
    [InlineData("x", "not two whole numbers")]
    [InlineData("", "not two whole numbers")]
    [InlineData("1/100001", "too many shards")]
    public void Shard_BadForm_ExitsTwoWithTheValidForm_WritesNothing(string value, string why)
    {
        var prices = Directory.CreateDirectory(_temp.Combine("prices")).FullName;
        File.WriteAllText(Path.Combine(prices, "one.csv"), "date,close\n2024-01-02,1\n");
        var output = _temp.Combine("out");

        var batch = CliRunner.Run("batch", "--prices-dir", prices, "--out", output, "--shard", value);

        Assert.Equal(2, batch.ExitCode);
        Assert.Contains(why, batch.Stderr, StringComparison.Ordinal);
        Assert.Contains("the valid form is --shard K/N", batch.Stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(output), "a refused command must not create the output folder");
    }

    [Theory]
    [InlineData("--reduce --force", "--force has nothing to recompute")]
    [InlineData("--reduce --shards 2", "--reduce cannot be combined with --shard or --shards")]
    [InlineData("--reduce --shard auto", "--reduce cannot be combined with --shard or --shards")]
    [InlineData("--allow-missing", "--allow-missing applies only to --reduce")]
    [InlineData("--reduce --horizon 10", "so --horizon would not be checked")]
    [InlineData("--reduce --jobs 0", "--jobs")]
    public void Reduce_OptionsThatCannotApply_ExitTwoNamingThem(string options, string expected)
    {
        var output = _temp.Combine("out");

        var result = CliRunner.Run(["batch", "--out", output, .. options.Split(' ')]);

        Assert.Equal(2, result.ExitCode);
        Assert.Contains(expected, result.Stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(output));
    }
}
