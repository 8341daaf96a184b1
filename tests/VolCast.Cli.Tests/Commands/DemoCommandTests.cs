using System.Globalization;
using System.Text.Json;
using VolCast.Cli.Commands;
using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Commands;

/// <summary>
/// The path a new user walks: <c>volcast demo</c> on the committed data-demo/ writes the whole report, and the numbers
/// in it show what data-demo/README.md says is true of the invented scenario. One demo run is shared by the class.
/// </summary>
public sealed class DemoCommandTests(DemoCommandTests.DemoRun demo) : IClassFixture<DemoCommandTests.DemoRun>
{
    [Fact]
    public void Demo_Out_WritesTheReportChartsAndResults()
    {
        Assert.True(demo.ExitCode == 0, demo.Stderr);
        foreach (var name in new[]
        {
            "report.html", "forecasts.csv", "metrics.csv", "metrics.json", "run.json", "summary.txt", "forecast-vs-realized.png",
            "premium.png", "cumulative-qlike.png", "loss-vs-lookback.png", "mincer-zarnowitz.png", "cone.png", "rule-test.png",
            "reliability.png", "calibration.csv", "coverage.csv",
        })
        {
            Assert.True(new FileInfo(Path.Combine(demo.Folder, name)).Length > 1000, name);
        }

        var html = File.ReadAllText(Path.Combine(demo.Folder, "report.html"));
        Assert.Contains("ranks first on QLIKE", VolCast.Reports.Html.Glossary.WithoutLinks(html), StringComparison.Ordinal);
        Assert.Contains("candidate garch against baseline yang-zhang:21", html, StringComparison.Ordinal);
        Assert.True(html.Length < 5 * 1024 * 1024, "the report must stay under 5 MB");
        Assert.Contains("report.html", demo.Stdout, StringComparison.Ordinal);
        Assert.Empty(Directory.GetDirectories(Path.GetDirectoryName(demo.Folder)!, ".out.*"));
    }

    [Fact]
    public void Demo_ImpliedMinusRealized_IsAboutTheGeneratorsPremium()
    {
        // The generator sets implied = the model's expected 30-day volatility + a premium averaging 2.5 vol points
        // (data-demo/README.md). Realized volatility is the square root of a noisy variance, so on average it sits
        // below the expected volatility (Jensen): mean IV − RV is the premium plus that gap, never less than the
        // premium in expectation. The gap from a 21-day chi-square-like sampling error at 16% vol is about 0.2 points,
        // and volatility of volatility and jumps add a few tenths more; the 20-year mean itself has a HAC standard
        // error of about 0.25 points. So the band is [2.5, 3.5] vol points: the premium, plus up to a point for the
        // Jensen gap and sampling error. (The README says "about 3 points on this seed".)
        var lines = File.ReadAllLines(Path.Combine(demo.Folder, "forecasts.csv"));
        var header = lines[0].Split(',');
        var realized = Array.IndexOf(header, "realized");
        var implied = Array.IndexOf(header, "implied");
        var sum = 0.0;
        var count = 0;
        foreach (var line in lines.Skip(1))
        {
            var cells = line.Split(',');
            if (cells[realized].Length > 0 && cells[implied].Length > 0)
            {
                sum += double.Parse(cells[implied], CultureInfo.InvariantCulture) - double.Parse(cells[realized], CultureInfo.InvariantCulture);
                count++;
            }
        }

        Assert.True(count > 4500, $"expected most of the 5,151 scored dates to have implied, got {count}");
        Assert.InRange(sum / count * 100, 2.5, 3.5);
    }

    [Fact]
    public void Demo_Coverage_ImpliedRangesTooWideGarchNearCalibrated()
    {
        // Implied = the model's expected 30-day volatility + a premium averaging 2.5 vol points (data-demo/README.md),
        // so its ranges are too wide: with the index's volatility around 16%, z has a standard deviation of about
        // 16 / 18.5 = 0.86, and |z| <= 1 holds about 2N(1/0.86) - 1 = 75% of the time against 68.3% (normal arithmetic,
        // common practice, no source). Measured on this seed: share 77.6%, sqrt(mean z^2) = 0.85, Kupiec p < 0.001 on
        // 252 non-overlapping dates. The bands allow for jumps and the 20-year sampling error of a share on about 250
        // independent windows (se about 2.9 points). garch knows the generator's dynamics, so its z scale is near 1
        // (measured 0.998; share 72.3%, a little above 68.3% because jumps fatten the tails and thin the middle).
        var lines = File.ReadAllLines(Path.Combine(demo.Folder, "coverage.csv"));
        var header = lines[0].Split(',');
        string[] Row(string name) => lines.Single(l => l.StartsWith(name + ",", StringComparison.Ordinal)).Split(',');
        double Cell(string[] row, string column) => double.Parse(row[Array.IndexOf(header, column)], CultureInfo.InvariantCulture);

        var implied = Row("implied");
        Assert.InRange(Cell(implied, "within1_share"), 0.72, 0.84);
        Assert.InRange(Cell(implied, "within2_share"), 0.9545, 0.995);
        Assert.InRange(Cell(implied, "z_scale"), 0.78, 0.92);
        Assert.True(Cell(implied, "within1_kupiec_p") < 0.05, "Kupiec should reject implied's |z| <= 1 coverage");
        Assert.True(Cell(implied, "within1_nonoverlapping_dates") >= 230, "about 5,000 dates / 21-22 days");
        Assert.Contains("move bands from implied were too wide", lines.Single(l => l.StartsWith("implied,", StringComparison.Ordinal)), StringComparison.Ordinal);

        var garch = Row("garch");
        Assert.InRange(Cell(garch, "z_scale"), 0.9, 1.1);
        Assert.InRange(Cell(garch, "within1_share"), 0.64, 0.78);
    }

