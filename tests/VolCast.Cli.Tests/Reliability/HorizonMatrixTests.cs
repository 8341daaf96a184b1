using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Reliability;

// Every horizon and tenor a user may ask for, with and without implied, with the default forecasters and with a short
// list that does not hold the rule test's historical estimate (close-to-close over the horizon): each run either
// completes with a report or refuses with a usage or data message. Exit 1 (an unexpected failure) is the defect this
// pins: the report once looked the historical estimate up among the forecasts and failed after all the computing.
public sealed class HorizonMatrixTests : IClassFixture<HorizonMatrixTests.Inputs>
{
    private readonly Inputs _inputs;

    public HorizonMatrixTests(Inputs inputs) => _inputs = inputs;

    public static TheoryData<string, string, bool, bool> Cells()
    {
        var data = new TheoryData<string, string, bool, bool>();
        string[] horizons = ["1", "2", "5", "10", "15", "21", "42", "63", "126", "252"];
        string[] tenors = ["7d", "14d", "30d", "60d", "91d", "182d", "365d"];
        foreach (var (option, values) in new[] { ("--horizon", horizons), ("--tenor", tenors) })
        {
            foreach (var value in values)
            {
                foreach (var withImplied in new[] { true, false })
                {
                    foreach (var shortList in new[] { false, true })
                    {
                        data.Add(option, value, withImplied, shortList);
                    }
                }
            }
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(Cells))]
    public void Backtest_AnyHorizonOrTenor_CompletesWithAReportOrRefusesClearly(string option, string value, bool withImplied, bool shortList)
    {
        var folder = Path.Combine(_inputs.Folder, $"out-{option.TrimStart('-')}-{value}-{(withImplied ? "iv" : "noiv")}-{(shortList ? "short" : "default")}");
        var args = new List<string> { "backtest", "--prices", _inputs.Prices, option, value, "--out", folder };
        if (withImplied)
        {
            args.AddRange(["--implied", _inputs.Implied, "--iv-unit", "decimal"]);
        }

        if (shortList)
        {
            args.AddRange(["--config", _inputs.ShortList]);
        }

        var result = CliRunner.Run([.. args]);

        Assert.True(result.ExitCode is 0 or 2 or 3, $"exit {result.ExitCode}: {result.Stderr}");
        if (result.ExitCode == 0)
        {
            Assert.True(File.Exists(Path.Combine(folder, "report.html")), "exit 0 without report.html");
        }
        else
        {
            Assert.False(string.IsNullOrWhiteSpace(result.Stderr), "a refusal must say why");
            Assert.DoesNotContain("   at ", result.Stderr, StringComparison.Ordinal);
        }
    }

    /// <summary>One seeded history of 700 weekdays (about 2.8 years), an implied series over the same dates, and a short forecaster list.</summary>
    public sealed class Inputs : IDisposable
    {
        public Inputs()
        {
            Folder = Directory.CreateTempSubdirectory("volcast-horizons-").FullName;
            Prices = ReliabilityFiles.Prices(Folder, "prices.csv", 700, seed: 15);
            Implied = ReliabilityFiles.Implied(Folder, "implied.csv", new DateOnly(1990, 1, 1), 700);
            ShortList = Path.Combine(Folder, "short.json");
            File.WriteAllText(ShortList, "{ \"forecasters\": [\"ewma:0.94\", \"yang-zhang:10\"] }");
        }

        public string Folder { get; }

        public string Prices { get; }

        public string Implied { get; }

        public string ShortList { get; }

        public void Dispose() => Directory.Delete(Folder, recursive: true);
    }
}
