using System.Diagnostics;
using System.Text;
using VolCast.Cli.Batch;
using VolCast.Cli.Tests.Support;
using VolCast.Core.Demo;
using VolCast.IO.Csv;

namespace VolCast.Cli.Tests.Batch;

/// <summary>
/// Shards as separate processes writing into one folder, then the reduce, against the single-process batch on the same
/// inputs: the summary and every name's data files must be the same bytes. The data is invented (demo generator, 3 years).
/// </summary>
public sealed class ShardedBatchTests : IClassFixture<ShardedBatchTests.Universe>
{
    // The plan too: every shard and the single-process batch write the same one.
    private static readonly string[] SummaryFiles = ["summary.csv", "beats-implied.csv", "summary.html", "batch-plan.json"];
    private static readonly string[] AssetFiles = ["metrics.csv", "forecasts.csv", "metrics.json", "batch.json"];

    private readonly Universe _universe;

    public ShardedBatchTests(Universe universe) => _universe = universe;

    [Fact]
    public void ThreeShardsAtOnceThenReduce_SameBytesAsOneBatch()
    {
        var output = _universe.NewOutput();
        var shards = Enumerable.Range(0, 3).Select(k => CliRunner.StartProcess(_universe.Root, [.. _universe.Args(output), "--jobs", "1", "--shard", $"{k}/3"])).ToArray();
        var results = shards.Select(p => CliRunner.Finish(p, ["batch", "--shard"])).ToArray();

        // Shard 1 owns "broken", which fails: exit 3 there, as a single batch with that file exits 3.
        Assert.Equal([0, 3, 0], results.Select(r => r.ExitCode));
        Assert.Contains("shard 0/3:", results[0].Stdout, StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(output, "summary.csv")), "a shard must not write the summary");

        var reduce = CliRunner.Run([.. _universe.Args(output), "--reduce"]);

