using VolCast.Cli.Batch;
using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Batch;

public sealed class BatchShardTests
{
    [Theory]
    // Test vectors of 64-bit FNV-1a from the FNV authors' test suite (Fowler, Noll and Vo, "FNV hash" test vectors), from memory;
    // the same three values come out of a separate Python one-liner of the published algorithm.
    [InlineData("", 0xcbf29ce484222325UL)]
    [InlineData("a", 0xaf63dc4c8601ec8cUL)]
    [InlineData("foobar", 0x85944171f73967e8UL)]
    public void Hash_IsFnv1a64OfTheUtf8Bytes(string name, ulong expected) => Assert.Equal(expected, BatchShard.Hash(name));

    [Fact]
    public void Owns_EveryNameBelongsToExactlyOneShard()
    {
        var names = Enumerable.Range(0, 500).Select(i => "NAME" + i).Append("BRK-B").Append("a.b_c");
        foreach (var count in new[] { 1, 2, 3, 7 })
        {
            foreach (var name in names)
            {
                Assert.Equal(1, Enumerable.Range(0, count).Count(k => new BatchShard(k, count).Owns(name)));
            }
        }
    }

    [Fact]
    public void Owns_SpreadsNamesRoughlyEvenly()
    {
        // 3000 names over 4 shards: a fair split puts 750 on each, with a standard deviation of about 24 (binomial, common practice, no source).
        var counts = new int[4];
        for (var i = 0; i < 3000; i++)
        {
            counts[(int)(BatchShard.Hash("T" + i) % 4)]++;
        }

        Assert.All(counts, c => Assert.InRange(c, 650, 850));
    }

    [Theory]
    [InlineData("3/3", "shard 3 does not exist among 3 shards")]
    [InlineData("-1/4", "not two whole numbers")]
    [InlineData("1/0", "at least one shard")]
    [InlineData("x", "not two whole numbers")]
    [InlineData("1/2/3", "not two whole numbers")]
    public void Shard_BadForm_IsBadUsageNamingTheValidForm(string value, string why)
    {
        var result = CliRunner.Run("batch", "--prices-dir", "nowhere", "--out", Path.Combine(Path.GetTempPath(), "volcast-unused"), "--shard=" + value);

        Assert.Equal(2, result.ExitCode);
        Assert.Contains(why, result.Stderr, StringComparison.Ordinal);
        Assert.Contains("--shard K/N", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void FromEnvironment_KubernetesIndexWithShards()
    {
        var shard = BatchShard.FromEnvironment(Env(("JOB_COMPLETION_INDEX", "2")), shards: 4);

        Assert.Equal(new BatchShard(2, 4), shard);
    }

    [Fact]
    public void FromEnvironment_SlurmArrayStartingAtOne_CountsFromZero()
    {
        // sbatch --array=1-4 sets MIN=1, MAX=4, COUNT=4 (Slurm's job array documentation); task 1 is shard 0.
        var env = Env(("SLURM_ARRAY_TASK_ID", "1"), ("SLURM_ARRAY_TASK_COUNT", "4"), ("SLURM_ARRAY_TASK_MIN", "1"), ("SLURM_ARRAY_TASK_MAX", "4"));

        Assert.Equal(new BatchShard(0, 4), BatchShard.FromEnvironment(env, shards: null));
    }

    [Theory]
    [InlineData(null, "neither JOB_COMPLETION_INDEX", "SLURM_ARRAY_TASK_ID")]
    [InlineData("JOB_COMPLETION_INDEX=1", "--shards N", "JOB_COMPLETION_INDEX")]
    [InlineData("JOB_COMPLETION_INDEX=x", "JOB_COMPLETION_INDEX=x", "whole number")]
    [InlineData("JOB_COMPLETION_INDEX=0;SLURM_ARRAY_TASK_ID=0", "both JOB_COMPLETION_INDEX", "SLURM_ARRAY_TASK_ID")]
    [InlineData("SLURM_ARRAY_TASK_ID=3", "SLURM_ARRAY_TASK_COUNT is not", "SLURM_ARRAY_TASK_ID=3")]
    [InlineData("SLURM_ARRAY_TASK_ID=0;SLURM_ARRAY_TASK_COUNT=3;SLURM_ARRAY_TASK_MIN=0;SLURM_ARRAY_TASK_MAX=4", "SLURM_ARRAY_TASK_MAX=4", "do not agree")]
    [InlineData("SLURM_ARRAY_TASK_ID=5;SLURM_ARRAY_TASK_COUNT=3", "SLURM_ARRAY_TASK_ID=5", "outside")]
    [InlineData("SLURM_ARRAY_TASK_COUNT=3", "SLURM_ARRAY_TASK_COUNT=3 is set", "SLURM_ARRAY_TASK_ID is not")]
    [InlineData("JOB_COMPLETION_INDEX=", "JOB_COMPLETION_INDEX is set but empty", "--shard K/N")]
    public void FromEnvironment_MissingOrInconsistent_NamesTheVariables(string? variables, string first, string second)
    {
        var pairs = (variables ?? string.Empty).Split(';', StringSplitOptions.RemoveEmptyEntries).Select(p => (p.Split('=')[0], p.Split('=')[1])).ToArray();

        var ex = Assert.Throws<UsageException>(() => BatchShard.FromEnvironment(Env(pairs), shards: null));

        Assert.Contains(first, ex.Message, StringComparison.Ordinal);
        Assert.Contains(second, ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void FromEnvironment_KubernetesIndexNotBelowShards_IsRefused()
    {
        var ex = Assert.Throws<UsageException>(() => BatchShard.FromEnvironment(Env(("JOB_COMPLETION_INDEX", "4")), shards: 4));

        Assert.Contains("JOB_COMPLETION_INDEX=4 is not below --shards 4", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void FromEnvironment_SlurmCountDisagreeingWithShards_IsRefused()
    {
        var env = Env(("SLURM_ARRAY_TASK_ID", "0"), ("SLURM_ARRAY_TASK_COUNT", "3"));

        var ex = Assert.Throws<UsageException>(() => BatchShard.FromEnvironment(env, shards: 4));

        Assert.Contains("SLURM_ARRAY_TASK_COUNT=3", ex.Message, StringComparison.Ordinal);
    }

    private static Func<string, string?> Env(params (string Name, string Value)[] pairs)
    {
        var map = pairs.ToDictionary(p => p.Name, p => p.Value, StringComparer.Ordinal);
        return name => map.GetValueOrDefault(name);
    }
}
