using System.Globalization;
using System.Text;
using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Commands;

public sealed class ConeCommandTests : IDisposable
{
    private readonly TempFolder _temp = new("cone");

    public void Dispose() => _temp.Dispose();

    private (string Path, double[] Closes) WriteCloses(string name, int count, int seed)
    {
        var random = new Random(seed);
        var closes = new double[count];
        var price = 100.0;
        var text = new StringBuilder("date,close\n");
        var dates = Weekdays.From(new DateOnly(2015, 1, 5), count);
        for (var i = 0; i < count; i++)
        {
            price *= Math.Exp(0.015 * ((random.NextDouble() * 2) - 1));
            closes[i] = Math.Round(price, 4);
            text.Append(CultureInfo.InvariantCulture, $"{dates[i]:yyyy-MM-dd},{closes[i]:0.####}\n");
        }

        var path = _temp.Combine(name);
        File.WriteAllText(path, text.ToString());
        return (path, closes);
    }

    [Fact]
    public void Cone_LongHistory_WritesPngAndCsvWithTheDirectMedian()
    {
        var (prices, closes) = WriteCloses("prices.csv", 900, 1);
        var output = _temp.Combine("out");

        var result = CliRunner.Run("cone", "--prices", prices, "--out", output);

        Assert.Equal(0, result.ExitCode);
        var png = File.ReadAllBytes(Path.Combine(output, "cone.png"));
        Assert.Equal([0x89, 0x50, 0x4E, 0x47], png[..4]);
        var lines = File.ReadAllLines(Path.Combine(output, "cone.csv"));
        Assert.StartsWith("horizon_days,windows,ht_variance_factor,min,p10,p25,median", lines[0], StringComparison.Ordinal);
        Assert.Equal(8, lines.Length); // 899 returns cover all seven default horizons (252 needs 755).

        // The 5-day median worked out here from the closes: zero-mean annualized vol of every 5-return window,
        // type 7 median of the 895 windows = the 448th smallest.
        var vols = new List<double>();
        for (var s = 1; s + 4 < closes.Length; s++)
        {
            var sum = 0.0;
            for (var k = s; k < s + 5; k++)
            {
                var r = Math.Log(closes[k] / closes[k - 1]);
                sum += r * r;
            }

            vols.Add(Math.Sqrt(252.0 / 5 * sum));
        }

        vols.Sort();
        var row = lines[1].Split(',');
        Assert.Equal("5", row[0]);
        Assert.Equal(vols.Count.ToString(CultureInfo.InvariantCulture), row[1]);
        Assert.Equal(vols[vols.Count / 2], double.Parse(row[6], CultureInfo.InvariantCulture), 12);
    }

    [Fact]
    public void Cone_ExistingOutput_RefusedWithoutForceAndReplacedWithIt()
    {
        var (prices, _) = WriteCloses("prices.csv", 400, 2);
        var output = _temp.Combine("out");

        var first = CliRunner.Run("cone", "--prices", prices, "--out", output);
        var second = CliRunner.Run("cone", "--prices", prices, "--out", output);
        var forced = CliRunner.Run("cone", "--prices", prices, "--out", output, "--force");

        Assert.Equal(0, first.ExitCode);
        Assert.Equal(3, second.ExitCode);
        Assert.Contains("--force", second.Stderr, StringComparison.Ordinal);
        Assert.Equal(0, forced.ExitCode);
    }

    [Fact]
    public void Cone_ShortHistory_WarnsAboutTheHorizonsLeftOut()
    {
        var (prices, _) = WriteCloses("prices.csv", 200, 3);

        var result = CliRunner.Run("cone", "--prices", prices, "--out", _temp.Combine("out"));

        Assert.Equal(0, result.ExitCode);
        Assert.Contains("the 126-day horizon needs at least 377 daily returns", result.Stderr, StringComparison.Ordinal);
        Assert.Equal(6, File.ReadAllLines(_temp.Combine("out", "cone.csv")).Length); // header + 5, 10, 21, 42, 63 (63 needs 188 of the 199 returns)
    }

