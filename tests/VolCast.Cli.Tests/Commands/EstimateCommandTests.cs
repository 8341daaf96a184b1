using System.Globalization;
using System.Text;
using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Commands;

public sealed class EstimateCommandTests : IDisposable
{
    // Hull, Options, Futures, and Other Derivatives 11e, Example 15.4 / Table 15.1 [C]: 21 closes,
    // s = 0.01216 a day, 19.3% a year (sample standard deviation of the 20 log returns, 252 days).
    private static readonly double[] HullCloses =
    [
        20.00, 20.10, 19.90, 20.00, 20.50, 20.25, 20.90, 20.90, 20.90, 20.75, 20.75,
        21.00, 21.10, 20.90, 20.90, 21.25, 21.40, 21.40, 21.25, 21.75, 22.00,
    ];

    private readonly TempFolder _temp = new("estimate");

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void Estimate_HullTwentyOneCloses_WritesHullsAnnualVolatility()
    {
        var prices = WriteCloses("hull.csv", HullCloses, "\n");

        var result = CliRunner.Run("estimate", "--prices", prices, "--estimator", "close-to-close", "--window", "20");

        Assert.Equal(0, result.ExitCode);
        var lines = result.Stdout.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal("date,vol", lines[0]);
        Assert.Single(lines, l => !l.StartsWith("date", StringComparison.Ordinal));
        var vol = double.Parse(lines[1].Split(',')[1], CultureInfo.InvariantCulture);
        Assert.Equal(0.193, vol, 0.0005); // Hull: 19.3% a year [C]
        Assert.Equal(0.01216, vol / Math.Sqrt(252), 0.000005); // Hull: 0.01216 a day [C]
    }

    [Fact]
    public void Estimate_BomAndCrlf_GivesTheSameRowsAsPlainLf()
    {
        var plain = WriteCloses("plain.csv", HullCloses, "\n");
        var windows = WriteCloses("windows.csv", HullCloses, "\r\n", bom: true);

        var a = CliRunner.Run("estimate", "--prices", plain, "--estimator", "close-to-close", "--window", "5");
        var b = CliRunner.Run("estimate", "--prices", windows, "--estimator", "close-to-close", "--window", "5");

        Assert.Equal(0, b.ExitCode);
        Assert.Equal(a.Stdout, b.Stdout);
    }

    [Fact]
    public void Estimate_OutFile_IsWrittenAndNotReplacedWithoutForce()
    {
        var prices = WriteCloses("hull.csv", HullCloses, "\n");
        var output = _temp.Combine("out", "vol.csv");

        var first = CliRunner.Run("estimate", "--prices", prices, "--estimator", "close-to-close", "--window", "5", "--out", output);
        var written = File.ReadAllText(output);
        var second = CliRunner.Run("estimate", "--prices", prices, "--estimator", "close-to-close", "--window", "10", "--out", output);
        var forced = CliRunner.Run("estimate", "--prices", prices, "--estimator", "close-to-close", "--window", "10", "--out", output, "--force");

        Assert.Equal(0, first.ExitCode);
        Assert.Equal(17, written.Split('\n', StringSplitOptions.RemoveEmptyEntries).Length); // header + 16 windows of 5 returns in 21 closes
        Assert.NotEqual(0, second.ExitCode);
        Assert.Contains("--force", second.Stderr, StringComparison.Ordinal);
        Assert.Equal(0, forced.ExitCode);
        Assert.NotEqual(written, File.ReadAllText(output));
    }

    [Fact]
    public void Estimate_OutEqualToInput_IsRefusedAndTheInputIsUntouched()
    {
        var prices = WriteCloses("hull.csv", HullCloses, "\n");
        var before = File.ReadAllBytes(prices);

        var result = CliRunner.Run("estimate", "--prices", prices, "--estimator", "close-to-close", "--window", "5", "--out", prices, "--force");

        Assert.NotEqual(0, result.ExitCode);
        Assert.Contains("input", result.Stderr, StringComparison.Ordinal);
        Assert.Equal(before, File.ReadAllBytes(prices));
    }

