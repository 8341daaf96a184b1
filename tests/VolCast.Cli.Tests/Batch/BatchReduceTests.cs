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

        var partial = CliRunner.Run([.. Args(output), "--reduce", "--allow-missing"]);

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
        Assert.Equal(0, CliRunner.Run([.. Args(output), "--reduce"]).ExitCode);
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
        Assert.Contains("gamma (a different configuration", reduce.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Reduce_FolderThatIsNotABatchOutput_ExitsThree()
    {
        var output = Directory.CreateDirectory(_temp.Combine("elsewhere")).FullName;

        var reduce = CliRunner.Run([.. Args(output), "--reduce"]);

        Assert.Equal(3, reduce.ExitCode);
        Assert.Contains("not a batch output", reduce.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Reduce_WithShard_IsBadUsage()
    {
        var reduce = CliRunner.Run([.. Args(_temp.Combine("out")), "--reduce", "--shard", "0/2"]);

        Assert.Equal(2, reduce.ExitCode);
        Assert.Contains("--reduce and --shard cannot be combined", reduce.Stderr, StringComparison.Ordinal);
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
