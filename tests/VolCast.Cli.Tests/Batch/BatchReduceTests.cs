using System.Text;
using VolCast.Cli.Batch;
using VolCast.Cli.Tests.Support;
using VolCast.Core.Demo;
using VolCast.IO.Csv;

namespace VolCast.Cli.Tests.Batch;

/// <summary>The reduce's refusals and its partial summary. Invented demo data (3 years per name).</summary>
public sealed class BatchReduceTests : IDisposable
{
    private readonly TempFolder _temp = new("reduce");
    private readonly string _prices;
    private readonly string _config;

    public BatchReduceTests()
    {
        _prices = Directory.CreateDirectory(_temp.Combine("prices")).FullName;
        _config = _temp.Write("config.json", "{\"mcs\": {\"replications\": 200}}\n");
        // Of two shards, "gamma" is on shard 0 and "alpha" on shard 1 (FNV-1a of the name modulo 2).
        WriteAsset("alpha", 51);
        WriteAsset("gamma", 52);
    }

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void Reduce_NameMissing_ExitsThreeNamingIt_AllowMissingWritesPartialSummary_StaleTemporaryNeverCounted()
    {
        var output = _temp.Combine("out");
        // What a killed run of alpha's shard left: a hidden staging folder that even holds a record.
        var stale = Directory.CreateDirectory(Path.Combine(output, "assets", ".alpha.1.0123456789abcdef0123456789abcdef.tmp")).FullName;
        File.WriteAllText(Path.Combine(stale, "batch.json"), "{}");

        var shard0 = CliRunner.Run([.. Args(output), "--shard", "0/2"]);
        Assert.True(shard0.ExitCode == 0, shard0.Stderr);
        Assert.True(Directory.Exists(stale), "a shard must leave another shard's temporaries alone");

        var reduce = CliRunner.Run([.. Args(output), "--reduce"]);

        Assert.Equal(3, reduce.ExitCode);
        Assert.Contains("1 of 2 names have no finished results", reduce.Stderr, StringComparison.Ordinal);
        Assert.Contains("alpha (no results folder assets/alpha)", reduce.Stderr, StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(output, "summary.csv")));
        Assert.True(Directory.Exists(stale), "a reduce reads the names' folders and leaves everything in them alone");

        // The intended names come from the shards' plan: alpha is missing even though no folder of it exists.
        var partial = CliRunner.Run("batch", "--reduce", "--out", output, "--allow-missing");

        Assert.Equal(0, partial.ExitCode);
        Assert.Contains("summary is partial", partial.Stderr, StringComparison.Ordinal);
        var lines = File.ReadAllLines(Path.Combine(output, "summary.csv"));
        Assert.StartsWith("alpha,failed,", lines[1], StringComparison.Ordinal);
        Assert.Contains("not finished", lines[1], StringComparison.Ordinal);
        Assert.StartsWith("gamma,done,", lines[2], StringComparison.Ordinal);
        Assert.Contains("Partial summary", File.ReadAllText(Path.Combine(output, "summary.html")), StringComparison.Ordinal);

        var shard1 = CliRunner.Run([.. Args(output), "--shard", "1/2"]);
        Assert.True(shard1.ExitCode == 0, shard1.Stderr);
        Assert.False(Directory.Exists(stale), "the shard that owns alpha removes what a killed run of alpha left");
        var complete = CliRunner.Run([.. Args(output), "--reduce"]);
        Assert.Equal(0, complete.ExitCode);

