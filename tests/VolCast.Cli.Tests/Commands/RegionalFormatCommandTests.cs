using System.Globalization;
using System.Text;
using VolCast.Cli.Tests.Support;
using VolCast.Core.Data;

namespace VolCast.Cli.Tests.Commands;

// The format options on the command line: a regional file, declared, gives the same output bytes as its ISO twin
// (the ISO run is the reference); undeclared, it is refused with exit 3 naming the option. Invented seeded data.
public sealed class RegionalFormatCommandTests : IDisposable
{
    private readonly TempFolder _temp = new("regional");
    private readonly PriceHistory _history = Some.GbmBars(seed: 47, days: 260);

    public void Dispose() => _temp.Dispose();

    [Theory]
    [InlineData("dd.MM.yyyy", ";", ",")]
    [InlineData("MM/dd/yyyy", ",", ".")]
    [InlineData("yyyyMMdd", "tab", ".")]
    public void Estimate_DeclaredRegionalFile_WritesTheSameSeriesAsTheIsoFile(string dateFormat, string delimiter, string point)
    {
        var iso = _temp.Write("iso.csv", Prices("yyyy-MM-dd", ',', '.'));
        var regional = _temp.Write("regional.csv", Prices(dateFormat, delimiter == "tab" ? '\t' : delimiter[0], point[0]));
        var a = CliRunner.Run("estimate", "--prices", iso, "--estimator", "yang-zhang", "--window", "21", "--out", _temp.Combine("iso-out.csv"));
        var b = CliRunner.Run("estimate", "--prices", regional, "--estimator", "yang-zhang", "--window", "21", "--out", _temp.Combine("regional-out.csv"),
            "--date-format", dateFormat, "--delimiter", delimiter, "--decimal", point);
        Assert.True(a.ExitCode == 0, a.Stderr);
        Assert.True(b.ExitCode == 0, b.Stderr);
        Assert.Equal(File.ReadAllBytes(_temp.Combine("iso-out.csv")), File.ReadAllBytes(_temp.Combine("regional-out.csv")));
    }

