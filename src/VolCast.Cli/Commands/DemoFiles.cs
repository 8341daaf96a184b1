namespace VolCast.Cli.Commands;

/// <summary>The names of the demo scenario's files in data-demo/.</summary>
internal static class DemoFiles
{
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
}
