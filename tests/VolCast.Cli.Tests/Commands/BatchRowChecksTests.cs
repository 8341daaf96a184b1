using System.Globalization;
using System.Text;
using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Commands;

// The batch treats each name's rows as backtest does (--suspect, --skip-bad-rows, the configuration's suspect and
// skipBadRows, the declared-unit refusal), one name at a time: a name that stops fails alone and the summary lists it.
// Seeded invented files (TrialFiles and Some, not reference data).
public sealed class BatchRowChecksTests : IDisposable
{
    private readonly TempFolder _temp = new("batchchecks");
    private readonly TrialFiles _trial = TrialFiles.Make(7);
    private readonly string _prices;
    private readonly string _implied;
    private readonly string _fast;

    public BatchRowChecksTests()
    {
        _prices = _temp.Combine("prices");
        _implied = _temp.Combine("implied");
        Directory.CreateDirectory(_prices);
        Directory.CreateDirectory(_implied);
        _fast = _temp.Combine("fast.json");
        File.WriteAllText(_fast, "{ \"sweep\": false, \"forecasters\": [\"close-to-close:21\", \"ewma:0.94\"], \"mcs\": { \"replications\": 50 } }");

        // "trial" holds a whole bar times ten on one row (a suspect row); "clean" is a plain random walk.
        File.WriteAllText(Path.Combine(_prices, "trial.csv"), _trial.PriceText());
        File.WriteAllText(Path.Combine(_prices, "clean.csv"), CleanPrices(11));
    }

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void SuspectStop_FailsOnlyTheNameWithSuspectRows_AndTheSummaryListsIt()
    {
        var output = _temp.Combine("stop");

        var result = CliRunner.Run("batch", "--prices-dir", _prices, "--config", _fast, "--suspect", "stop", "--out", output, "--jobs", "1");

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("error: trial:", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("--suspect stop", result.Stderr, StringComparison.Ordinal);
        Assert.Contains(string.Create(CultureInfo.InvariantCulture, $"line {TrialFiles.BadBar + 2}:"), result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("error: clean:", result.Stderr, StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(output, "assets", "clean", "report.html")));
        Assert.False(Directory.Exists(Path.Combine(output, "assets", "trial")));
        var summary = File.ReadAllLines(Path.Combine(output, "summary.csv"));
        Assert.Contains(summary, r => r.StartsWith("trial,", StringComparison.Ordinal) && r.Contains("--suspect stop", StringComparison.Ordinal));
    }

    [Fact]
    public void SuspectDropInTheConfiguration_RecomputesAWarnedName_AndWritesItsOwnRejectedRows()
    {
        var output = _temp.Combine("drop");
        var warned = CliRunner.Run("batch", "--prices-dir", _prices, "--config", _fast, "--out", output, "--jobs", "1");
        Assert.True(warned.ExitCode == 0, warned.Stderr);
        Assert.False(File.Exists(Path.Combine(output, "assets", "trial", "rejected-rows.csv")));
        Assert.Contains("\"suspect\": \"warn\"", File.ReadAllText(Path.Combine(output, "assets", "trial", "run.json")), StringComparison.Ordinal);

        // Another treatment of suspect rows changes the results, so the name is not kept from the warned run.
        var config = _temp.Combine("drop.json");
        File.WriteAllText(config, "{ \"sweep\": false, \"forecasters\": [\"close-to-close:21\", \"ewma:0.94\"], \"mcs\": { \"replications\": 50 }, \"suspect\": \"drop\" }");
        var dropped = CliRunner.Run("batch", "--prices-dir", _prices, "--config", config, "--out", output, "--jobs", "1");

        Assert.True(dropped.ExitCode == 0, dropped.Stderr);
        var rejected = File.ReadAllLines(Path.Combine(output, "assets", "trial", "rejected-rows.csv"));
        Assert.Contains(rejected, r => r.Contains(string.Create(CultureInfo.InvariantCulture, $",{TrialFiles.BadBar + 2},"), StringComparison.Ordinal) && r.Contains(",suspect,", StringComparison.Ordinal));
        Assert.Contains("\"suspect\": \"drop\"", File.ReadAllText(Path.Combine(output, "assets", "trial", "run.json")), StringComparison.Ordinal);
        Assert.Contains("Rows left out", File.ReadAllText(Path.Combine(output, "assets", "trial", "report.html")), StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(output, "assets", "clean", "rejected-rows.csv")));
    }