    [Fact]
    public void Estimate_SemicolonFileUndeclared_ExitsThreeNamingTheDelimiterOption()
    {
        var regional = _temp.Write("de.csv", Prices("dd.MM.yyyy", ';', ','));
        var result = CliRunner.Run("estimate", "--prices", regional, "--estimator", "close-to-close", "--window", "21");
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("--delimiter ';'", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Fit_UsDatesUndeclared_ExitsThreeNamingTheDateFormatOption()
    {
        var us = _temp.Write("us.csv", Prices("MM/dd/yyyy", ',', '.'));
        var result = CliRunner.Run("fit", "--prices", us, "--model", "garch", "--out", _temp.Combine("fit.json"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("--date-format MM/dd/yyyy", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Estimate_DecimalCommaWithCommaDelimiter_ExitsTwo()
    {
        var iso = _temp.Write("iso.csv", Prices("yyyy-MM-dd", ',', '.'));
        var result = CliRunner.Run("estimate", "--prices", iso, "--estimator", "close-to-close", "--window", "21", "--decimal", ",");
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("--delimiter ';'", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_ConfigFormKeysAndImpliedTenor_ReadTheRegionalFilesAndWarnOfTheTenorMismatch()
    {
        var prices = _temp.Write("de.csv", Prices("dd.MM.yyyy", ';', ','));
        var implied = new StringBuilder("date;iv\n");
        for (var i = 0; i < _history.Count; i++)
        {
            implied.Append(_history.Dates[i].ToString("dd.MM.yyyy", CultureInfo.InvariantCulture)).Append(";0,2").Append((i % 10).ToString(CultureInfo.InvariantCulture)).Append('\n');
        }

        var iv = _temp.Write("de-iv.csv", implied.ToString());
        var config = _temp.Write("c.json", "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\", \"close-to-close:21\"], \"dateFormat\": \"dd.MM.yyyy\", \"delimiter\": \";\", \"decimal\": \",\", \"impliedTenor\": \"91d\" }");
        var result = CliRunner.Run("backtest", "--prices", prices, "--implied", iv, "--iv-unit", "decimal", "--config", config, "--horizon", "10", "--out", _temp.Combine("out"));
        Assert.True(result.ExitCode == 0, result.Stderr);
        Assert.Contains("declared as a 91-calendar-day tenor", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("10 trading days", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("declared as a 91-calendar-day tenor", File.ReadAllText(_temp.Combine("out", "run.json")), StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_DeclaredForm_IsStatedInRunJsonSettingsAndTheReportSettings()
    {
        var prices = _temp.Write("de.csv", Prices("dd.MM.yyyy", ';', ','));
        var config = _temp.Write("c.json", "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\", \"close-to-close:21\"] }");
        var output = _temp.Combine("declared");

        var result = CliRunner.Run("backtest", "--prices", prices, "--config", config, "--date-format", "dd.MM.yyyy", "--delimiter", ";", "--decimal", ",", "--out", output);

        Assert.True(result.ExitCode == 0, result.Stderr);
        using var run = System.Text.Json.JsonDocument.Parse(File.ReadAllText(Path.Combine(output, "run.json")));
        var form = run.RootElement.GetProperty("settings").GetProperty("inputFormat");
        Assert.Equal("dd.MM.yyyy", form.GetProperty("dateFormat").GetString());
        Assert.Equal(";", form.GetProperty("delimiter").GetString());
        Assert.Equal(",", form.GetProperty("decimal").GetString());
        Assert.Contains("NA", form.GetProperty("missing").EnumerateArray().Select(e => e.GetString()));
        var report = File.ReadAllText(Path.Combine(output, "report.html"));
        Assert.Contains("Input CSV format", report, StringComparison.Ordinal);
        Assert.Contains("dates dd.MM.yyyy", report, StringComparison.Ordinal);
        Assert.Contains("missing values: an empty cell, null, NA", report, StringComparison.Ordinal);

        // An ISO file declares nothing: run.json's inputFormat is null, and the report has no such line.
        var iso = _temp.Write("iso.csv", Prices("yyyy-MM-dd", ',', '.'));
        var plain = CliRunner.Run("backtest", "--prices", iso, "--config", config, "--out", _temp.Combine("iso"));
        Assert.True(plain.ExitCode == 0, plain.Stderr);
        Assert.Contains("\"inputFormat\": null", File.ReadAllText(_temp.Combine("iso", "run.json")), StringComparison.Ordinal);
        Assert.DoesNotContain("Input CSV format", File.ReadAllText(_temp.Combine("iso", "report.html")), StringComparison.Ordinal);
    }

    [Fact]
    public void Demo_DataFolderWhoseConfigurationDeclaresARegionalForm_IsReadInThatForm()
    {
        // A demo data folder of regional files: the demo reads its configuration's form keys as backtest --config does.
        var data = _temp.Combine("data");
        Directory.CreateDirectory(data);
        File.WriteAllText(Path.Combine(data, "alder-ridge.csv"), Prices("dd.MM.yyyy", ';', ','));
        var implied = new StringBuilder("date;iv\n");
        for (var i = 0; i < _history.Count; i++)
        {
            implied.Append(_history.Dates[i].ToString("dd.MM.yyyy", CultureInfo.InvariantCulture)).Append(";0,2").Append((i % 10).ToString(CultureInfo.InvariantCulture)).Append('\n');
        }

        File.WriteAllText(Path.Combine(data, "alder-ridge-implied-30d.csv"), implied.ToString());
        File.WriteAllText(Path.Combine(data, "demo-config.json"), "{ \"sweep\": false, \"forecasters\": [\"ewma:0.94\", \"close-to-close:21\"], \"dateFormat\": \"dd.MM.yyyy\", \"delimiter\": \";\", \"decimal\": \",\", \"impliedTenor\": \"91d\" }");
        var output = _temp.Combine("demo-out");

        var result = CliRunner.Run("demo", "--data", data, "--out", output);

        Assert.True(result.ExitCode == 0, result.Stderr);
        Assert.Contains("declared as a 91-calendar-day tenor", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("\"dateFormat\": \"dd.MM.yyyy\"", File.ReadAllText(Path.Combine(output, "run.json")), StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_BadImpliedTenor_ExitsTwo()
    {
        var prices = _temp.Write("iso.csv", Prices("yyyy-MM-dd", ',', '.'));
        var result = CliRunner.Run("backtest", "--prices", prices, "--implied-tenor", "thirty", "--out", _temp.Combine("out"));
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("--implied-tenor", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Demo_BuiltToolCopiedOutsideTheRepository_RunsFromAnyFolderWithItsOwnData()
    {
        // The data travels with the tool: copy the built tool (no repository above it) and run it from an empty folder.
        var tool = _temp.Combine("tool");
        Directory.CreateDirectory(tool);
        foreach (var file in Directory.GetFiles(AppContext.BaseDirectory))
        {
            if (file.EndsWith(".dll", StringComparison.Ordinal) || file.EndsWith(".json", StringComparison.Ordinal))
            {
                File.Copy(file, Path.Combine(tool, Path.GetFileName(file)));
            }
        }

        CopyFolder(Path.Combine(AppContext.BaseDirectory, "data-demo"), Path.Combine(tool, "data-demo"));
        if (Directory.Exists(Path.Combine(AppContext.BaseDirectory, "runtimes")))
        {
            // The charts' native drawing libraries.
            CopyFolder(Path.Combine(AppContext.BaseDirectory, "runtimes"), Path.Combine(tool, "runtimes"));
        }

        var cwd = _temp.Combine("elsewhere");
        Directory.CreateDirectory(cwd);
        var result = CliRunner.RunDll(Path.Combine(tool, "volcast.dll"), cwd, "demo", "--out", "demo-out");
        Assert.True(result.ExitCode == 0, result.Stderr);
        Assert.True(File.Exists(Path.Combine(cwd, "demo-out", "report.html")));
        Assert.False(Directory.Exists(Path.Combine(tool, "reports")));
    }

    private static void CopyFolder(string from, string to)
    {
        Assert.True(Directory.Exists(from), "the demo data must be copied beside the built tool");
        foreach (var file in Directory.GetFiles(from, "*", SearchOption.AllDirectories))
        {
            var target = Path.Combine(to, Path.GetRelativePath(from, file));
            Directory.CreateDirectory(Path.GetDirectoryName(target)!);
            File.Copy(file, target);
        }
    }

    private string Prices(string dateFormat, char delimiter, char point)
    {
        string N(double v) => v.ToString("R", CultureInfo.InvariantCulture).Replace('.', point);
        var sb = new StringBuilder().AppendJoin(delimiter, "date", "open", "high", "low", "close").Append('\n');
        for (var i = 0; i < _history.Count; i++)
        {
            sb.Append(_history.Dates[i].ToString(dateFormat, CultureInfo.InvariantCulture)).Append(delimiter).Append(N(_history.Open[i])).Append(delimiter)
                .Append(N(_history.High[i])).Append(delimiter).Append(N(_history.Low[i])).Append(delimiter).Append(N(_history.Close[i])).Append('\n');
        }

        return sb.ToString();
    }
}
