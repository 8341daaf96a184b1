using System.Text;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace VolCast.IO.Tests;

// Mutation fuzzing of the readers: whatever is done to a valid file, a read either succeeds with
// finite, positive, consistent numbers or throws InputDataException; no other exception type escapes.
public sealed class ReaderFuzzTests
{
    private const string ValidOhlc =
        "Date,Open,High,Low,Close,Adj Close,Volume\r\n" +
        "2024-01-02,100,101,99,100.5,50.25,1000\r\n" +
        "2024-01-03,100.5,102,100,101,50.5,1200\r\n" +
        "2024-01-04,101,103,100.5,102,51,900\r\n" +
        "2024-01-05,102,102.5,101,101.5,50.75,\r\n" +
        "2024-01-08,101.5,104,101.5,104,52,1500\r\n" +
        "2024-01-09,104,104,103,103,51.5,1100\r\n";

    private const string ValidClose = "date,close\n2024-01-02,100\n2024-01-03,101\n2024-01-04,99.5\n2024-01-05,1e2\n";

    private const string ValidImplied = "date,iv,tenor\n2024-01-02,20.5,30d\n2024-01-03,21,30d\n2024-01-04,19.75,30d\n";

    private static string[] Tokens { get; } =
    [
        "", " ", "NaN", "-NaN", "Infinity", "-Infinity", "∞", "1e308", "1e309", "-1e308", "4.9e-324", "-0", "0", "+5",
        "5e", "1,5", "\"", "\"\"", "\"1\"", "0x10", "١٢٣", "2024-13-01", "2024-02-30", "0001-01-01", "9999-12-31",
        "2024-01-02", "99999999999999999999", "1e15", "-1", "\0", "\t", "\r", "\n", ";", "é", "\uD800", "\uFEFF", "500", "0.0001",
    ];

    private static char[] Chars { get; } =
        ['"', ',', ';', '\n', '\r', '\0', '\t', ' ', 'e', 'E', '-', '+', '.', '0', '9', 'x', 'N', '\uFFFD', '\uFEFF', '\uD800', 'é', '∞'];

    /// <summary>A list of mutation seeds; each seed picks one mutation and its positions.</summary>
    private static Arbitrary<int[]> Mutations() =>
        Gen.Choose(0, int.MaxValue).ArrayOf().Select(a => a.Length > 12 ? a[..12] : a).ToArbitrary();

    [Property(MaxTest = 3000)]
    public Property PriceText_RandomMutations_SucceedFinitelyOrThrowInputDataException() =>
        Prop.ForAll(Mutations(), Gen.Elements(ValidOhlc, ValidClose).ToArbitrary(), (seeds, valid) =>
        {
            var text = Mutate(valid, seeds);
            return FuzzOutcome.SucceedsOrRefusesCleanly(() => CheckPrices(PriceFileReader.Read(new StringReader(text), "fuzz.csv")));
        });

    [Property(MaxTest = 1000)]
    public Property PriceBytes_RandomByteMutations_SucceedFinitelyOrThrowInputDataException() =>
        Prop.ForAll(Mutations(), seeds =>
        {
            var bytes = MutateBytes(Encoding.UTF8.GetBytes(ValidOhlc), seeds);
            return FuzzOutcome.SucceedsOrRefusesCleanly(() => CheckPrices(PriceFileReader.ReadBytes(bytes, "fuzz.csv")));
        });

    [Property(MaxTest = 1500)]
    public Property ImpliedText_RandomMutations_SucceedFinitelyOrThrowInputDataException() =>
        Prop.ForAll(Mutations(), Gen.Elements(ImpliedUnit.Infer, ImpliedUnit.Percent, ImpliedUnit.Decimal).ToArbitrary(), (seeds, unit) =>
        {
            var text = Mutate(ValidImplied, seeds);
            return FuzzOutcome.SucceedsOrRefusesCleanly(() =>
            {
                var load = ImpliedFileReader.Read(new StringReader(text), "fuzz.csv", unit);
                var v = load.Series.Volatility;
                for (var i = 0; i < v.Length; i++)
                {
                    Assert.True(double.IsFinite(v[i]) && v[i] > 0 && v[i] <= 5.0, $"iv[{i}] = {v[i]}");
                }

                Assert.NotEqual(ImpliedUnit.Infer, load.UnitUsed);
            });
        });

