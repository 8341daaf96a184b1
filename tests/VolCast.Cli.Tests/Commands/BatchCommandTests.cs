using System.Globalization;
using System.Text;
using System.Text.Json;
using VolCast.Cli.Batch;
using VolCast.Cli.Tests.Support;
using VolCast.Core.Backtest;
using VolCast.Core.Demo;
using VolCast.IO;
using VolCast.IO.Config;
using VolCast.IO.Csv;

namespace VolCast.Cli.Tests.Commands;

public sealed class BatchCommandTests : IDisposable
{
    private static readonly string[] SameBytes = ["forecasts.csv", "metrics.csv", "metrics.json"];

    private readonly TempFolder _temp = new("batch");
    private readonly string _prices;
    private readonly string _implied;
    private readonly string _config;

    public BatchCommandTests()
    {
        _prices = _temp.Combine("prices");
        _implied = _temp.Combine("implied");
        Directory.CreateDirectory(_prices);
        Directory.CreateDirectory(_implied);
        // Fewer bootstrap replications than the default keep the tests quick; the batch passes the same file to every asset.
        _config = _temp.Combine("config.json");
        File.WriteAllText(_config, "{\"mcs\": {\"replications\": 200}}\n");
    }

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void Batch_SmallUniverse_EachAssetMatchesBacktestAloneByteForByte()
    {
        // Invented demo data (3 years per name), not reference data. "gamma" has no implied file.
        WriteAsset("alpha", 11, withImplied: true);
        WriteAsset("beta", 12, withImplied: true);
        WriteAsset("gamma", 13, withImplied: false);
        var output = _temp.Combine("batch");

        var batch = CliRunner.Run("batch", "--prices-dir", _prices, "--implied-dir", _implied, "--iv-unit", "decimal", "--config", _config, "--out", output, "--jobs", "2");

        Assert.True(batch.ExitCode == 0, batch.Stderr);
        foreach (var name in new[] { "alpha", "beta", "gamma" })
        {
            var alone = _temp.Combine("alone-" + name);
            List<string> args = ["backtest", "--prices", Path.Combine(_prices, name + ".csv"), "--iv-unit", "decimal", "--config", _config, "--out", alone];
            if (name != "gamma")
            {
                args.AddRange(["--implied", Path.Combine(_implied, name + ".csv")]);
            }

            var single = CliRunner.Run([.. args]);
            Assert.True(single.ExitCode == 0, single.Stderr);
            var inBatch = Path.Combine(output, "assets", name);
            foreach (var file in SameBytes)
            {
                Assert.True(File.ReadAllBytes(Path.Combine(alone, file)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(inBatch, file))), $"{name}/{file} differs from backtest alone");
            }

            // run.json agrees but for the times and the manifest, which in the batch also lists the batch's own record.
            Assert.Equal(WithoutTimes(Path.Combine(alone, "run.json")), WithoutTimes(Path.Combine(inBatch, "run.json")));
            Assert.Equal(Manifest(alone).Append("batch.json").Order(StringComparer.Ordinal), Manifest(inBatch));
        }

