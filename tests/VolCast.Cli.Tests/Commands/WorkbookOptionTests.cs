using System.Text.Json;
using VolCast.Cli.Tests.Reliability;
using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Commands;

/// <summary>
/// <c>backtest --workbook</c> and the configuration's <c>workbook: true</c> write results.xlsx beside the CSV files and
/// list it in run.json; without either, no workbook is written. (The workbook's cells are checked against the CSV
/// files in VolCast.IO.Tests.)
/// </summary>
public sealed class WorkbookOptionTests : IDisposable
{
    private readonly TempFolder _temp = new("workbook");

    public void Dispose() => _temp.Dispose();

    [Theory]
    [InlineData("option")]
    [InlineData("config")]
    public void Backtest_AskedForTheWorkbook_WritesResultsXlsxAndListsItInRunJson(string how)
    {
        var folder = Run(how == "option" ? ["--workbook"] : [], how == "config" ? ", \"workbook\": true" : string.Empty);

        var workbook = new FileInfo(Path.Combine(folder, "results.xlsx"));
        Assert.True(workbook.Exists && workbook.Length > 1000, "results.xlsx is missing or empty");
        // An .xlsx file is a zip package: it starts with the local file header "PK\x03\x04" (ECMA-376 Part 2, which uses ZIP).
        Assert.Equal("PK\u0003\u0004"u8.ToArray(), File.ReadAllBytes(workbook.FullName)[..4]);
        Assert.Contains("results.xlsx", Manifest(folder));
    }

    [Fact]
    public void Backtest_WithoutTheWorkbook_WritesNone()
    {
        var folder = Run([], string.Empty);

        Assert.False(File.Exists(Path.Combine(folder, "results.xlsx")));
        Assert.DoesNotContain("results.xlsx", Manifest(folder));
    }

    [Fact]
    public void Batch_Workbook_WritesOneWorkbookPerNameAndTheLongTableAcrossNames()
    {
        var prices = Path.Combine(_temp.Path, "names");
        Directory.CreateDirectory(prices);
        ReliabilityFiles.Prices(prices, "alpha.csv", 400, seed: 5);
        ReliabilityFiles.Prices(prices, "beta.csv", 400, seed: 6);
        var output = Path.Combine(_temp.Path, "batch");

        var result = CliRunner.Run("batch", "--prices-dir", prices, "--config", ReliabilityFiles.FastConfig(_temp.Path), "--out", output, "--jobs", "1", "--workbook");

        Assert.True(result.ExitCode == 0, result.Stderr);
        foreach (var name in new[] { "alpha", "beta" })
        {
            var folder = Path.Combine(output, "assets", name);
            Assert.True(File.Exists(Path.Combine(folder, "results.xlsx")), name);
            Assert.Contains("results.xlsx", Manifest(folder));
        }

        // The batch's long table is every name's forecasts-long.csv with the name in front, in name order.
        var expected = new List<string> { "asset,date,forecaster,forecast,realized,implied" };
        foreach (var name in new[] { "alpha", "beta" })
        {
            expected.AddRange(File.ReadAllLines(Path.Combine(output, "assets", name, "forecasts-long.csv")).Skip(1).Select(line => name + "," + line));
        }

        Assert.Equal(expected, File.ReadAllLines(Path.Combine(output, "forecasts-long.csv")));
    }

    [Fact]
    public void Backtest_WorkbookSettingNotABoolean_IsRefusedNamingTheSetting()
    {
        var prices = ReliabilityFiles.Prices(_temp.Path, "prices.csv", 400, seed: 5);
        var config = ReliabilityFiles.FastConfig(_temp.Path, ", \"workbook\": \"yes\"");

        var result = CliRunner.Run("backtest", "--prices", prices, "--config", config, "--out", Path.Combine(_temp.Path, "bad"));

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("workbook", result.Stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(Path.Combine(_temp.Path, "bad")));
    }

    private string Run(string[] options, string extra)
    {
        var prices = ReliabilityFiles.Prices(_temp.Path, "prices.csv", 400, seed: 5);
        var folder = Path.Combine(_temp.Path, "out-" + Guid.NewGuid().ToString("N")[..8]);
        var result = CliRunner.Run(["backtest", "--prices", prices, "--config", ReliabilityFiles.FastConfig(_temp.Path, extra), "--out", folder, .. options]);
        Assert.True(result.ExitCode == 0, result.Stderr);
        return folder;
    }

    private static List<string?> Manifest(string folder)
    {
        using var run = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "run.json")));
        return [.. run.RootElement.GetProperty("files").EnumerateArray().Select(e => e.GetString())];
    }
}
