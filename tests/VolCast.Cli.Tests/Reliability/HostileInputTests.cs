using System.Diagnostics;
using System.Globalization;
using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Reliability;

// Inputs a hostile or careless user gives: names that would escape the batch folder, an output folder that overlaps
// the inputs, pipes and devices where files belong, settings far outside their range, output paths that cannot be
// written, and values that hide a bad print. Each used to lose data, hang, overflow or pass silently (invented files,
// common practice, no source).
public sealed class HostileInputTests : IDisposable
{
    private readonly string _work = Directory.CreateTempSubdirectory("volcast-hostile-").FullName;

    public void Dispose() => Directory.Delete(_work, recursive: true);

    [Theory]
    [InlineData("..csv", "'.'")]
    [InlineData("...csv", "'..'")]
    [InlineData(".hidden.csv", "'.hidden'")]
    [InlineData("a b.csv", "' '")]
    [InlineData("=cmd.csv", "'=cmd'")]
    public void Batch_UnsafeAssetName_FailsThatNameOnlyAndWritesNothingOutsideItsFolder(string fileName, string named)
    {
        var prices = Directory.CreateDirectory(Path.Combine(_work, "prices")).FullName;
        ReliabilityFiles.Prices(prices, "good.csv", 300, seed: 1);
        ReliabilityFiles.Prices(prices, fileName, 300, seed: 2);
        var output = Path.Combine(_work, "out");

        var result = CliRunner.Run("batch", "--prices-dir", prices, "--out", output, "--config", ReliabilityFiles.FastConfig(_work), "--jobs", "1");

        Assert.Equal(3, result.ExitCode);
        Assert.Contains(named, result.Stderr, StringComparison.Ordinal);
        Assert.Contains("rename the file", result.Stderr, StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(output, "assets", "good", "metrics.csv")));
        Assert.Equal(["good"], Directory.GetDirectories(Path.Combine(output, "assets")).Select(Path.GetFileName));
        Assert.False(File.Exists(Path.Combine(output, "assets", "metrics.csv")));
        Assert.False(File.Exists(Path.Combine(output, "metrics.csv")));
    }

    [Fact]
    public void Batch_CapitalCsvExtension_IsRead()
    {
        var prices = Directory.CreateDirectory(Path.Combine(_work, "prices")).FullName;
        ReliabilityFiles.Prices(prices, "UPPER.CSV", 300, seed: 3);
        var output = Path.Combine(_work, "out");

        var result = CliRunner.Run("batch", "--prices-dir", prices, "--out", output, "--config", ReliabilityFiles.FastConfig(_work));

        Assert.True(result.ExitCode == 0, result.Stderr);
        Assert.True(File.Exists(Path.Combine(output, "assets", "UPPER", "metrics.csv")));
    }

    [Theory]
    [InlineData("same")]
    [InlineData("inside")]
    [InlineData("contains")]
    [InlineData("alias")]
    public void Batch_OutputOverlappingThePricesFolder_RefusedBeforeAnythingIsWritten(string how)
    {
        var prices = Directory.CreateDirectory(Path.Combine(_work, "prices")).FullName;
        var input = ReliabilityFiles.Prices(prices, "summary.csv", 300, seed: 4);
        var before = File.ReadAllBytes(input);
        string output;
        var pricesArg = prices;
        switch (how)
        {
            case "same":
                output = prices;
                break;
            case "inside":
                output = Path.Combine(prices, "results");
                break;
            case "contains":
                output = _work;
                break;
            default:
                // The same folder reached through a symbolic link: compared by real path, not by the string.
                output = Path.Combine(_work, "alias");
                Directory.CreateSymbolicLink(output, prices);
                break;
        }

        var result = CliRunner.Run("batch", "--prices-dir", pricesArg, "--out", output, "--force");

        Assert.Equal(2, result.ExitCode);
        Assert.Contains("input folder", result.Stderr, StringComparison.Ordinal);
        Assert.Equal(before, File.ReadAllBytes(input));
        Assert.Equal(["summary.csv"], Directory.GetFileSystemEntries(prices).Select(Path.GetFileName));
    }

    [Fact]
    public void Batch_PipeAndDeviceAmongPriceFiles_FailThoseNamesWithoutHanging()
    {
        if (OperatingSystem.IsWindows())
        {
            return;
        }

        var prices = Directory.CreateDirectory(Path.Combine(_work, "prices")).FullName;
        ReliabilityFiles.Prices(prices, "good.csv", 300, seed: 5);
        MakeFifo(Path.Combine(prices, "pipe.csv"));
        File.CreateSymbolicLink(Path.Combine(prices, "zero.csv"), "/dev/zero");
        var output = Path.Combine(_work, "out");
        var clock = Stopwatch.StartNew();

        var result = CliRunner.Run("batch", "--prices-dir", prices, "--out", output, "--config", ReliabilityFiles.FastConfig(_work), "--jobs", "1");

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("named pipe", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("character device", result.Stderr, StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(output, "assets", "good", "metrics.csv")));
        Assert.True(clock.Elapsed < TimeSpan.FromMinutes(2), "the batch must not wait on the pipe");
    }

    [Theory]
    [InlineData("/dev/zero", "character device")]
    [InlineData("FOLDER", "this is a folder")]
    public void Backtest_ConfigIsADeviceOrAFolder_RefusedWithoutReadingIt(string config, string fragment)
    {
        if (OperatingSystem.IsWindows())
        {
            return;
        }

        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 300, seed: 6);
        var path = config == "FOLDER" ? _work : config;

        var result = CliRunner.Run("backtest", "--prices", prices, "--config", path, "--out", Path.Combine(_work, "out"));

        Assert.Equal(3, result.ExitCode);
        Assert.Contains(fragment, result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("Access", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_ConfigOverTheCap_RefusedNamingTheCap()
    {
        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 300, seed: 6);
        var config = Path.Combine(_work, "big.json");
        File.WriteAllText(config, "{" + new string(' ', 1024 * 1024) + "}");

        var result = CliRunner.Run("backtest", "--prices", prices, "--config", config, "--out", Path.Combine(_work, "out"));

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("at most 1048576 bytes", result.Stderr, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("--horizon", "2147483647", "--horizon must be from 1 to 2,520 trading days")]
    [InlineData("--tenor", "2147483647d", "--tenor must be from 1 to 3,650 calendar days")]
    [InlineData("--tenor", "3651d", "--tenor must be from 1 to 3,650 calendar days (was 3651d)")]
    [InlineData("--implied-tenor", "3651d", "--implied-tenor must be from 1 to 3,650 calendar days (was 3651d)")]
    [InlineData("--implied-tenor", "thirty", "--implied-tenor must be a number of calendar days followed by d, such as 30d, 1 to 3,650 calendar days (was 'thirty')")]
    [InlineData("--horizon", "1e3", "'1e3' is not a whole number")]
    public void Backtest_SettingOutOfRange_Exit2NamingTheSettingAndRangeBeforeReading(string option, string value, string fragment)
    {
        // The price file does not exist: the range check must come first.
        var result = CliRunner.Run("backtest", "--prices", Path.Combine(_work, "missing.csv"), option, value, "--out", Path.Combine(_work, "out"));

        Assert.Equal(2, result.ExitCode);
        Assert.Contains(fragment, result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("overflow", result.Stderr, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("System.", result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("Int32", result.Stderr, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("--tenor")]
    [InlineData("--implied-tenor")]
    public void Backtest_TenorOfThousandsOfDigits_EchoesItsFirstFortyCharactersNotInfinity(string option)
    {
        var digits = new string('7', 5000) + "d";

        var result = CliRunner.Run("backtest", "--prices", Path.Combine(_work, "missing.csv"), option, digits, "--out", Path.Combine(_work, "out"));

        Assert.Equal(2, result.ExitCode);
        Assert.Contains(option + " must be from 1 to 3,650 calendar days (was " + new string('7', 40) + "…)", result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("Infinity", result.Stderr, StringComparison.Ordinal);
        Assert.True(result.Stderr.Length < 1000, result.Stderr);
    }

    [Fact]
    public void Batch_FolderNamedLikeAPriceFile_FailsThatNameSayingItIsAFolder()
    {
        // A pipe or a device named *.csv fails its name (above); a folder named *.csv is not passed over in silence either.
        var prices = Directory.CreateDirectory(Path.Combine(_work, "prices")).FullName;
        ReliabilityFiles.Prices(prices, "good.csv", 300, seed: 6);
        Directory.CreateDirectory(Path.Combine(prices, "x.csv"));
        var output = Path.Combine(_work, "out");

        var result = CliRunner.Run("batch", "--prices-dir", prices, "--out", output, "--config", ReliabilityFiles.FastConfig(_work), "--jobs", "1");

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("x.csv", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("this is a folder, not a file", result.Stderr, StringComparison.Ordinal);
        var summary = File.ReadAllLines(Path.Combine(output, "summary.csv"));
        Assert.StartsWith("x,failed,", summary.Single(l => l.StartsWith("x,", StringComparison.Ordinal)), StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(output, "assets", "good", "metrics.csv")));
    }

    [Fact]
    public void BacktestHelp_ShowsTheRanges()
    {
        var result = CliRunner.Run("backtest", "--help");
        var help = string.Join(' ', result.Stdout.Split((char[])[' ', '\n', '\r'], StringSplitOptions.RemoveEmptyEntries));

        Assert.Contains("mcs.replications 10 to 100,000", help, StringComparison.Ordinal);
        Assert.Contains("1 to 2,520 trading days", help, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("", "--out is empty")]
    [InlineData("/", "root of the file system")]
    [InlineData("UNDER-INPUT", "which is a file, not a folder")]
    public void Backtest_UnusableOutput_Exit2BeforeComputing(string output, string fragment)
    {
        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 300, seed: 7);
        var target = output == "UNDER-INPUT" ? Path.Combine(prices, "out") : output;

        var result = CliRunner.Run("backtest", "--prices", prices, "--out", target);

        Assert.Equal(2, result.ExitCode);
        Assert.Contains(fragment, result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("forecasting", result.Stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void Fit_OutIsAFolder_Exit2SayingSo()
    {
        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 300, seed: 7);

        var result = CliRunner.Run("fit", "--prices", prices, "--model", "garch", "--out", _work);

        Assert.Equal(2, result.ExitCode);
        Assert.Contains("is a folder", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_OutputUnderReadOnlyFolder_Exit2BeforeComputing()
    {
        if (OperatingSystem.IsWindows())
        {
            return;
        }

        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 300, seed: 7);

        // A folder this user cannot write: one made read-only, or, for root (who writes anywhere), /proc.
        var locked = Environment.UserName == "root" && Directory.Exists("/proc") ? "/proc" : Directory.CreateDirectory(Path.Combine(_work, "locked")).FullName;
        if (locked != "/proc")
        {
            File.SetUnixFileMode(locked, UnixFileMode.UserRead | UnixFileMode.UserExecute);
        }

        try
        {
            var result = CliRunner.Run("backtest", "--prices", prices, "--out", Path.Combine(locked, "volcast-out"));

            Assert.Equal(2, result.ExitCode);
            Assert.Contains("cannot be written", result.Stderr, StringComparison.Ordinal);
            Assert.DoesNotContain("forecasting", result.Stdout, StringComparison.Ordinal);
        }
        finally
        {
            if (locked != "/proc")
            {
                File.SetUnixFileMode(locked, UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute);
            }
        }
    }

    [Fact]
    public void Backtest_CorruptCloseOfOneHundredMillionth_WarnsNamingTheLine()
    {
        // A single close of 1e-8 in a series around 100 (line 152 = header + 151st row).
        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 300, seed: 8);
        var lines = File.ReadAllLines(prices);
        var cells = lines[151].Split(',');
        lines[151] = $"{cells[0]},{cells[1]},{cells[2]},0.00000001,0.00000001";
        File.WriteAllLines(prices, lines);
        var output = Path.Combine(_work, "out");

        var result = CliRunner.Run("backtest", "--prices", prices, "--out", output, "--config", ReliabilityFiles.FastConfig(_work));

        Assert.True(result.ExitCode == 0, result.Stderr);
        Assert.Contains("line 152: the close 1E-08", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("isolated spike", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("isolated spike", File.ReadAllText(Path.Combine(output, "run.json")), StringComparison.Ordinal);
        Assert.Contains("isolated spike", File.ReadAllText(Path.Combine(output, "report.html")), StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_DateBeforeYear100_RefusedAtItsLineInsteadOfCrashingTheCharts()
    {
        var prices = ReliabilityFiles.Prices(_work, "prices.csv", 300, seed: 9);
        var text = File.ReadAllText(prices).Replace("1990-01-01", "0099-01-01", StringComparison.Ordinal);
        File.WriteAllText(prices, text);

        var result = CliRunner.Run("backtest", "--prices", prices, "--out", Path.Combine(_work, "out"));

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("line 2, column 'date'", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("from 1800-01-01 to 9989-12-31", result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("OleAut", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_HugeHeaderName_EchoedCutTo40Characters()
    {
        var prices = Path.Combine(_work, "prices.csv");
        File.WriteAllText(prices, "date," + new string('x', 1_000_000) + "\n2024-01-02,1\n");

        var result = CliRunner.Run("backtest", "--prices", prices, "--out", Path.Combine(_work, "out"));

        Assert.Equal(3, result.ExitCode);
        Assert.True(result.Stderr.Length < 2_000, result.Stderr.Length.ToString(CultureInfo.InvariantCulture));
        Assert.Contains("(1000000 characters)", result.Stderr, StringComparison.Ordinal);
    }

    private static void MakeFifo(string path)
    {
        using var process = Process.Start(new ProcessStartInfo("mkfifo", [path]) { UseShellExecute = false })!;
        process.WaitForExit();
        Assert.Equal(0, process.ExitCode);
    }
}