    [Fact]
    public void Cone_TooShortForAnyHorizon_ExitsThreeNamingTheFile()
    {
        var (prices, _) = WriteCloses("short.csv", 10, 4);

        var result = CliRunner.Run("cone", "--prices", prices, "--out", _temp.Combine("out"));

        Assert.Equal(3, result.ExitCode);
        Assert.Contains("short.csv", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("needs at least 14", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Cone_WithImplied_Succeeds()
    {
        var (prices, _) = WriteCloses("prices.csv", 400, 5);
        var impliedPath = _temp.Combine("implied.csv");
        File.WriteAllText(impliedPath, "date,iv\n2015-01-05,0.2\n2015-01-06,0.25\n");

        var result = CliRunner.Run("cone", "--prices", prices, "--implied", impliedPath, "--out", _temp.Combine("out"));

        Assert.Equal(0, result.ExitCode);
        Assert.True(File.Exists(_temp.Combine("out", "cone.png")));
    }

    [Fact]
    public void Cone_ImpliedTenor30d_DrawsImpliedWhereImpliedHorizon21Does()
    {
        // 30 calendar days = round(30 × 252 / 365) = 21 trading days (the trading-year convention of docs/conventions.md).
        var (prices, _) = WriteCloses("prices.csv", 400, 5);
        var impliedPath = _temp.Combine("implied.csv");
        File.WriteAllText(impliedPath, "date,iv\n2015-01-05,0.2\n2015-01-06,0.25\n");

        var byDays = CliRunner.Run("cone", "--prices", prices, "--implied", impliedPath, "--implied-horizon", "21", "--out", _temp.Combine("days"));
        var byTenor = CliRunner.Run("cone", "--prices", prices, "--implied", impliedPath, "--implied-tenor", "30d", "--out", _temp.Combine("tenor"));

        Assert.True(byDays.ExitCode == 0, byDays.Stderr);
        Assert.True(byTenor.ExitCode == 0, byTenor.Stderr);
        Assert.Equal(File.ReadAllBytes(_temp.Combine("days", "cone.png")), File.ReadAllBytes(_temp.Combine("tenor", "cone.png")));
    }

    [Theory]
    [InlineData("--implied-horizon", "0", "--implied-horizon must be from 1 to 2,520 trading days")]
    [InlineData("--implied-horizon", "2521", "--implied-horizon must be from 1 to 2,520 trading days")]
    [InlineData("--implied-tenor", "0d", "--implied-tenor must be from 1 to 3,650 calendar days")]
    [InlineData("--implied-tenor", "99999999999999999999d", "--implied-tenor must be from 1 to 3,650 calendar days")]
    [InlineData("--implied-tenor", "thirty", "--implied-tenor must be a number of calendar days followed by d")]
    public void Cone_ImpliedHorizonOrTenorOutOfRange_ExitsTwoBeforeReadingSayingTheRangeAndUnit(string option, string value, string message)
    {
        var output = _temp.Combine("out");

        // The prices file does not exist: the setting is refused before any file is read.
        var result = CliRunner.Run("cone", "--prices", _temp.Combine("absent.csv"), option, value, "--out", output);

        Assert.Equal(2, result.ExitCode);
        Assert.Contains(message, result.Stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(output));
    }

    [Fact]
    public void Cone_ImpliedHorizonAndTenorBoth_ExitsTwo()
    {
        var result = CliRunner.Run("cone", "--prices", _temp.Combine("absent.csv"), "--implied-horizon", "21", "--implied-tenor", "30d", "--out", _temp.Combine("out"));

        Assert.Equal(2, result.ExitCode);
        Assert.Contains("not both", result.Stderr, StringComparison.Ordinal);
    }
}