    [Fact]
    public void Mutate_NoSeeds_LeavesTheValidFilesReadable()
    {
        // Guards the fuzz tests themselves: the unmutated inputs load.
        Assert.Equal(6, PriceFileReader.Read(new StringReader(Mutate(ValidOhlc, [])), "v.csv").RowsRead);
        Assert.Equal(4, PriceFileReader.Read(new StringReader(ValidClose), "v.csv").RowsRead);
        Assert.Equal(3, ImpliedFileReader.Read(new StringReader(ValidImplied), "v.csv").Series.Count);
    }

    private static void CheckPrices(PriceLoad load)
    {
        var h = load.History;
        Assert.True(h.Count >= 1);
        for (var i = 0; i < h.Count; i++)
        {
            var c = h.Close[i];
            Assert.True(double.IsFinite(c) && c > 0, $"close[{i}] = {c}");
            if (h.HasRange)
            {
                double o = h.Open[i], hi = h.High[i], lo = h.Low[i];
                Assert.True(double.IsFinite(o) && double.IsFinite(hi) && double.IsFinite(lo) && lo > 0, $"bar {i}");
                Assert.True(lo <= Math.Min(o, c) && hi >= Math.Max(o, c), $"bar {i} inconsistent");
            }
        }
    }

    internal static string Mutate(string valid, int[] seeds)
    {
        var lines = valid.Split('\n').ToList();
        foreach (var seed in seeds)
        {
            var rng = new Random(seed);
            var li = rng.Next(lines.Count);
            var cells = lines[li].Split(',').ToList();
            switch (rng.Next(9))
            {
                case 0: // drop a cell
                    cells.RemoveAt(rng.Next(cells.Count));
                    lines[li] = string.Join(',', cells);
                    break;
                case 1: // swap two columns on every line (header included, or not)
                    {
                        int a = rng.Next(8), b = rng.Next(8);
                        var skipHeader = rng.Next(2) == 0;
                        for (var k = skipHeader ? 1 : 0; k < lines.Count; k++)
                        {
                            var cs = lines[k].Split(',');
                            if (a < cs.Length && b < cs.Length)
                            {
                                (cs[a], cs[b]) = (cs[b], cs[a]);
                                lines[k] = string.Join(',', cs);
                            }
                        }

                        break;
                    }

                case 2: // insert a character
                    lines[li] = lines[li].Insert(rng.Next(lines[li].Length + 1), Chars[rng.Next(Chars.Length)].ToString());
                    break;
                case 3: // replace a character
                    if (lines[li].Length > 0)
                    {
                        var p = rng.Next(lines[li].Length);
                        lines[li] = lines[li][..p] + Chars[rng.Next(Chars.Length)] + lines[li][(p + 1)..];
                    }

                    break;
                case 4: // truncate a line
                    lines[li] = lines[li][..rng.Next(lines[li].Length + 1)];
                    break;
                case 5: // delete a line
                    lines.RemoveAt(li);
                    if (lines.Count == 0)
                    {
                        lines.Add(string.Empty);
                    }

                    break;
                case 6: // duplicate a line elsewhere
                    lines.Insert(rng.Next(lines.Count + 1), lines[li]);
                    break;
                case 7: // swap two lines
                    {
                        var lj = rng.Next(lines.Count);
                        (lines[li], lines[lj]) = (lines[lj], lines[li]);
                        break;
                    }

                default: // replace a cell with a nasty token
                    cells[rng.Next(cells.Count)] = Tokens[rng.Next(Tokens.Length)];
                    lines[li] = string.Join(',', cells);
                    break;
            }
        }

        return string.Join('\n', lines);
    }

    private static byte[] MutateBytes(byte[] valid, int[] seeds)
    {
        var bytes = valid.ToList();
        foreach (var seed in seeds)
        {
            var rng = new Random(seed);
            var p = rng.Next(bytes.Count + 1);
            switch (rng.Next(4))
            {
                case 0:
                    bytes.Insert(p, (byte)rng.Next(256));
                    break;
                case 1 when p < bytes.Count:
                    bytes[p] = (byte)rng.Next(256);
                    break;
                case 2 when p < bytes.Count:
                    bytes.RemoveAt(p);
                    break;
                default:
                    bytes.RemoveRange(p, bytes.Count - p); // truncate the file
                    break;
            }
        }

        return [.. bytes];
    }
}
