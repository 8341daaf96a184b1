using VolCast.Core.Demo;
using VolCast.IO;
using VolCast.IO.Csv;
using VolCast.IO.Quotes;

namespace VolCast.Cli.Commands;

/// <summary>The demo scenario's files in data-demo/: their names, the demo configuration, and how they are regenerated bit for bit.</summary>
internal static class DemoFiles
{
    /// <summary>The seed of the committed demo index scenario.</summary>
    public const int Seed = 20261201;

    /// <summary>The seed of the committed demo universe.</summary>
    public const int UniverseSeed = 20261202;

    /// <summary>Daily OHLC of the invented index.</summary>
    public const string Index = "alder-ridge.csv";

    /// <summary>The index's 30-calendar-day implied volatility (decimal).</summary>
    public const string Implied = "alder-ridge-implied-30d.csv";

    /// <summary>The scenario's true expected 30-day volatility (what implied is built on), for checking the tool.</summary>
    public const string ExpectedVolatility = "alder-ridge-expected-vol-30d.csv";

    /// <summary>Option quotes on the index for the last 60 implied dates, for <c>volcast implied</c>.</summary>
    public const string OptionQuotes = "alder-ridge-option-quotes.csv";

    /// <summary>Close-only history of the second invented asset.</summary>
    public const string SecondAsset = "birch-point-closes.csv";

    /// <summary>The configuration <c>volcast demo</c> runs, a complete example of every setting.</summary>
    public const string Config = "demo-config.json";

    /// <summary>The universe's price folder, one <c>NAME.csv</c> per invented asset.</summary>
    public const string UniversePrices = "universe/prices";

    /// <summary>The universe's implied folder, one <c>NAME.csv</c> (date, iv) per invented asset.</summary>
    public const string UniverseImplied = "universe/implied";

    /// <summary>How many of the last implied dates get an option chain (a small file, enough to try <c>volcast implied</c>).</summary>
    private const int QuoteDays = 60;

    /// <summary>
    /// The demo configuration: every forecaster (short and long windows, each range estimator, EWMA, GARCH, GJR-GARCH,
    /// HAR), the lookback sweep with its adaptive choice, the model confidence set, the rule test, and the head to
    /// head of the baseline a desk might use today (Yang-Zhang over 21 days) against a candidate that models
    /// clustering (GARCH). The horizon is the implied tenor, 30 calendar days, so forecasts and implied cover the same window.
    /// </summary>
    public const string ConfigJson = """
        {
          "forecasters": [
            "close-to-close:5",
            "close-to-close:10",
            "close-to-close:21",
            "close-to-close:63",
            "parkinson:21",
            "garman-klass:21",
            "rogers-satchell:21",
            "yang-zhang:21",
            "ewma:0.94",
            "garch",
            "gjr-garch",
            "har"
          ],
          "tenor": "30d",
          "sweep": true,
          "sweepEstimators": ["close-to-close", "parkinson", "garman-klass", "rogers-satchell", "yang-zhang"],
          "sweepLookbacks": [5, 10, 15, 21, 42, 63, 126, 252],
          "ewmaLambdas": [0.90, 0.91, 0.92, 0.93, 0.94, 0.95, 0.96, 0.97, 0.98, 0.99],
          "selectionWindowDays": 504,
          "mcs": { "replications": 1000, "alpha": 0.10, "seed": 20240601 },
          "ruleThreshold": 0.02,
          "ruleForecaster": "garch",
          "ruleHistorical": "close-to-close:21",
          "baseline": "yang-zhang:21",
          "candidate": "garch",
          "annualizationFactor": 252,
          "target": "squared-returns"
        }

        """;

    /// <summary>Every file the regeneration writes, relative to the data folder, with '/' separators.</summary>
    public static IReadOnlyList<string> GeneratedFiles { get; } =
    [
        Index, Implied, ExpectedVolatility, SecondAsset, OptionQuotes, Config,
        .. DemoUniverse.Names.Select(n => $"{UniversePrices}/{n}.csv"),
        .. DemoUniverse.Names.Select(n => $"{UniverseImplied}/{n}.csv"),
    ];

    /// <summary>
    /// Writes every demo file into <paramref name="folder"/>, replacing those that exist; the same seeds give the same bytes.
    /// The files are one set: each is written in full to a temporary sibling first, and only then are all moved into place
    /// (a second Ctrl-C waits for the moves), so the folder never holds part of an earlier set and part of this one.
    /// </summary>
    /// <param name="folder">The demo data folder.</param>
    /// <param name="cancellationToken">Checked before each file is written: a stop before the moves leaves every file as it was.</param>
    /// <returns>How many trading days the index has.</returns>
    /// <exception cref="OperationCanceledException">The token was cancelled before the files were moved into place; none was replaced.</exception>
    public static int Regenerate(string folder, CancellationToken cancellationToken = default)
    {
        foreach (var relative in GeneratedFiles)
        {
            // What a killed regeneration left beside the files.
            AtomicFile.RemoveStaleTemporaries(Path.Combine(folder, relative.Replace('/', Path.DirectorySeparatorChar)));
        }

        using var files = new AtomicFileSet();
        void Text(string relative, Action<TextWriter> write)
        {
            cancellationToken.ThrowIfCancellationRequested();
            files.AddText(Path.Combine(folder, relative.Replace('/', Path.DirectorySeparatorChar)), write, overwrite: true);
        }

        var scenario = new DemoScenarioGenerator(Seed).Generate();
        Text(Index, w => HistoryCsv.WritePrices(w, scenario.Index));
        Text(Implied, w => HistoryCsv.WriteSeries(w, "iv", scenario.Implied.Dates, scenario.Implied.Volatility));
        Text(ExpectedVolatility, w => HistoryCsv.WriteSeries(w, "expected_vol", scenario.Index.Dates, scenario.ExpectedVolatility.ToArray()));
        Text(SecondAsset, w => HistoryCsv.WritePrices(w, scenario.SecondAsset));
        var quotes = DemoOptionChain.Build(scenario.Index, scenario.Implied, QuoteDays);
        Text(OptionQuotes, w => OptionQuotesCsv.Write(w, quotes));
        Text(Config, w => w.Write(ConfigJson.ReplaceLineEndings("\n")));
        foreach (var asset in DemoUniverse.Generate(UniverseSeed))
        {
            Text($"{UniversePrices}/{asset.Name}.csv", w => HistoryCsv.WritePrices(w, asset.Prices));
            Text($"{UniverseImplied}/{asset.Name}.csv", w => HistoryCsv.WriteSeries(w, "iv", asset.Implied.Dates, asset.Implied.Volatility));
        }

        cancellationToken.ThrowIfCancellationRequested();
        Interruption.Process.Uninterrupted(files.Commit);
        return scenario.Index.Count;
    }
}
