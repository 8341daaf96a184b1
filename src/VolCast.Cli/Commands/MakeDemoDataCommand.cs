using System.CommandLine;
using VolCast.Core.Demo;
using VolCast.IO;
using VolCast.IO.Quotes;
using VolCast.IO.Writers;

namespace VolCast.Cli.Commands;

/// <summary><c>volcast make-demo-data</c>: regenerates the invented demo scenario bit for bit from its seed.</summary>
internal static class MakeDemoDataCommand
{
    /// <summary>The seed of the committed demo data.</summary>
    public const int DefaultSeed = 20261201;

    /// <summary>How many of the last implied dates get an option chain (a small file, enough to try <c>volcast implied</c>).</summary>
    private const int QuoteDays = 60;

    /// <summary>Builds the command.</summary>
    public static Command Create(CliConsole console)
    {
        var output = new Option<DirectoryInfo>("--out") { Description = "Folder to write the demo files into.", DefaultValueFactory = _ => new DirectoryInfo("data-demo") };
        var seed = new Option<int>("--seed") { Description = "Random seed of the scenario.", DefaultValueFactory = _ => DefaultSeed };
        var force = new Option<bool>("--force") { Description = "Replace demo files that already exist in the folder." };
        var command = new Command("make-demo-data", "Regenerate the invented demo scenario (index prices, implied volatility, option quotes, a close-only second asset) from its seed.")
        {
            output, seed, force,
        };
        command.SetAction(parse => console.Execute(() =>
        {
            var folder = parse.GetValue(output)!.FullName;
            var overwrite = parse.GetValue(force);
            var scenario = new DemoScenarioGenerator(parse.GetValue(seed)).Generate();
            AtomicFile.WriteText(Path.Combine(folder, DemoFiles.Index), w => HistoryCsv.WritePrices(w, scenario.Index), overwrite);
            AtomicFile.WriteText(Path.Combine(folder, DemoFiles.Implied), w => HistoryCsv.WriteSeries(w, "iv", scenario.Implied.Dates, scenario.Implied.Volatility), overwrite);
            AtomicFile.WriteText(Path.Combine(folder, DemoFiles.ExpectedVolatility), w => HistoryCsv.WriteSeries(w, "expected_vol", scenario.Index.Dates, scenario.ExpectedVolatility.ToArray()), overwrite);
            AtomicFile.WriteText(Path.Combine(folder, DemoFiles.SecondAsset), w => HistoryCsv.WritePrices(w, scenario.SecondAsset), overwrite);
            var quotes = DemoOptionChain.Build(scenario.Index, scenario.Implied, QuoteDays);
            AtomicFile.WriteText(Path.Combine(folder, DemoFiles.OptionQuotes), w => OptionQuoteCsvWriter.Write(w, quotes), overwrite);
            console.Out.WriteLine($"wrote {scenario.Index.Count} trading days of the demo scenario to {folder}");
            return ExitCodes.Success;
        }));
        return command;
    }
}
