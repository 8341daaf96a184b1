using System.Text;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using VolCast.Core.Options;
using VolCast.IO.Config;
using VolCast.IO.Quotes;

namespace VolCast.IO.Tests;

// Mutation fuzzing of the option-quotes and configuration readers: whatever is done to a valid file, a
// read either succeeds with usable values or throws InputDataException naming the file; nothing else escapes.
public sealed class QuoteAndConfigFuzzTests
{
    private const string ValidQuotes =
        "date,underlying,expiry,strike,type,price,rate,dividend_yield\n" +
        "2024-03-01,100,2024-03-22,95,put,0.62,0.05,0.01\n" +
        "2024-03-01,100,2024-03-22,100,call,2.35,0.05,0.01\n" +
        "2024-03-01,100,2024-03-22,100,put,2.12,0.05,0.01\n" +
        "2024-03-01,100,2024-04-19,100,call,4.12,0.05,0.01\n" +
        "2024-03-01,100,2024-04-19,100,put,3.71,0.05,0.01\n" +
        "2024-03-04,101,2024-03-22,100,c,2.9,0.05,0.01\n" +
        "2024-03-04,101,2024-04-19,100,P,3.3,,\n";

    private const string ValidConfig =
        "{\n" +
        "  \"forecasters\": [\"yang-zhang:21\", \"ewma:0.94\", \"garch\", \"har\"],\n" +
        "  \"horizon\": 21,\n" +
        "  \"start\": \"2015-01-02\",\n" +
        "  \"sweep\": true,\n" +
        "  \"sweepLookbacks\": [5, 10, 21],\n" +
        "  \"ewmaLambdas\": [0.94, 0.97],\n" +
        "  \"selectionWindowDays\": 252,\n" +
        "  \"mcs\": { \"replications\": 500, \"alpha\": 0.1, \"blockLength\": 21, \"seed\": 1 },\n" +
        "  \"ruleThreshold\": 0.02,\n" +
        "  \"baseline\": \"implied\",\n" +
        "  \"candidate\": \"garch\",\n" +
        "  \"annualizationFactor\": 252,\n" +
        "  \"target\": \"squared-returns\" // comments are allowed\n" +
        "}\n";

    private static string[] JsonTokens { get; } =
    [
        "null", "true", "false", "0", "-1", "1e308", "1e309", "NaN", "\"NaN\"", "Infinity", "-0", "0.5", "2147483648", "\"\"",
        "\"30d\"", "\"0d\"", "\"garch:x\"", "\"ewma:1\"", "\"ewma:0\"", "\"har:\"", "\"adaptive:ewma\"", "[]", "{}", "[1,2", "{\"a\":",
        "\"2024-02-30\"", "\"9999-12-31\"", "\"\\u0000\"", "\"\\uD800\"", "\"é\"", "\"implied\"", "\"yang-zhang:1\"", "\"yang-zhang:100000\"",
    ];

    private static char[] JsonChars { get; } = ['{', '}', '[', ']', ',', ':', '"', '\\', '/', '*', '-', '.', 'e', '0', '9', ' ', '\n', '\0', '\uD800', '\uFEFF'];

    private static Arbitrary<int[]> Mutations() =>
        Gen.Choose(0, int.MaxValue).ArrayOf().Select(a => a.Length > 12 ? a[..12] : a).ToArbitrary();

    [Property(MaxTest = 2000)]
    public Property QuotesText_RandomMutations_SucceedUsablyOrThrowInputDataException() =>
        Prop.ForAll(Mutations(), Gen.Elements<double?>(null, 0.03).ToArbitrary(), (seeds, defaultRate) =>
        {
            var text = ReaderFuzzTests.Mutate(ValidQuotes, seeds);
            return FuzzOutcome.SucceedsOrRefusesCleanly(() =>
            {
                var quotes = OptionQuoteCsvReader.Read(new StringReader(text), "fuzz.csv", defaultRate);
                foreach (var q in quotes)
                {
                    Assert.True(double.IsFinite(q.Underlying) && q.Underlying > 0, $"underlying {q.Underlying}");
                    Assert.True(double.IsFinite(q.Strike) && q.Strike > 0, $"strike {q.Strike}");
                    Assert.True(double.IsFinite(q.Price), $"price {q.Price}");
                    Assert.InRange(q.Rate, -1, 1);
                    Assert.InRange(q.DividendYield, -1, 1);
                    Assert.True(q.SourceLine >= 2, $"line {q.SourceLine}");
                }

                // Whatever was read, the constant-tenor step rejects with a diagnostic rather than throwing or giving NaN.
                foreach (var point in ConstantTenorSeries.Compute(quotes, new ConstantTenorOptions(30, TenorExtrapolation.FlatVolatility)).Points)
                {
                    Assert.True(double.IsFinite(point.Volatility) && point.Volatility > 0, $"iv {point.Volatility} on {point.Date}");
                }
            });
        });

