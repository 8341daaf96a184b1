using System.Globalization;
using System.Text;
using VolCast.Cli.Tests.Support;
using VolCast.Core.Options;

namespace VolCast.Cli.Tests.Commands;

public sealed class ImpliedCommandTests : IDisposable
{
    private const string Header = "date,underlying,expiry,strike,type,price,rate,dividend_yield";
    private readonly TempFolder _temp = new("implied");

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void Implied_GoodQuotes_WritesDateIvAndDiagnostics()
    {
        // Invented demo chain: flat 25% (20 days) and 30% (50 days) smiles priced with Black-Scholes-Merton; the
        // expected 30-day value is the total-variance interpolation written out from its definition [D].
        var quotes = WriteQuotes("quotes.csv", GoodChain());
        var output = _temp.Combine("iv.csv");
        var result = CliRunner.Run("implied", "--quotes", quotes, "--tenor", "30d", "--out", output);

        Assert.Equal(0, result.ExitCode);
        Assert.Equal(string.Empty, result.Stderr);
        var lines = File.ReadAllLines(output);
        Assert.Equal(["date,iv", lines[1], lines[2]], lines);
        double t1 = 20 / 365.0, t2 = 50 / 365.0, tau = 30 / 365.0;
        var expected = Math.Sqrt(((0.0625 * t1) + (((0.09 * t2) - (0.0625 * t1)) * (tau - t1) / (t2 - t1))) / tau);
        Assert.StartsWith("2024-03-01,", lines[1], StringComparison.Ordinal);
        Assert.Equal(expected, double.Parse(lines[1].Split(',')[1], CultureInfo.InvariantCulture), 1e-9);
        Assert.StartsWith("2024-03-04,", lines[2], StringComparison.Ordinal);
        Assert.True(File.Exists(_temp.Combine("iv.diagnostics.csv")));
        Assert.Contains("wrote 2 dates", result.Stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void Implied_RejectedQuotesAndDates_AreCountedInDiagnostics()
    {
        var rows = GoodChain().ToList();
        rows.Add("2024-03-05,100,2024-03-25,95,put,1.0,0.03,0.01"); // a date with a single expiry: 30d lies beyond it
        rows.Add("2024-03-05,100,2024-03-25,105,call,1.0,0.03,0.01");
        rows.Add("2024-03-01,100,2024-03-21,100,put,0,0.03,0.01"); // zero price
        var quotes = WriteQuotes("quotes.csv", rows);
        var output = _temp.Combine("iv.csv");
        var result = CliRunner.Run("implied", "--quotes", quotes, "--tenor", "30d", "--out", output);

        Assert.Equal(0, result.ExitCode);
        Assert.Contains("1 dates have no value", result.Stderr, StringComparison.Ordinal);
        var diagnostics = File.ReadAllText(_temp.Combine("iv.diagnostics.csv"));
        Assert.Contains("date,tenor-after-last-expiry,rejected,2024-03-05", diagnostics, StringComparison.Ordinal);
        Assert.Contains("quote,non-positive-input,rejected,2024-03-01,2024-03-21,100,put,", diagnostics, StringComparison.Ordinal);
        Assert.Equal(3, File.ReadAllLines(output).Length);
    }

    [Fact]
    public void Implied_MissingColumn_ExitsThreeNamingLineAndColumn()
    {
        var quotes = WriteQuotes("quotes.csv", ["2024-03-01,100,2024-04-19,100,3.1,0.03,0.01"], "date,underlying,expiry,strike,price,rate,dividend_yield");
        var result = CliRunner.Run("implied", "--quotes", quotes, "--tenor", "30d", "--out", _temp.Combine("iv.csv"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("line 1", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("'type'", result.Stderr, StringComparison.Ordinal);
        AssertNoStackTrace(result);
    }

    [Fact]
    public void Implied_BadDate_ExitsThreeNamingLine()
    {
        var rows = GoodChain().Take(3).Append("01/03/2024,100,2024-04-19,100,call,3.1,0.03,0.01");
        var quotes = WriteQuotes("quotes.csv", rows);
        var result = CliRunner.Run("implied", "--quotes", quotes, "--tenor", "30d", "--out", _temp.Combine("iv.csv"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("line 5, column 'date'", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("'01/03/2024'", result.Stderr, StringComparison.Ordinal);
        AssertNoStackTrace(result);
    }

    [Fact]
    public void Implied_UnknownType_ExitsThreeNamingLine()
    {
        var quotes = WriteQuotes("quotes.csv", ["2024-03-01,100,2024-04-19,100,straddle,3.1,0.03,0.01"]);
        var result = CliRunner.Run("implied", "--quotes", quotes, "--tenor", "30d", "--out", _temp.Combine("iv.csv"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("line 2, column 'type'", result.Stderr, StringComparison.Ordinal);
        Assert.False(File.Exists(_temp.Combine("iv.csv")));
        AssertNoStackTrace(result);
    }

    [Fact]
    public void Implied_NoDateWithValue_ExitsThreeAndWritesOnlyDiagnostics()
    {
        var quotes = WriteQuotes("quotes.csv", ["2024-03-01,100,2024-04-19,100,call,3.1,0.03,0.01"]);
        var output = _temp.Combine("iv.csv");
        var result = CliRunner.Run("implied", "--quotes", quotes, "--tenor", "30d", "--out", output);
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("no date has a usable pair", result.Stderr, StringComparison.Ordinal);
        Assert.False(File.Exists(output));
        Assert.True(File.Exists(_temp.Combine("iv.diagnostics.csv")));
    }

    [Fact]
    public void Implied_ExistingOutput_RefusesWithoutForceAndReplacesWithIt()
    {
        var quotes = WriteQuotes("quotes.csv", GoodChain());
        var output = _temp.Combine("iv.csv");
        File.WriteAllText(output, "keep");
        var refused = CliRunner.Run("implied", "--quotes", quotes, "--tenor", "30d", "--out", output);
        Assert.Equal(2, refused.ExitCode);
        Assert.Contains("--force", refused.Stderr, StringComparison.Ordinal);
        Assert.Equal("keep", File.ReadAllText(output));
        var forced = CliRunner.Run("implied", "--quotes", quotes, "--tenor", "30d", "--out", output, "--force");
        Assert.Equal(0, forced.ExitCode);
        Assert.StartsWith("date,iv", File.ReadAllText(output), StringComparison.Ordinal);
    }

    [Fact]
    public void Implied_OutputIsInput_RefusesAndLeavesInputUnchanged()
    {
        var quotes = WriteQuotes("quotes.csv", GoodChain());
        var before = File.ReadAllText(quotes);
        var result = CliRunner.Run("implied", "--quotes", quotes, "--tenor", "30d", "--out", quotes, "--force");
        Assert.Equal(2, result.ExitCode);
        Assert.Equal(before, File.ReadAllText(quotes));
    }

    [Theory]
    [InlineData("thirty")] // not a number
    [InlineData("0d")] // zero days
    [InlineData("30w")] // weeks are not a tenor unit here
    public void Implied_BadTenor_ExitsTwo(string tenor)
    {
        var quotes = WriteQuotes("quotes.csv", GoodChain());
        var result = CliRunner.Run("implied", "--quotes", quotes, "--tenor", tenor, "--out", _temp.Combine("iv.csv"));
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("--tenor", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Implied_RateAsPercent_ExitsTwo()
    {
        var quotes = WriteQuotes("quotes.csv", GoodChain());
        var result = CliRunner.Run("implied", "--quotes", quotes, "--tenor", "30d", "--rate", "5", "--out", _temp.Combine("iv.csv"));
        Assert.Equal(2, result.ExitCode);
    }

    [Theory]
    [InlineData("--rate", "5")]
    [InlineData("--rate", "-1.5")]
    [InlineData("--dividend-yield", "3")]
    [InlineData("--dividend-yield", "NaN")]
    public void Implied_RateOrYieldOutOfRange_ExitsTwoSayingTheRangeAndTheUnit(string option, string value)
    {
        var quotes = WriteQuotes("quotes.csv", GoodChain());
        var output = _temp.Combine("iv.csv");
        List<string> args = ["implied", "--quotes", quotes, "--tenor", "30d", "--out", output, option, value];
        if (option != "--rate")
        {
            args.AddRange(["--rate", "0.05"]);
        }

        var result = CliRunner.Run([.. args]);

        Assert.Equal(2, result.ExitCode);
        Assert.Contains(option + " must be from -1 to 1 (continuous decimal a year)", result.Stderr, StringComparison.Ordinal);
        Assert.False(File.Exists(output));
    }

    [Fact]
    public void Implied_MissingRequiredOption_ExitsTwo()
    {
        var result = CliRunner.Run("implied", "--tenor", "30d");
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("--quotes", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Implied_Help_DescribesEveryOption()
    {
        var result = CliRunner.Run("implied", "--help");
        Assert.Equal(0, result.ExitCode);
        foreach (var option in new[] { "--quotes", "--tenor", "--rate", "--dividend-yield", "--extrapolation", "--out", "--force" })
        {
            var line = result.Stdout.Split('\n').FirstOrDefault(l => l.TrimStart().StartsWith(option, StringComparison.Ordinal));
            Assert.True(line is not null && line.Trim().Length > option.Length + 10, $"no help text for {option}:\n{result.Stdout}");
        }
    }

    [Fact]
    public void Implied_BuiltExecutable_WritesDefaultOutputInWorkingFolder()
    {
        var quotes = WriteQuotes("quotes.csv", GoodChain());
        var result = CliRunner.RunProcess(_temp.Path, "implied", "--quotes", quotes, "--tenor", "30d");
        Assert.True(result.ExitCode == 0, result.Stderr);
        Assert.True(File.Exists(_temp.Combine("implied-30d.csv")));
        Assert.True(File.Exists(_temp.Combine("implied-30d.diagnostics.csv")));
    }

    [Fact]
    public void Implied_BuiltExecutableBadFile_ExitsThreeWithoutStackTrace()
    {
        var quotes = WriteQuotes("quotes.csv", ["2024-03-01,100,2024-04-19,100,call,abc,0.03,0.01"]);
        var result = CliRunner.RunProcess(_temp.Path, "implied", "--quotes", quotes, "--tenor", "30d");
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("line 2, column 'price'", result.Stderr, StringComparison.Ordinal);
        AssertNoStackTrace(result);
    }

    private static void AssertNoStackTrace(CliResult result)
    {
        Assert.DoesNotContain("   at ", result.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("Exception", result.Stderr, StringComparison.Ordinal);
    }

    private static IEnumerable<string> GoodChain()
    {
        foreach (var date in new[] { new DateOnly(2024, 3, 1), new DateOnly(2024, 3, 4) })
        {
            foreach (var (days, vol) in new[] { (20, 0.25), (50, 0.30) })
            {
                var expiry = date.AddDays(days);
                for (var strike = 85.0; strike <= 115; strike += 5)
                {
                    foreach (var type in new[] { OptionType.Call, OptionType.Put })
                    {
                        var price = BlackScholesMerton.Price(type, 100, strike, days / 365.0, vol, 0.03, 0.01);
                        yield return string.Create(CultureInfo.InvariantCulture,
                            $"{date:yyyy-MM-dd},100,{expiry:yyyy-MM-dd},{strike},{(type == OptionType.Call ? "call" : "P")},{price:R},0.03,0.01");
                    }
                }
            }
        }
    }

    private string WriteQuotes(string name, IEnumerable<string> rows, string header = Header)
    {
        var path = _temp.Combine(name);
        var text = new StringBuilder(header).Append('\n');
        foreach (var row in rows)
        {
            text.Append(row).Append('\n');
        }

        File.WriteAllText(path, text.ToString());
        return path;
    }
}