    [Fact]
    public void Demo_ForecasterThatKnowsTheDynamics_RanksAheadOfShortWindows()
    {
        // The scenario's volatility clusters with persistence 0.985 a day (data-demo/README.md): GARCH models that
        // mean-reverting persistence, while 5- and 10-day windows mostly measure noise. So garch's QLIKE is lower.
        using var metrics = JsonDocument.Parse(File.ReadAllText(Path.Combine(demo.Folder, "metrics.json")));
        var qlike = metrics.RootElement.GetProperty("forecasters").EnumerateArray()
            .ToDictionary(f => f.GetProperty("forecaster").GetString()!, f => f.GetProperty("qlike").GetDouble());

        Assert.True(qlike["garch"] < qlike["close-to-close:5"], $"garch {qlike["garch"]} vs close-to-close:5 {qlike["close-to-close:5"]}");
        Assert.True(qlike["garch"] < qlike["close-to-close:10"], $"garch {qlike["garch"]} vs close-to-close:10 {qlike["close-to-close:10"]}");
    }

    [Fact]
    public void Demo_RunJson_RecordsTheDemoConfigurationAndInputs()
    {
        using var run = JsonDocument.Parse(File.ReadAllText(Path.Combine(demo.Folder, "run.json")));
        var roles = run.RootElement.GetProperty("inputs").EnumerateArray().Select(i => i.GetProperty("role").GetString()!).ToArray();
        Assert.Equal(["prices", "implied", "config"], roles);
        var settings = run.RootElement.GetProperty("settings");
        Assert.Equal("30d", settings.GetProperty("tenor").GetString());
        Assert.Equal("yang-zhang:21", settings.GetProperty("baseline").GetString());
        Assert.Equal("garch", settings.GetProperty("candidate").GetString());
    }

    [Fact]
    public void Demo_ExistingOutWithoutForce_Exit2AndNothingChanged()
    {
        using var folder = new TempFolder("demo-existing");
        File.WriteAllText(folder.Combine("report.html"), "mine");
        var result = CliRunner.Run("demo", "--out", folder.Path);
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("--force", result.Stderr, StringComparison.Ordinal);
        Assert.Equal("mine", File.ReadAllText(folder.Combine("report.html")));
    }

    [Fact]
    public void Demo_DataFolderMissing_Exit3SayingHowToCreateIt()
    {
        var result = CliRunner.Run("demo", "--data", Path.Combine(Path.GetTempPath(), $"no-such-demo-{Guid.NewGuid():N}"), "--out", Path.Combine(Path.GetTempPath(), $"x-{Guid.NewGuid():N}"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("--regenerate", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Demo_Regenerate_MatchesTheCommittedFilesByteForByte()
    {
        var committed = RepositoryRoot.Combine("data-demo");
        using var folder = new TempFolder("regen");
        var result = CliRunner.Run("demo", "--regenerate", "--data", folder.Path);
        Assert.True(result.ExitCode == 0, result.Stderr);
        Assert.Equal(46, DemoFiles.GeneratedFiles.Count);
        foreach (var file in DemoFiles.GeneratedFiles)
        {
            var expected = File.ReadAllBytes(Path.Combine(committed, file));
            var actual = File.ReadAllBytes(folder.Combine(file));
            Assert.True(expected.AsSpan().SequenceEqual(actual), $"{file} differs from the committed data-demo/{file}");
        }
    }

    [Fact]
    public void Demo_Help_SaysTheDefaultReplacesReportsDemo()
    {
        var result = CliRunner.Run("demo", "--help");
        Assert.Equal(0, result.ExitCode);
        Assert.Contains("implicitly --force", result.Stdout, StringComparison.Ordinal);
        Assert.Contains("--regenerate", result.Stdout, StringComparison.Ordinal);
    }

    /// <summary>Runs <c>volcast demo --out TEMP</c> once for the class.</summary>
    public sealed class DemoRun : IDisposable
    {
        private readonly TempFolder _temp = new("demo");

        public DemoRun()
        {
            Folder = _temp.Combine("out");
            var result = CliRunner.Run("demo", "--out", Folder);
            ExitCode = result.ExitCode;
            Stdout = result.Stdout;
            Stderr = result.Stderr;
        }

        public string Folder { get; }

        public int ExitCode { get; }

        public string Stdout { get; }

        public string Stderr { get; }

        public void Dispose() => _temp.Dispose();
    }
}
