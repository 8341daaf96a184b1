using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Reliability;

// volcast fit on data the fitter cannot use (review finding): a plain message naming the file and the minimum,
// never .NET's "(Parameter 'returns')" and never a stack trace.
public sealed class FitMessageTests : IDisposable
{
    private readonly TempFolder _temp = new("fitmsg");

    public void Dispose() => _temp.Dispose();

    [Theory]
    [InlineData("garch")]
    [InlineData("gjr-garch")]
    public void Fit_ConstantPrices_Exits3WithAPlainMessageNamingFileAndMinimum(string model)
    {
        // 300 identical closes: every return is zero, so the fitter refuses the data (zero variance).
        var prices = ReliabilityFiles.Prices(_temp.Path, "flat.csv", 300, seed: 11, (_, date, _) => (date, 100.0));
        var output = _temp.Combine("fit.json");

        var result = CliRunner.Run("fit", "--prices", prices, "--model", model, "--out", output);

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("flat.csv", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("zero variance", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("at least 100 finite daily returns", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("variance start backcast", result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("(Parameter", result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", result.Stderr, StringComparison.Ordinal);
        Assert.False(File.Exists(output));
    }

    [Fact]
    public void Fit_OneHugeJump_FitsOrWarnsButNeverCrashes()
    {
        // A single 60% overnight jump in an otherwise quiet series: the fit must end with parameters or a warning.
        var prices = ReliabilityFiles.Prices(_temp.Path, "jump.csv", 500, seed: 12, (i, date, close) => (date, i == 250 ? close * 1.6 : close));

        var result = CliRunner.Run("fit", "--prices", prices, "--model", "garch", "--out", _temp.Combine("fit.json"));

        Assert.True(result.ExitCode == 0, result.Stderr);
        Assert.Contains("persistence", result.Stdout, StringComparison.Ordinal);
        Assert.DoesNotContain("NaN", File.ReadAllText(_temp.Combine("fit.json")), StringComparison.Ordinal);
    }
}
