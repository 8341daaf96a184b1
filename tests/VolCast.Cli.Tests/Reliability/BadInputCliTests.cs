using System.Globalization;
using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Reliability;

// Every row of the bad-input catalogue (tests/VolCast.IO.Tests/Fixtures/BadInput/catalogue.tsv) through the command
// that reads it: the exit code of the catalogue, the file and line named, the fragment, no stack trace, the input
// unchanged and no results written.
public sealed class BadInputCliTests : IDisposable
{
    private static readonly string Folder = Path.Combine(AppContext.BaseDirectory, "Fixtures", "BadInput");

    private readonly TempFolder _temp = new("badinput");

    public void Dispose() => _temp.Dispose();

    /// <summary>One entry per catalogue row and command: file, reader, iv unit, line, exit code, fragment, command.</summary>
    public static TheoryData<string, string, string, int?, int, string, string> Rows()
    {
        var data = new TheoryData<string, string, string, int?, int, string, string>();
        foreach (var line in File.ReadLines(Path.Combine(Folder, "catalogue.tsv")))
        {
            if (line.Length == 0 || line[0] == '#')
            {
                continue;
            }

            var f = line.Split('\t');
            int? at = f[3].Length == 0 ? null : int.Parse(f[3], CultureInfo.InvariantCulture);
            var code = int.Parse(f[5], CultureInfo.InvariantCulture);
            string[] commands = f[1] switch
            {
                "prices" => ["estimate", "backtest"],
                "implied" => ["backtest"],
                "quotes" => ["implied"],
                "config" => ["backtest"],
                _ => throw new InvalidOperationException($"catalogue.tsv: unknown reader '{f[1]}' for {f[0]}."),
            };
            foreach (var command in commands)
            {
                data.Add(f[0], f[1], f[2], at, code, f[6], command);
            }
        }

        return data;
    }

    [Fact]
    public void Catalogue_HasEveryReaderKind()
    {
        var kinds = Rows().Select(r => (string)r[1]).ToHashSet(StringComparer.Ordinal);
        Assert.Equal(["config", "implied", "prices", "quotes"], kinds.Order());
        Assert.True(Rows().Count >= 120, $"expected at least 120 command runs, found {Rows().Count}");
    }

    [Theory]
    [MemberData(nameof(Rows))]
    public void Command_CatalogueInput_ExitsWithItsCodeNamingFileAndLineWithoutStackTrace(
        string file, string reader, string unit, int? line, int exitCode, string fragment, string command)
    {
        var path = Path.Combine(Folder, file);
        var before = File.ReadAllBytes(path);
        var written = File.GetLastWriteTimeUtc(path);
        var output = _temp.Combine("out");
        var args = Arguments(reader, unit, path, command, output);

        var result = CliRunner.Run(args);

        Assert.True(exitCode == result.ExitCode, $"exit {result.ExitCode}: {result.Stderr}");
        Assert.Contains(file, result.Stderr, StringComparison.Ordinal);
        if (line is int l)
        {
            Assert.Contains(string.Create(CultureInfo.InvariantCulture, $"line {l}"), result.Stderr, StringComparison.Ordinal);
        }

        Assert.Contains(fragment, result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("Exception", result.Stderr, StringComparison.Ordinal);
        Assert.Equal(before, File.ReadAllBytes(path));
        Assert.Equal(written, File.GetLastWriteTimeUtc(path));
        Assert.False(Directory.Exists(output) || File.Exists(output), "a refused input must leave no results");
    }

    private string[] Arguments(string reader, string unit, string path, string command, string output)
    {
        var unitArgs = unit.Length == 0 ? [] : new[] { "--iv-unit", unit };
        return (reader, command) switch
        {
            ("prices", "estimate") => ["estimate", "--prices", path, "--estimator", "close-to-close", "--window", "2", "--out", output],
            ("prices", _) => ["backtest", "--prices", path, "--out", output],
            ("implied", _) => ["backtest", "--prices", ValidPrices(), "--implied", path, .. unitArgs, "--out", output],
            ("quotes", _) => ["implied", "--quotes", path, "--tenor", "30d", "--out", output],
            _ => ["backtest", "--prices", ValidPrices(), "--config", path, "--out", output],
        };
    }

    private string ValidPrices() => ReliabilityFiles.Prices(_temp.Path, "valid.csv", 300, seed: 8);
}