    [Fact]
    public void Rerun_KeepsNamesWhoseRunWroteOtherFiles_NoImpliedOrRowsLeftOut()
    {
        // Without implied a run writes no trades.csv or rule-pnl.csv, and with dropped rows it adds rejected-rows.csv:
        // a name is complete when every file of its own manifest is there, so both are kept on the rerun.
        var output = _temp.Combine("rerun");
        var first = CliRunner.Run("batch", "--prices-dir", _prices, "--config", _fast, "--suspect", "drop", "--out", output, "--jobs", "1");
        Assert.True(first.ExitCode == 0, first.Stderr);
        var report = Path.Combine(output, "assets", "clean", "report.html");
        var written = File.GetLastWriteTimeUtc(report);

        var second = CliRunner.Run("batch", "--prices-dir", _prices, "--config", _fast, "--suspect", "drop", "--out", output, "--jobs", "1");

        Assert.True(second.ExitCode == 0, second.Stderr);
        Assert.Contains("0 computed, 2 kept from an earlier run", second.Stdout, StringComparison.Ordinal);
        Assert.Equal(written, File.GetLastWriteTimeUtc(report));

        // A name whose manifest lists a file that has gone is run again.
        File.Delete(Path.Combine(output, "assets", "trial", "rejected-rows.csv"));
        var third = CliRunner.Run("batch", "--prices-dir", _prices, "--config", _fast, "--suspect", "drop", "--out", output, "--jobs", "1");
        Assert.Contains("1 computed, 1 kept from an earlier run", third.Stdout, StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(output, "assets", "trial", "rejected-rows.csv")));
    }

    [Fact]
    public void BadRows_FailTheirNameAlone_AndSkipBadRowsLeavesThemOutOfThatName()
    {
        var rows = CleanPrices(12).Split('\n').ToList();
        rows[5] = rows[5][..11] + "1,1,1,abc";
        File.WriteAllText(Path.Combine(_prices, "broken.csv"), string.Join('\n', rows));
        var output = _temp.Combine("skip");

        var refused = CliRunner.Run("batch", "--prices-dir", _prices, "--config", _fast, "--out", output, "--jobs", "1");
        Assert.Equal(3, refused.ExitCode);
        Assert.Contains("error: broken:", refused.Stderr, StringComparison.Ordinal);
        Assert.Contains("line 6", refused.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("error: clean:", refused.Stderr, StringComparison.Ordinal);

        var skipped = CliRunner.Run("batch", "--prices-dir", _prices, "--config", _fast, "--skip-bad-rows", "--out", output, "--jobs", "1");
        Assert.True(skipped.ExitCode == 0, skipped.Stderr);
        var rejected = File.ReadAllLines(Path.Combine(output, "assets", "broken", "rejected-rows.csv"));
        Assert.Single(rejected, r => r.Contains(",bad row,", StringComparison.Ordinal));
    }

    [Fact]
    public void DeclaredUnit_IsCheckedOnEachNamesOwnFile_AndAMismatchFailsThatNameAlone()
    {
        // trial's implied is in percent (median near 18); clean's is the same series in decimals, so --iv-unit percent fits one name only.
        File.WriteAllText(Path.Combine(_implied, "trial.csv"), _trial.ImpliedText());
        var decimals = new StringBuilder("date,iv\n");
        foreach (var (_, text) in _trial.ImpliedRows)
        {
            var comma = text.IndexOf(',', StringComparison.Ordinal);
            decimals.Append(text[..comma]).Append(',').Append((double.Parse(text[(comma + 1)..], CultureInfo.InvariantCulture) / 100).ToString("R", CultureInfo.InvariantCulture)).Append('\n');
        }

        File.WriteAllText(Path.Combine(_implied, "clean.csv"), decimals.ToString());
        File.WriteAllText(Path.Combine(_prices, "clean.csv"), _trial.PriceText());
        var output = _temp.Combine("unit");

        var result = CliRunner.Run("batch", "--prices-dir", _prices, "--implied-dir", _implied, "--iv-unit", "percent", "--config", _fast, "--out", output, "--jobs", "1");

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("error: clean:", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("median value is", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("--iv-unit decimal", result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("error: trial:", result.Stderr, StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(output, "assets", "trial", "report.html")));
        Assert.Contains(File.ReadAllLines(Path.Combine(output, "summary.csv")), r => r.StartsWith("clean,", StringComparison.Ordinal) && r.Contains("median value is", StringComparison.Ordinal));
    }

    private static string CleanPrices(int seed)
    {
        var bars = Some.GbmBars(seed, 500);
        var sb = new StringBuilder("date,open,high,low,close\n");
        for (var i = 0; i < bars.Count; i++)
        {
            sb.Append(CultureInfo.InvariantCulture, $"{bars.Dates[i]:yyyy-MM-dd},{bars.Open[i]:R},{bars.High[i]:R},{bars.Low[i]:R},{bars.Close[i]:R}\n");
        }

        return sb.ToString();
    }
}
