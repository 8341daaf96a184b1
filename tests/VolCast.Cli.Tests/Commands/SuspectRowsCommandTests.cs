using System.Globalization;
using System.Text;
using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Commands;

// The command-line side of the input checks on seeded invented files (TrialFiles, not reference data): --suspect,
// the configuration's suspect, --skip-bad-rows, rejected-rows.csv, the declared-unit refusal and the notes in the report.
public sealed class SuspectRowsCommandTests : IDisposable
{
    private readonly TempFolder _temp = new("suspect");
    private readonly TrialFiles _trial = TrialFiles.Make(7);
    private readonly string _prices;
    private readonly string _implied;
    private readonly string _fast;

    public SuspectRowsCommandTests()
    {
        _prices = Write("p.csv", _trial.PriceText());
        _implied = Write("iv.csv", _trial.ImpliedText());
        _fast = Write("fast.json", "{ \"sweep\": false, \"forecasters\": [\"close-to-close:21\", \"parkinson:21\", \"ewma:0.94\"] }");
    }

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void SuspectStop_Exit3WithTheWholeList_AndTheConfigurationKeyDoesTheSame()
    {
        var output = _temp.Combine("stop");
        var result = CliRunner.Run("backtest", "--prices", _prices, "--implied", _implied, "--iv-unit", "percent", "--config", _fast, "--suspect", "stop", "--out", output);

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("--suspect stop", result.Stderr, StringComparison.Ordinal);
        Assert.Contains(string.Create(CultureInfo.InvariantCulture, $"{_prices}, line {TrialFiles.BadBar + 2}:"), result.Stderr, StringComparison.Ordinal);
        Assert.Contains(string.Create(CultureInfo.InvariantCulture, $"{_implied}, line {_trial.ImpliedLine(TrialFiles.Spike)}:"), result.Stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(output));

        var config = Write("stop.json", "{ \"sweep\": false, \"forecasters\": [\"close-to-close:21\"], \"suspect\": \"stop\" }");
        var fromConfig = CliRunner.Run("backtest", "--prices", _prices, "--implied", _implied, "--iv-unit", "percent", "--config", config, "--out", output);
        Assert.Equal(3, fromConfig.ExitCode);
        Assert.Contains("--suspect stop", fromConfig.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void SuspectDrop_WritesRejectedRowsCsv_ListedInRunJsonAndCountedInTheReport()
    {
        var output = _temp.Combine("drop");
        var result = CliRunner.Run("backtest", "--prices", _prices, "--implied", _implied, "--iv-unit", "percent", "--config", _fast, "--suspect", "drop", "--out", output);

        Assert.True(result.ExitCode == 0, result.Stderr);
        var rejected = File.ReadAllLines(Path.Combine(output, "rejected-rows.csv"));
        Assert.Equal("file,line,date,kind,reason", rejected[0]);

        // One bar, six stale copies, one spike and ten values outside the realized range (see TrialFiles).
        Assert.Equal(18, rejected.Length - 1);
        Assert.Contains(rejected, r => r.StartsWith(string.Create(CultureInfo.InvariantCulture, $"{_prices},{TrialFiles.BadBar + 2},"), StringComparison.Ordinal) && r.Contains(",suspect,", StringComparison.Ordinal));

        var runJson = File.ReadAllText(Path.Combine(output, "run.json"));
        Assert.Contains("\"rejected-rows.csv\"", runJson, StringComparison.Ordinal);
        Assert.Contains("\"suspect\": \"drop\"", runJson, StringComparison.Ordinal);
        Assert.Contains("\"rows_left_out\": 18", runJson, StringComparison.Ordinal);

        var report = File.ReadAllText(Path.Combine(output, "report.html"));
        Assert.Contains("Rows left out", report, StringComparison.Ordinal);
        Assert.Contains("18 (listed in rejected-rows.csv)", report, StringComparison.Ordinal);

        // The range estimator's row carries the overnight-gap mark (after the ✓ of the model confidence set, if any) and the explanation (parkinson:21 is in the list).
        Assert.Matches("<td>parkinson:21[^<]* †</td>", report);
        Assert.Contains("overnight move from the previous close to the open is left out", report, StringComparison.Ordinal);
    }

    [Fact]
    public void SuspectWarn_ListsTheFindingsInTheConsoleRunJsonAndReport()
    {
        var output = _temp.Combine("warn");
        var result = CliRunner.Run("backtest", "--prices", _prices, "--implied", _implied, "--iv-unit", "percent", "--config", _fast, "--out", output);

        Assert.True(result.ExitCode == 0, result.Stderr);
        var spike = string.Create(CultureInfo.InvariantCulture, $"{_prices}, line {TrialFiles.BadBar + 2}:");
        Assert.Contains(spike, result.Stderr, StringComparison.Ordinal);
        Assert.Contains("outage", File.ReadAllText(Path.Combine(output, "run.json")), StringComparison.Ordinal);
        Assert.Contains("isolated spike", File.ReadAllText(Path.Combine(output, "report.html")), StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(output, "rejected-rows.csv")));
    }

    [Fact]
    public void DeclaredUnitContradictingTheData_Exit3NamingFileMedianAndTheOtherUnit()
    {
        // The trial implied file is in percent (median near 18).
        var result = CliRunner.Run("backtest", "--prices", _prices, "--implied", _implied, "--iv-unit", "decimal", "--config", _fast, "--out", _temp.Combine("unit"));

        Assert.Equal(3, result.ExitCode);
        Assert.Contains(_implied, result.Stderr, StringComparison.Ordinal);
        Assert.Contains("median value is", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("--iv-unit percent", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void BadRows_AllListed_AndSkipBadRowsLeavesThemOutIntoRejectedRowsCsv()
    {
        var rows = _trial.PriceText().Split('\n').ToList();
        rows[5] = rows[5][..11] + "1,1,1,abc";
        rows[9] = rows[9][..11] + "100,99,101,100";
        var prices = Write("bad.csv", string.Join('\n', rows));

        var refused = CliRunner.Run("backtest", "--prices", prices, "--config", _fast, "--out", _temp.Combine("bad"));
        Assert.Equal(3, refused.ExitCode);
        Assert.Contains("2 rows fail the row checks", refused.Stderr, StringComparison.Ordinal);
        Assert.Contains("line 6", refused.Stderr, StringComparison.Ordinal);
        Assert.Contains("line 10", refused.Stderr, StringComparison.Ordinal);

        var output = _temp.Combine("skipped");
        var skipped = CliRunner.Run("backtest", "--prices", prices, "--config", _fast, "--skip-bad-rows", "--out", output);
        Assert.True(skipped.ExitCode == 0, skipped.Stderr);
        var rejected = File.ReadAllLines(Path.Combine(output, "rejected-rows.csv"));
        Assert.Equal(2, rejected.Count(r => r.Contains(",bad row,", StringComparison.Ordinal)));
        Assert.Contains("Rows left out", File.ReadAllText(Path.Combine(output, "report.html")), StringComparison.Ordinal);
    }

    [Fact]
    public void CloseOnlyFileWithAdjustedClose_SaysWhatWasReplacedAndThatPricesWereAdjusted()
    {
        // date, close, adj_close: a close-only file whose adjusted close is half the close (a 2-for-1 split adjustment).
        var sb = new StringBuilder("date,close,adj_close\n");
        var bars = Some.GbmBars(11, 400);
        for (var i = 0; i < bars.Count; i++)
        {
            sb.Append(CultureInfo.InvariantCulture, $"{bars.Dates[i]:yyyy-MM-dd},{bars.Close[i]:R},{bars.Close[i] / 2:R}\n");
        }

        var prices = Write("closes.csv", sb.ToString());
        var output = _temp.Combine("closes");
        var result = CliRunner.Run("backtest", "--prices", prices, "--config", Write("nosweep.json", "{ \"sweep\": false }"), "--out", output);

        Assert.True(result.ExitCode == 0, result.Stderr);
        Assert.Contains("close-to-close:63 in place of yang-zhang:21", result.Stderr, StringComparison.Ordinal);
        var report = File.ReadAllText(Path.Combine(output, "report.html"));
        Assert.Contains("close-to-close:63 in place of yang-zhang:21", report, StringComparison.Ordinal);
        Assert.Contains("adj_close column was applied", report, StringComparison.Ordinal);
    }

    private string Write(string name, string text)
    {
        var path = _temp.Combine(name);
        File.WriteAllText(path, text);
        return path;
    }
}