        Assert.True(reduce.ExitCode == 3, reduce.Stderr);
        Assert.Contains("error: broken:", reduce.Stderr, StringComparison.Ordinal);
        Assert.False(reduce.Stderr.Contains("no finished results", StringComparison.Ordinal), reduce.Stderr);
        Assert.True(File.Exists(Path.Combine(output, "summary.csv")), reduce.Stderr);
        _universe.AssertSameAsReference(output);
    }

    [Fact]
    public void ThreeShardsThenReduceGivenOnlyTheFolder_TwoAtOnce_SameBytesAsOneBatch()
    {
        var output = _universe.NewOutput();
        var shards = Enumerable.Range(0, 3).Select(k => CliRunner.StartProcess(_universe.Root, [.. _universe.Args(output), "--jobs", "1", "--shard", $"{k}/3"])).ToArray();
        Assert.Equal([0, 3, 0], shards.Select(p => CliRunner.Finish(p, ["batch", "--shard"]).ExitCode));

        // No --prices-dir, no --config: the names, the options and the tool version come from the plan the shards wrote.
        // Two reduces at once write the same files, each atomically, so neither can leave the other's half-written.
        string[] alone = ["batch", "--reduce", "--out", output];
        var reduces = new[] { CliRunner.StartProcess(_universe.Root, alone), CliRunner.StartProcess(_universe.Root, alone) };
        var results = reduces.Select(p => CliRunner.Finish(p, alone)).ToArray();

        foreach (var reduce in results)
        {
            Assert.True(reduce.ExitCode == 3, reduce.Stderr);
            Assert.Contains("error: broken:", reduce.Stderr, StringComparison.Ordinal);
            Assert.Contains("7 names reduced", reduce.Stdout, StringComparison.Ordinal);
        }

        _universe.AssertSameAsReference(output);
        Assert.Empty(Directory.GetFiles(output, ".*"));
    }

    [Fact]
    public void ShardKilledMidRun_RerunThenReduce_SameBytesAsOneBatch()
    {
        var output = _universe.NewOutput();
        var others = new[] { 0, 1 }.Select(k => CliRunner.StartProcess(_universe.Root, [.. _universe.Args(output), "--jobs", "1", "--shard", $"{k}/3"])).ToArray();
        // Shard 2 owns beta, gamma and zeta: killed once its first name is committed, while it works on the next.
        var victim = CliRunner.StartProcess(_universe.Root, [.. _universe.Args(output), "--jobs", "1", "--shard", "2/3"]);
        var assets = Path.Combine(output, "assets");
        var clock = Stopwatch.StartNew();
        while (!Universe.ShardTwo.Any(n => File.Exists(Path.Combine(assets, n, "batch.json"))) && !victim.HasExited && clock.Elapsed < TimeSpan.FromMinutes(2))
        {
            Thread.Sleep(20);
        }

        Assert.False(victim.HasExited, "the shard finished before it could be killed; the test needs a slower name or more names");
        victim.Kill(entireProcessTree: true);
        victim.WaitForExit();
        victim.Dispose();
        foreach (var p in others)
        {
            CliRunner.Finish(p, ["batch", "--shard"]);
        }

        var early = CliRunner.Run([.. _universe.Args(output), "--reduce"]);
        Assert.Equal(3, early.ExitCode);
        Assert.Contains("have no finished results", early.Stderr, StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(output, "summary.csv")));

        var rerun = CliRunner.RunProcess(_universe.Root, [.. _universe.Args(output), "--jobs", "1", "--shard", "2/3"]);
        Assert.True(rerun.ExitCode == 0, rerun.Stderr);
        Assert.Contains("1 kept from an earlier run", rerun.Stdout, StringComparison.Ordinal);
        Assert.Empty(Directory.GetDirectories(assets, ".*"));

        var reduce = CliRunner.Run([.. _universe.Args(output), "--reduce"]);
        Assert.True(reduce.ExitCode == 3, reduce.Stderr);
        _universe.AssertSameAsReference(output);
    }

    [Theory]
    [InlineData("JOB_COMPLETION_INDEX=1", "--shards=2", "shard 1/2:")]
    [InlineData("SLURM_ARRAY_TASK_ID=4;SLURM_ARRAY_TASK_COUNT=2;SLURM_ARRAY_TASK_MIN=3;SLURM_ARRAY_TASK_MAX=4", null, "shard 1/2:")]
    [InlineData("SLURM_ARRAY_TASK_ID=0;SLURM_ARRAY_TASK_COUNT=2", null, "shard 0/2:")]
    public void ShardAuto_TakesTheSchedulersVariablesFromTheEnvironment(string variables, string? shardsOption, string expected)
    {
        using var temp = new TempFolder("shard-auto");
        var prices = Directory.CreateDirectory(temp.Combine("prices")).FullName;
        // Broken files fail at once, which is all this test needs: which shard the process took.
        File.WriteAllText(Path.Combine(prices, "one.csv"), "date,close\nnot-a-date,1\n");
        File.WriteAllText(Path.Combine(prices, "two.csv"), "date,close\nnot-a-date,1\n");
        List<string> args = ["batch", "--prices-dir", prices, "--out", temp.Combine("out"), "--shard", "auto"];
        if (shardsOption is not null)
        {
            args.Add(shardsOption);
        }

        var result = CliRunner.RunProcess(temp.Path, Env(variables), [.. args]);

        Assert.Contains(expected, result.Stdout, StringComparison.Ordinal);
        Assert.NotEqual(2, result.ExitCode);
    }

    [Theory]
    [InlineData("JOB_COMPLETION_INDEX=3", "--shards=2", "JOB_COMPLETION_INDEX=3 is not below --shards 2")]
    [InlineData("SLURM_ARRAY_TASK_ID=1", null, "SLURM_ARRAY_TASK_COUNT is not")]
    [InlineData("", null, "neither JOB_COMPLETION_INDEX")]
    public void ShardAuto_MissingOrInconsistentVariables_ExitTwoNamingThem(string variables, string? shardsOption, string expected)
    {
        using var temp = new TempFolder("shard-auto");
        var prices = Directory.CreateDirectory(temp.Combine("prices")).FullName;
        List<string> args = ["batch", "--prices-dir", prices, "--out", temp.Combine("out"), "--shard", "auto"];
        if (shardsOption is not null)
        {
            args.Add(shardsOption);
        }

        var result = CliRunner.RunProcess(temp.Path, Env(variables), [.. args]);

        Assert.Equal(2, result.ExitCode);
        Assert.Contains(expected, result.Stderr, StringComparison.Ordinal);
    }

    private static Dictionary<string, string?> Env(string variables) =>
        variables.Split(';', StringSplitOptions.RemoveEmptyEntries).ToDictionary(p => p.Split('=')[0], p => (string?)p.Split('=')[1], StringComparer.Ordinal);

    /// <summary>Six names and one broken file, and the single-process batch over them, computed once for the class.</summary>
    public sealed class Universe : IDisposable
    {
        /// <summary>The names shard 2 of 3 owns (FNV-1a of the name modulo 3, worked out by hand for these names).</summary>
        public static readonly string[] ShardTwo = ["beta", "gamma", "zeta"];

        private readonly TempFolder _temp = new("sharded");
        private int _outputs;

        public Universe()
        {
            Prices = Directory.CreateDirectory(_temp.Combine("prices")).FullName;
            Implied = Directory.CreateDirectory(_temp.Combine("implied")).FullName;
            // Fewer bootstrap replications than the default keep the test quick; every process reads the same file.
            Config = _temp.Write("config.json", "{\"mcs\": {\"replications\": 200}}\n");
            foreach (var (name, seed, implied) in new[] { ("alpha", 41, true), ("beta", 42, true), ("gamma", 43, false), ("delta", 44, true), ("eps", 45, true), ("zeta", 46, true) })
            {
                WriteAsset(name, seed, implied);
            }

            File.WriteAllText(Path.Combine(Prices, "broken.csv"), "date,open,high,low,close\n2024-01-02,1,1,1,1\nnot-a-date,1,1,1,1\n");
            Reference = _temp.Combine("reference");
            var single = CliRunner.Run([.. Args(Reference), "--jobs", "2"]);
            if (single.ExitCode != 3)
            {
                throw new InvalidOperationException("the single-process batch did not run as expected: " + single.Stderr);
            }

            foreach (var name in ShardTwo)
            {
                if (!new BatchShard(2, 3).Owns(name))
                {
                    throw new InvalidOperationException(name + " is not on shard 2 of 3");
                }
            }
        }

        public string Root => _temp.Path;

        public string Prices { get; }

        public string Implied { get; }

        public string Config { get; }

        public string Reference { get; }

        public string NewOutput() => _temp.Combine("out" + Interlocked.Increment(ref _outputs));

        public string[] Args(string output) =>
            ["batch", "--prices-dir", Prices, "--implied-dir", Implied, "--iv-unit", "decimal", "--config", Config, "--out", output];

        public void AssertSameAsReference(string output)
        {
            foreach (var file in SummaryFiles)
            {
                Assert.True(
                    File.ReadAllBytes(Path.Combine(Reference, file)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(output, file))),
                    file + " differs from the single-process batch");
            }

            var names = Directory.GetDirectories(Path.Combine(Reference, "assets")).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToArray();
            Assert.Equal(6, names.Length);
            Assert.Equal(names, Directory.GetDirectories(Path.Combine(output, "assets")).Select(Path.GetFileName).Order(StringComparer.Ordinal));
            foreach (var name in names)
            {
                foreach (var file in AssetFiles)
                {
                    Assert.True(
                        File.ReadAllBytes(Path.Combine(Reference, "assets", name!, file)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(output, "assets", name!, file))),
                        $"{name}/{file} differs from the single-process batch");
                }
            }
        }

        public void Dispose() => _temp.Dispose();

        private void WriteAsset(string name, int seed, bool withImplied)
        {
            var scenario = new DemoScenarioGenerator(seed, years: 3).Generate();
            using (var writer = new StreamWriter(Path.Combine(Prices, name + ".csv"), false, new UTF8Encoding(false)))
            {
                HistoryCsv.WritePrices(writer, scenario.Index);
            }

            if (withImplied)
            {
                using var writer = new StreamWriter(Path.Combine(Implied, name + ".csv"), false, new UTF8Encoding(false));
                HistoryCsv.WriteSeries(writer, "iv", scenario.Implied.Dates, scenario.Implied.Volatility);
            }
        }
    }
}