    [Property(MaxTest = 2000)]
    public Property ConfigText_RandomMutations_SucceedValidOrThrowInputDataException() =>
        Prop.ForAll(Mutations(), seeds =>
        {
            var text = MutateJson(ValidConfig, seeds);
            return FuzzOutcome.SucceedsOrRefusesCleanly(() =>
            {
                var settings = BacktestConfigFile.Parse(text, "fuzz.csv");
                settings.Validate(); // what the reader returns is always a valid configuration
                Assert.True(double.IsFinite(settings.RuleThreshold) && double.IsFinite(settings.McsAlpha) && double.IsFinite(settings.AnnualizationFactor));
                Assert.All(settings.EwmaLambdas, l => Assert.True(double.IsFinite(l)));
            });
        });

    [Fact]
    public void Mutate_NoSeeds_LeavesTheValidFilesReadable()
    {
        // Guards the fuzz tests themselves: the unmutated inputs load.
        Assert.Equal(7, OptionQuoteCsvReader.Read(new StringReader(ValidQuotes), "v.csv", 0.03).Count);
        Assert.Equal(21, BacktestConfigFile.Parse(MutateJson(ValidConfig, []), "v.json").Horizon.TradingDays);
    }

    [Fact]
    public void Read_QuoteLeftOpen_NamesTheLineWhereTheRecordStarts()
    {
        // The open quote on line 3 swallows the lines after it: the error must point at line 3, not at the last line read.
        var text = "date,underlying,expiry,strike,type,price,rate\n" +
                   "2024-03-01,100,2024-03-22,100,call,2.35,0.05\n" +
                   "2024-03-01,100,\"2024-04-19,100,call,4.12,0.05\n" +
                   "2024-03-04,101,2024-03-22,100,call,2.9,0.05\n" +
                   "2024-03-04,101,2024-04-19,100,call,4.3,0.05\n";

        var error = Assert.Throws<InputDataException>(() => OptionQuoteCsvReader.Read(new StringReader(text), "q.csv", null));

        Assert.Equal(3, error.Line);
        Assert.Equal("expiry", error.Column);
        Assert.Contains("malformed quoting", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_QuotedCellsAndBlankLines_KeepPhysicalLineNumbers()
    {
        // Whole-quoted cells are fine; blank lines are skipped but still counted, so line 4 stays line 4.
        var text = "date,underlying,expiry,strike,type,price,rate\n" +
                   "\"2024-03-01\",100,2024-03-22,100,\"call\",2.35,0.05\n" +
                   "\n" +
                   "2024-03-01,100,2024-04-19,100,call,oops,0.05\n";

        var error = Assert.Throws<InputDataException>(() => OptionQuoteCsvReader.Read(new StringReader(text), "q.csv", null));

        Assert.Equal(4, error.Line);
        Assert.Equal("price", error.Column);
    }

    private static string MutateJson(string valid, int[] seeds)
    {
        var text = new StringBuilder(valid);
        foreach (var seed in seeds)
        {
            var rng = new Random(seed);
            var p = rng.Next(text.Length + 1);
            switch (rng.Next(6))
            {
                case 0: // insert a structural or odd character
                    text.Insert(p, JsonChars[rng.Next(JsonChars.Length)]);
                    break;
                case 1 when p < text.Length: // replace a character
                    text[p] = JsonChars[rng.Next(JsonChars.Length)];
                    break;
                case 2 when p < text.Length: // delete a run of characters
                    text.Remove(p, Math.Min(text.Length - p, 1 + rng.Next(8)));
                    break;
                case 3: // truncate
                    text.Length = p;
                    break;
                default: // replace the value after a colon or inside a list with a nasty token
                    {
                        var s = text.ToString();
                        var at = s.IndexOfAny([':', '[', ','], Math.Min(p, s.Length));
                        if (at >= 0)
                        {
                            var end = s.IndexOfAny([',', '}', ']', '\n'], at + 1);
                            end = end < 0 ? s.Length : end;
                            text.Remove(at + 1, end - at - 1).Insert(at + 1, " " + JsonTokens[rng.Next(JsonTokens.Length)]);
                        }

                        break;
                    }
            }
        }

        return text.ToString();
    }
}
