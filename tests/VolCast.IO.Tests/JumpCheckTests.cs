using System.Globalization;
using System.Text;

namespace VolCast.IO.Tests;

// Values far outside their neighbours are warned about, naming the line (invented series, common practice, no source:
// a robust scale from the median absolute change, and a spike counted only when it reverts the next day).
public sealed class JumpCheckTests
{
    private static string Closes(int days, int seed, Func<int, double, double>? edit = null)
    {
        var random = new Random(seed);
        var sb = new StringBuilder("date,close\n");
        var date = new DateOnly(2000, 1, 3);
        var close = 1000.0;
        for (var i = 0; i < days; i++)
        {
            close *= Math.Exp(0.01 * (random.NextDouble() - 0.5) * 3.4);
            var shown = edit is null ? close : edit(i, close);
            sb.Append(CultureInfo.InvariantCulture, $"{date:yyyy-MM-dd},{shown:R}\n");
            date = date.AddDays(date.DayOfWeek == DayOfWeek.Friday ? 3 : 1);
        }

        return sb.ToString();
    }

    private static IReadOnlyList<InputWarning> PriceWarnings(string text) =>
        PriceFileReader.Read(new StringReader(text), "p.csv").Warnings;

    [Fact]
    public void Prices_CleanRandomWalk_NoJumpWarning()
    {
        Assert.Empty(PriceWarnings(Closes(2000, 1)));
    }

    [Fact]
    public void Prices_OneCorruptCloseNearZero_WarnedAsSpikeAtItsLine()
    {
        // Row 300 is on line 301 (the header is line 1).
        var warnings = PriceWarnings(Closes(600, 2, (i, c) => i == 299 ? 1e-8 : c));

        var spike = Assert.Single(warnings);
        Assert.Equal(301, spike.Line);
        Assert.Contains("isolated spike", spike.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Prices_OneBarTimesTenThatReverts_WarnedAsSpike()
    {
        var warnings = PriceWarnings(Closes(600, 3, (i, c) => i == 450 ? c * 10 : c));

        var spike = Assert.Single(warnings);
        Assert.Equal(452, spike.Line);
        Assert.Contains("isolated spike", spike.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Prices_LogReturnAboveOneThatStays_WarnedNamingTheReturn()
    {
        // An unadjusted 1:4 split: the close falls to a quarter and stays (|ln 0.25| = 1.386 > 1).
        var warnings = PriceWarnings(Closes(600, 4, (i, c) => i >= 200 ? c / 4 : c));

        var jump = Assert.Single(warnings);
        Assert.Equal(202, jump.Line);
        Assert.Contains("above 1 in size", jump.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Implied_PercentTurningIntoDecimalHalfWay_WarnedAsChangeOfScaleAtTheFirstLine()
    {
        var sb = new StringBuilder("date,iv\n");
        var date = new DateOnly(2020, 1, 1);
        for (var i = 0; i < 400; i++)
        {
            var iv = 20 + (3 * Math.Sin(i / 15.0));
            sb.Append(CultureInfo.InvariantCulture, $"{date:yyyy-MM-dd},{(i < 250 ? iv : iv / 100):R}\n");
            date = date.AddDays(1);
        }

        var load = ImpliedFileReader.Read(new StringReader(sb.ToString()), "iv.csv", ImpliedUnit.Percent);

        var change = Assert.Single(load.Warnings, w => w.Message.Contains("changes scale", StringComparison.Ordinal));
        Assert.Equal(252, change.Line);
    }
}