        var summary = File.ReadAllLines(Path.Combine(output, "summary.csv"));
        Assert.Equal(4, summary.Length);
        Assert.StartsWith("asset,status,implied,n,best_qlike", summary[0], StringComparison.Ordinal);
        Assert.StartsWith("alpha,done,yes,", summary[1], StringComparison.Ordinal);
        Assert.StartsWith("gamma,done,no,", summary[3], StringComparison.Ordinal);
        var lookbacks = File.ReadAllLines(Path.Combine(output, BatchLookbacksCsv.FileName));
        Assert.Equal("asset,family,most_chosen,share_of_dates,changes", lookbacks[0]);
        Assert.Contains(lookbacks, l => l.StartsWith("alpha,", StringComparison.Ordinal));
        var html = File.ReadAllText(Path.Combine(output, "summary.html"));
        Assert.Contains("Content-Security-Policy", html, StringComparison.Ordinal);
        Assert.Contains("Benjamini-Hochberg", html, StringComparison.Ordinal);
        Assert.Contains("href=\"assets/alpha/report.html\"", html, StringComparison.Ordinal);
        Assert.Contains("data:image/png;base64,", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("src=\"http", html, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void Run_CancelledPartWay_RerunKeepsFinishedAssetsAndCompletesTheRest()
    {
        foreach (var (name, seed) in new[] { ("a1", 21), ("a2", 22), ("a3", 23), ("a4", 24) })
        {
            WriteAsset(name, seed, withImplied: true);
        }

        var output = _temp.Combine("batch");
        var request = new BatchRequest(_prices, _implied, ImpliedUnit.Decimal, BacktestConfigFile.Read(_config), _config, output, Jobs: 1, Force: false);
        using var stop = new CancellationTokenSource();
        var first = BatchRunner.Run(request, new CancelAfterFirst(stop), stop.Token);

        Assert.True(first.Cancelled);
        var finished = Assert.Single(first.Rows);
        Assert.Equal("a1", finished.Name);
        Assert.False(File.Exists(Path.Combine(output, "summary.csv")));
        var kept = Path.Combine(output, "assets", "a1");
        var times = Directory.GetFiles(kept).ToDictionary(f => f, File.GetLastWriteTimeUtc);
        Assert.False(Directory.Exists(Path.Combine(output, "assets", "a3")));

        var second = BatchRunner.Run(request, null);

        Assert.False(second.Cancelled);
        Assert.Equal(1, second.Reused);
        Assert.Equal(3, second.Computed);
        Assert.Equal(0, second.Failed);
        Assert.All(times, pair => Assert.Equal(pair.Value, File.GetLastWriteTimeUtc(pair.Key)));
        Assert.Equal(5, File.ReadAllLines(Path.Combine(output, "summary.csv")).Length);

        // A changed input is noticed by its hash: only that asset runs again.
        WriteAsset("a2", 99, withImplied: true);
        var third = BatchRunner.Run(request, null);
        Assert.Equal(3, third.Reused);
        Assert.Equal(1, third.Computed);

        // A changed configuration is noticed too: every asset runs again.
        var fourth = BatchRunner.Run(request with { Settings = request.Settings with { McsSeed = 7 } }, null);
        Assert.Equal(0, fourth.Reused);
        Assert.Equal(4, fourth.Computed);
    }

    [Fact]
    public void Batch_OneBadFile_FailsOnlyThatAssetWithItsMessage()
    {
        WriteAsset("good1", 31, withImplied: true);
        WriteAsset("good2", 32, withImplied: true);
        File.WriteAllText(Path.Combine(_prices, "broken.csv"), "date,open,high,low,close\n2024-01-02,1,1,1,1\nnot-a-date,1,1,1,1\n");
        var output = _temp.Combine("batch");

        var batch = CliRunner.Run("batch", "--prices-dir", _prices, "--implied-dir", _implied, "--iv-unit", "decimal", "--config", _config, "--out", output);

        Assert.Equal(3, batch.ExitCode);
        Assert.Contains("broken", batch.Stderr, StringComparison.Ordinal);
        var summary = File.ReadAllLines(Path.Combine(output, "summary.csv"));
        Assert.Equal(4, summary.Length);
        var broken = summary.Single(l => l.StartsWith("broken,", StringComparison.Ordinal));
        Assert.StartsWith("broken,failed,no,", broken, StringComparison.Ordinal);
        Assert.Contains("broken.csv", broken, StringComparison.Ordinal);
        Assert.StartsWith("good1,done,yes,", summary.Single(l => l.StartsWith("good1,", StringComparison.Ordinal)), StringComparison.Ordinal);
        Assert.StartsWith("good2,done,yes,", summary.Single(l => l.StartsWith("good2,", StringComparison.Ordinal)), StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(output, "assets", "good1", "metrics.csv")));
    }

    [Fact]
    public void Batch_Help_DescribesEveryOption()
    {
        var help = CliRunner.Run("batch", "--help");

        Assert.Equal(0, help.ExitCode);
        foreach (var option in new[] { "--prices-dir", "--implied-dir", "--iv-unit", "--config", "--horizon", "--tenor", "--out", "--jobs", "--force", "--reports", "--shard", "--shards", "--reduce", "--allow-missing" })
        {
            Assert.Contains(option, help.Stdout, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Batch_MissingPricesFolder_IsBadUsage()
    {
        var batch = CliRunner.Run("batch", "--prices-dir", _temp.Combine("nowhere"), "--out", _temp.Combine("batch"));

        Assert.Equal(2, batch.ExitCode);
        Assert.Contains("prices folder does not exist", batch.Stderr, StringComparison.Ordinal);
    }

    private static string WithoutTimes(string runJson)
    {
        var text = File.ReadAllText(runJson);
        var withoutFiles = text[..text.IndexOf("\"files\"", StringComparison.Ordinal)];
        return string.Join('\n', withoutFiles.Split('\n').Where(l => !l.Contains("_utc\"", StringComparison.Ordinal)));
    }

    private static string[] Manifest(string folder)
    {
        using var run = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "run.json")));
        return [.. run.RootElement.GetProperty("files").EnumerateArray().Select(e => e.GetString()!)];
    }

    private void WriteAsset(string name, int seed, bool withImplied)
    {
        var scenario = new DemoScenarioGenerator(seed, years: 3).Generate();
        using (var writer = new StreamWriter(Path.Combine(_prices, name + ".csv"), false, new UTF8Encoding(false)))
        {
            HistoryCsv.WritePrices(writer, scenario.Index);
        }

        if (withImplied)
        {
            using var writer = new StreamWriter(Path.Combine(_implied, name + ".csv"), false, new UTF8Encoding(false));
            HistoryCsv.WriteSeries(writer, "iv", scenario.Implied.Dates, scenario.Implied.Volatility);
        }
    }

    private sealed class CancelAfterFirst(CancellationTokenSource stop) : IProgress<BatchProgress>
    {
        public void Report(BatchProgress value) => stop.Cancel();
    }
}