    [Theory]
    [InlineData("parkinson")] // range-based: needs high and low
    [InlineData("yang-zhang")] // needs open, high, low
    public void Estimate_RangeEstimatorOnCloseOnlyFile_ExitsThreeNamingTheMissingColumns(string estimator)
    {
        var prices = WriteCloses("closes.csv", HullCloses, "\n");

        var result = CliRunner.Run("estimate", "--prices", prices, "--estimator", estimator, "--window", "5");

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("closes.csv", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("open, high and low", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Estimate_WindowLongerThanTheData_ExitsThreeNamingTheRowCounts()
    {
        var prices = WriteCloses("hull.csv", HullCloses, "\n");

        var result = CliRunner.Run("estimate", "--prices", prices, "--estimator", "close-to-close", "--window", "21");

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("needs at least 22 rows", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("has 21", result.Stderr, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("--estimator", "garman-klas", "unknown estimator")] // a typo lists the valid names
    [InlineData("--window", "1", "from 2 to 2,520")] // a window needs two observations
    [InlineData("--annualization", "0", "from 1 to 10,000,000")] // annualization must be a positive day count
    public void Estimate_BadOptionValue_ExitsTwo(string option, string value, string fragment)
    {
        var prices = WriteCloses("hull.csv", HullCloses, "\n");
        var args = new List<string> { "estimate", "--prices", prices, "--estimator", "close-to-close", "--window", "5" };
        var at = args.IndexOf(option);
        if (at < 0)
        {
            args.AddRange([option, value]);
        }
        else
        {
            args[at + 1] = value;
        }

        var result = CliRunner.Run([.. args]);

        Assert.Equal(2, result.ExitCode);
        Assert.Contains(fragment, result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Estimate_MissingFile_ExitsThreeNamingIt()
    {
        var missing = _temp.Combine("nowhere.csv");

        var result = CliRunner.Run("estimate", "--prices", missing, "--estimator", "close-to-close", "--window", "5");

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("nowhere.csv", result.Stderr, StringComparison.Ordinal);
    }

    /// <summary>Every price file of the bad-input catalogue, run through the command: exit 3, file and line named, no stack trace.</summary>
    public static TheoryData<string, int?, string> PriceCatalogue()
    {
        var data = new TheoryData<string, int?, string>();
        foreach (var line in File.ReadLines(Path.Combine(AppContext.BaseDirectory, "Fixtures", "BadInput", "catalogue.tsv")))
        {
            if (line.StartsWith('#') || string.IsNullOrWhiteSpace(line))
            {
                continue;
            }

            var cells = line.Split('\t');
            if (cells[1] != "prices")
            {
                continue;
            }

            data.Add(cells[0], cells[3].Length == 0 ? null : int.Parse(cells[3], CultureInfo.InvariantCulture), cells[6]);
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(PriceCatalogue))]
    public void Estimate_BadPriceFile_ExitsThreeWithFileAndLineAndNoStackTrace(string file, int? line, string fragment)
    {
        var path = Path.Combine(AppContext.BaseDirectory, "Fixtures", "BadInput", file);
        var before = File.ReadAllBytes(path);

        var result = CliRunner.Run("estimate", "--prices", path, "--estimator", "close-to-close", "--window", "2");

        Assert.Equal(3, result.ExitCode);
        Assert.Contains(file, result.Stderr, StringComparison.Ordinal);
        if (line is int l)
        {
            Assert.Contains(string.Create(CultureInfo.InvariantCulture, $"line {l}"), result.Stderr, StringComparison.Ordinal);
        }

        Assert.Contains(fragment, result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", result.Stderr, StringComparison.Ordinal);
        Assert.Equal(before, File.ReadAllBytes(path));
    }

    private string WriteCloses(string name, double[] closes, string newline, bool bom = false)
    {
        var sb = new StringBuilder("date,close").Append(newline);
        var date = new DateOnly(2024, 1, 1);
        foreach (var close in closes)
        {
            sb.Append(CultureInfo.InvariantCulture, $"{date:yyyy-MM-dd},{close:0.00}").Append(newline);
            date = date.AddDays(1);
        }

        var path = _temp.Combine(name);
        File.WriteAllText(path, sb.ToString(), new UTF8Encoding(bom));
        return path;
    }
}