        // The reduce's last line names what it wrote: every file it names is there, and every file at the top of the
        // output folder is named (the plan aside, which the shards wrote).
        var wrote = complete.Stdout.Split('\n', StringSplitOptions.RemoveEmptyEntries)[^1];
        var named = wrote[(wrote.IndexOf('(', StringComparison.Ordinal) + 1)..wrote.LastIndexOf(')')].Split(", ");
        var present = Directory.GetFiles(output).Select(Path.GetFileName).Where(f => f != "batch-plan.json").Order(StringComparer.Ordinal);
        Assert.Equal(present, named.Order(StringComparer.Ordinal));
    }

    [Fact]
    public void Reduce_StoppedBeforeTheSummary_WritesNone_ThenAReduceWritesThemAll()
    {
        var output = _temp.Combine("out");
        var shard = CliRunner.Run([.. Args(output), "--shard", "0/1"]);
        Assert.True(shard.ExitCode == 0, shard.Stderr);
        var before = Directory.GetFiles(output).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToArray();

        // Ctrl-C before the first summary file: nothing is written, so no summary file can be left beside another
        // reduce's.
        using var stopped = new CancellationTokenSource();
        stopped.Cancel();
        Assert.Throws<OperationCanceledException>(() => BatchReducer.Reduce(output, null, allowMissing: false, stopped.Token));
        Assert.Equal(before, Directory.GetFiles(output).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToArray());
        Assert.Empty(Directory.GetFiles(output, ".*", SearchOption.TopDirectoryOnly));

        var reduce = CliRunner.Run("batch", "--reduce", "--out", output);
        Assert.True(reduce.ExitCode == 0, reduce.Stderr);
        Assert.True(File.Exists(Path.Combine(output, "summary.csv")) && File.Exists(Path.Combine(output, "summary.html")));
    }

    [Fact]
    public void Reduce_OtherConfiguration_ExitsThreeNamingTheNames()
    {
        var output = _temp.Combine("out");
        Assert.Equal(0, CliRunner.Run([.. Args(output), "--shard", "0/2"]).ExitCode);
        var other = _temp.Write("other.json", "{\"mcs\": {\"replications\": 200, \"seed\": 7}}\n");

        var reduce = CliRunner.Run("batch", "--prices-dir", _prices, "--config", other, "--out", output, "--reduce");

        Assert.Equal(3, reduce.ExitCode);
        Assert.Contains("another configuration or tool version", reduce.Stderr, StringComparison.Ordinal);
        // What differs is named: the seed, from the plan the shard wrote (the shard's own default against 7 given here).
        Assert.Contains("gamma (mcsSeed: ", reduce.Stderr, StringComparison.Ordinal);
        Assert.Contains(" in the shards' plan, 7 here)", reduce.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Reduce_FolderThatIsNotABatchOutput_ExitsThree()
    {
        var output = Directory.CreateDirectory(_temp.Combine("elsewhere")).FullName;
        File.WriteAllText(Path.Combine(output, "notes.txt"), "not a batch\n");

        var reduce = CliRunner.Run([.. Args(output), "--reduce"]);
        var alone = CliRunner.Run("batch", "--reduce", "--out", output);
        var nowhere = CliRunner.Run("batch", "--reduce", "--out", _temp.Combine("nowhere"));

        Assert.Equal(3, reduce.ExitCode);
        Assert.Contains("not a batch output", reduce.Stderr, StringComparison.Ordinal);
        Assert.Equal(3, alone.ExitCode);
        Assert.Contains("not a batch output", alone.Stderr, StringComparison.Ordinal);
        Assert.Equal(3, nowhere.ExitCode);
        Assert.Contains("not a batch output", nowhere.Stderr, StringComparison.Ordinal);
        Assert.Equal(["notes.txt"], Directory.GetFileSystemEntries(output).Select(Path.GetFileName));
    }

    [Fact]
    public void Reduce_WithShard_IsBadUsage()
    {
        var reduce = CliRunner.Run([.. Args(_temp.Combine("out")), "--reduce", "--shard", "0/2"]);

        Assert.Equal(2, reduce.ExitCode);
        Assert.Contains("--reduce cannot be combined with --shard", reduce.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void ReduceAlone_WithAComputingOption_IsBadUsageNamingIt()
    {
        var reduce = CliRunner.Run("batch", "--reduce", "--out", _temp.Combine("out"), "--config", _config);

        Assert.Equal(2, reduce.ExitCode);
        Assert.Contains("so --config would not be checked", reduce.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Batch_WithoutPricesDirOrReduce_IsBadUsage()
    {
        var batch = CliRunner.Run("batch", "--out", _temp.Combine("out"));

        Assert.Equal(2, batch.ExitCode);
        Assert.Contains("--prices-dir is required", batch.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void ReduceAlone_ShardsRanWithDifferentConfigurations_ExitsThreeNamingThem()
    {
        var output = _temp.Combine("out");
        var other = _temp.Write("other.json", "{\"mcs\": {\"replications\": 200, \"seed\": 7}}\n");
        Assert.Equal(0, CliRunner.Run([.. Args(output), "--shard", "0/2"]).ExitCode);
        // The second shard was given another configuration by mistake; its plan, written last, is the one in the folder.
        Assert.Equal(0, CliRunner.Run("batch", "--prices-dir", _prices, "--config", other, "--out", output, "--jobs", "1", "--shard", "1/2").ExitCode);

        var reduce = CliRunner.Run("batch", "--reduce", "--out", output);

        Assert.Equal(3, reduce.ExitCode);
        Assert.Contains("1 names were computed with another configuration or tool version than the shards' plan", reduce.Stderr, StringComparison.Ordinal);
        Assert.Contains(": gamma (", reduce.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("alpha (", reduce.Stderr, StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(output, "summary.csv")));
    }

    [Fact]
    public void ReduceAlone_NameAddedLaterOrInputsNotReachable_WarnsAndGivesTheSameSummary()
    {
        var output = _temp.Combine("out");
        Assert.Equal(0, CliRunner.Run([.. Args(output), "--shard", "0/2"]).ExitCode);
        Assert.Equal(0, CliRunner.Run([.. Args(output), "--shard", "1/2"]).ExitCode);
        Assert.Equal(0, CliRunner.Run("batch", "--reduce", "--out", output).ExitCode);
        var summary = File.ReadAllBytes(Path.Combine(output, "summary.csv"));
        var page = File.ReadAllBytes(Path.Combine(output, "summary.html"));
        File.Delete(Path.Combine(output, "summary.csv"));

        // A price file added after the shards ran is named, and left out: the summary is of the names the shards set out to compute.
        File.Copy(Path.Combine(_prices, "gamma.csv"), Path.Combine(_prices, "zeta.csv"));
        var later = CliRunner.Run("batch", "--reduce", "--out", output);
        Assert.True(later.ExitCode == 0, later.Stderr);
        Assert.Contains("1 price files were added", later.Stderr, StringComparison.Ordinal);
        Assert.Contains("not in this summary: zeta;", later.Stderr, StringComparison.Ordinal);
        Assert.Equal(summary, File.ReadAllBytes(Path.Combine(output, "summary.csv")));
        File.Delete(Path.Combine(output, "summary.csv"));

        // A reduce on a machine that does not mount the inputs.
        Directory.Move(_prices, _prices + "-elsewhere");
        var reduce = CliRunner.Run("batch", "--reduce", "--out", output);

        Assert.True(reduce.ExitCode == 0, reduce.Stderr);
        Assert.Contains("are not reachable from here", reduce.Stderr, StringComparison.Ordinal);
        Assert.Equal(summary, File.ReadAllBytes(Path.Combine(output, "summary.csv")));
        Assert.Equal(page, File.ReadAllBytes(Path.Combine(output, "summary.html")));
    }

    [Fact]
    public void ReduceAlone_FolderWithResultsButNoPlan_ExitsThree()
    {
        var output = _temp.Combine("out");
        Directory.CreateDirectory(Path.Combine(output, "assets", "gamma"));

        var reduce = CliRunner.Run("batch", "--reduce", "--out", output);

        Assert.Equal(3, reduce.ExitCode);
        Assert.Contains("no batch-plan.json", reduce.Stderr, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("../../escaped", "are not ones a batch writes")]
    [InlineData("gamma", null)]
    public void ReduceAlone_PlanEditedByHand_ExitsThreeWithoutWritingOutsideTheFolder(string name, string? why)
    {
        var output = Directory.CreateDirectory(_temp.Combine("deep", "out")).FullName;
        // The configuration's SHA-256 matches its text ("tool=hand\n") unless the second case says otherwise.
        var text = "tool=hand\n";
        var sha = why is null ? new string('0', 64) : Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(Encoding.UTF8.GetBytes(text)));
        File.WriteAllText(Path.Combine(output, "batch-plan.json"), $$"""
            {"version": "hand", "prices_folder": "{{_prices.Replace("\\", "/", StringComparison.Ordinal)}}", "implied_folder": null, "config": null, "config_sha256": null,
             "reports": "none", "horizon": "21 trading days", "configuration_sha256": "{{sha}}", "configuration": {"tool": "hand"},
             "names": [{"name": "{{name}}", "prices": "gamma.csv", "implied": null, "problem": null}]}
            """);

        var reduce = CliRunner.Run("batch", "--reduce", "--out", output);

        Assert.Equal(3, reduce.ExitCode);
        Assert.Contains("the batch plan cannot be used", reduce.Stderr, StringComparison.Ordinal);
        Assert.Contains(why ?? "does not match its configuration_sha256", reduce.Stderr, StringComparison.Ordinal);
        Assert.Equal(["batch-plan.json"], Directory.GetFileSystemEntries(output).Select(Path.GetFileName));
        Assert.False(Directory.Exists(_temp.Combine("escaped")));
    }

    [Fact]
    public void Batch_ReportsSummary_WritesDataFilesWithoutPagesAndLinksTheFolders()
    {
        var output = _temp.Combine("out");

        var batch = CliRunner.Run([.. Args(output), "--reports", "summary"]);

        Assert.True(batch.ExitCode == 0, batch.Stderr);
        var gamma = Path.Combine(output, "assets", "gamma");
        Assert.True(File.Exists(Path.Combine(gamma, "metrics.csv")));
        Assert.Empty(Directory.GetFiles(gamma, "*.png"));
        Assert.False(File.Exists(Path.Combine(gamma, "report.html")));
        var html = File.ReadAllText(Path.Combine(output, "summary.html"));
        Assert.Contains("href=\"assets/gamma/\"", html, StringComparison.Ordinal);

        // A later full batch draws the pages it lacks instead of keeping the folders as they are.
        var full = CliRunner.Run([.. Args(output)]);
        Assert.True(full.ExitCode == 0, full.Stderr);
        Assert.True(File.Exists(Path.Combine(gamma, "report.html")));
        Assert.Contains("href=\"assets/gamma/report.html\"", File.ReadAllText(Path.Combine(output, "summary.html")), StringComparison.Ordinal);

        // Names without an implied file write no trades files; their complete folders are kept all the same.
        var again = CliRunner.Run([.. Args(output)]);
        Assert.Contains("2 kept from an earlier run", again.Stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void Batch_ReportsNone_WritesNoPage()
    {
        var output = _temp.Combine("out");

        var batch = CliRunner.Run([.. Args(output), "--reports", "none", "--shard", "0/2"]);
        Assert.True(batch.ExitCode == 0, batch.Stderr);
        var reduce = CliRunner.Run([.. Args(output), "--reports", "none", "--reduce", "--allow-missing"]);

        Assert.Equal(0, reduce.ExitCode);
        Assert.True(File.Exists(Path.Combine(output, "summary.csv")));
        Assert.False(File.Exists(Path.Combine(output, "summary.html")));
        Assert.False(File.Exists(Path.Combine(output, "assets", "gamma", "report.html")));
    }

    private string[] Args(string output) => ["batch", "--prices-dir", _prices, "--config", _config, "--out", output, "--jobs", "1"];

    private void WriteAsset(string name, int seed)
    {
        var scenario = new DemoScenarioGenerator(seed, years: 3).Generate();
        using var writer = new StreamWriter(Path.Combine(_prices, name + ".csv"), false, new UTF8Encoding(false));
        HistoryCsv.WritePrices(writer, scenario.Index);
    }
}
