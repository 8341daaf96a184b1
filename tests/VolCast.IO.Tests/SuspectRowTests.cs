using System.Globalization;
using System.Text;
using VolCast.Core.Backtest;

namespace VolCast.IO.Tests;

// The defects of real files, planted in seeded invented files (TrialFiles): each is found and named at its line, and
// --suspect warn, drop and stop do what they say. The rules are common practice, no source: a bad print is a move of
// more than ten robust scales that reverts the next day; five equal implied values in a row are stale; five missing
// trading days are an outage; an implied value beyond four times the realized range of the dates around it is suspect.
public sealed class SuspectRowTests
{
    private static readonly TrialFiles Trial = TrialFiles.Make(7);

    private static PriceLoad Prices(string text, DataChecks? checks = null) =>
        PriceFileReader.Read(new StringReader(text), "p.csv", checks ?? DataChecks.Default);

    private static ImpliedLoad Implied(string text, DataChecks? checks = null) =>
        ImpliedFileReader.Read(new StringReader(text), "iv.csv", ImpliedUnit.Percent, checks ?? DataChecks.Default);

    private static int PriceLine(int row) => row + 2;

    private static IEnumerable<int> Range((int First, int Last) r) => Enumerable.Range(r.First, r.Last - r.First + 1);

    /// <summary>The implied lines that --suspect drop must remove: the stale copies, the spike and the values outside the realized range.</summary>
    private static SortedSet<int> DroppableImpliedLines() =>
        [.. Range(TrialFiles.StaleRun).Skip(1).Append(TrialFiles.Spike).Concat(Range(TrialFiles.OutsideRange)).Select(Trial.ImpliedLine)];

    [Fact]
    public void Warn_EveryPlantedDefect_IsNamedAtItsLine()
    {
        var prices = Prices(Trial.PriceText());
        var implied = Implied(Trial.ImpliedText());
        var checkedInputs = SuspectRows.Apply(prices, implied, "iv.csv", SuspectAction.Warn);
        var warnings = prices.Warnings.Concat(implied.Warnings).Concat(checkedInputs.Warnings).Select(w => w.ToString()).ToList();

        // The whole bar ×10 at row 300, by line and date, with the reversal the next day.
        var barDate = Trial.PriceRows[TrialFiles.BadBar][..10];
        Assert.Contains(warnings, w => w.StartsWith($"p.csv, line {PriceLine(TrialFiles.BadBar)}:", StringComparison.Ordinal) && w.Contains("isolated spike", StringComparison.Ordinal) && w.Contains(barDate, StringComparison.Ordinal));
        Assert.Contains(warnings, w => w.StartsWith($"iv.csv, line {Trial.ImpliedLine(TrialFiles.StaleRun.First)}:", StringComparison.Ordinal) && w.Contains("7 rows in a row", StringComparison.Ordinal));
        Assert.Contains(warnings, w => w.StartsWith($"iv.csv, line {Trial.ImpliedLine(TrialFiles.Spike)}:", StringComparison.Ordinal) && w.Contains("isolated spike", StringComparison.Ordinal));
        Assert.Contains(warnings, w => w.Contains("outage: no implied volatility on 10 price dates", StringComparison.Ordinal));
        Assert.Contains(warnings, w => w.StartsWith("iv.csv, line 2:", StringComparison.Ordinal) && w.Contains("late start", StringComparison.Ordinal));
        foreach (var row in Range(TrialFiles.OutsideRange))
        {
            Assert.Contains(warnings, w => w.StartsWith($"iv.csv, line {Trial.ImpliedLine(row)}:", StringComparison.Ordinal) && w.Contains("far outside the realized volatility", StringComparison.Ordinal));
        }

        // Warn keeps every row.
        Assert.Equal(TrialFiles.Days, checkedInputs.Prices.History.Count);
        Assert.Equal(Trial.ImpliedRows.Count, checkedInputs.Implied!.Series.Count);
        Assert.Empty(checkedInputs.Rejected);
    }

    [Fact]
    public void Drop_RemovesExactlyTheNamedRows_AndListsThemWithReasons()
    {
        var checkedInputs = SuspectRows.Apply(Prices(Trial.PriceText()), Implied(Trial.ImpliedText()), "iv.csv", SuspectAction.Drop);

        var priceLines = checkedInputs.Rejected.Where(r => r.File == "p.csv").Select(r => r.Line).ToArray();
        var impliedLines = checkedInputs.Rejected.Where(r => r.File == "iv.csv").Select(r => r.Line).ToArray();
        Assert.Equal([PriceLine(TrialFiles.BadBar)], priceLines);
        Assert.Equal(DroppableImpliedLines().ToArray(), impliedLines);
        Assert.All(checkedInputs.Rejected, r => Assert.Equal(RejectedRow.Suspect, r.Kind));
        Assert.All(checkedInputs.Rejected, r => Assert.False(string.IsNullOrWhiteSpace(r.Reason)));
        Assert.Contains(checkedInputs.Warnings, w => w.Message.Contains("dropped (--suspect drop)", StringComparison.Ordinal));
    }

    [Fact]
    public void Drop_GivesTheSameBacktestAsACleanFileWithThoseDaysMissing()
    {
        var dropped = SuspectRows.Apply(Prices(Trial.PriceText()), Implied(Trial.ImpliedText()), "iv.csv", SuspectAction.Drop);
        var clean = SuspectRows.Apply(
            Prices(Trial.PriceText(new HashSet<int> { PriceLine(TrialFiles.BadBar) })),
            Implied(Trial.ImpliedText(DroppableImpliedLines())),
            "iv.csv",
            SuspectAction.Warn);

        Assert.Equal(clean.Prices.History.Dates.ToArray(), dropped.Prices.History.Dates.ToArray());
        Assert.Equal(clean.Prices.History.High.ToArray(), dropped.Prices.History.High.ToArray());
        Assert.Equal(clean.Implied!.Series.Volatility.ToArray(), dropped.Implied!.Series.Volatility.ToArray());

        var settings = new BacktestSettings { Forecasters = ["close-to-close:21", "yang-zhang:21", "ewma:0.94"], Sweep = false };
        var a = Backtester.Run(dropped.Prices.History, dropped.Implied.Series, settings);
        var b = Backtester.Run(clean.Prices.History, clean.Implied.Series, settings);
        Assert.Equal(b.Dates.ToArray(), a.Dates.ToArray());
        Assert.Equal(b.Forecasts.Length, a.Forecasts.Length);
        for (var i = 0; i < a.Forecasts.Length; i++)
        {
            Assert.Equal(b.Forecasts[i].Values.ToArray(), a.Forecasts[i].Values.ToArray());
        }

        Assert.Equal(b.Metrics.Select(m => m.Losses?.Qlike), a.Metrics.Select(m => m.Losses?.Qlike));
    }

    [Fact]
    public void Stop_RefusesWithTheFullList()
    {
        var error = Assert.Throws<InputDataException>(() =>
            SuspectRows.Apply(Prices(Trial.PriceText()), Implied(Trial.ImpliedText()), "iv.csv", SuspectAction.Stop));

        Assert.Contains("--suspect stop", error.Message, StringComparison.Ordinal);
        Assert.Contains($"p.csv, line {PriceLine(TrialFiles.BadBar)}:", error.Message, StringComparison.Ordinal);
        Assert.Contains($"iv.csv, line {Trial.ImpliedLine(TrialFiles.Spike)}:", error.Message, StringComparison.Ordinal);
        Assert.Contains("late start", error.Message, StringComparison.Ordinal);

        // More findings than the listing cap: the rest are counted.
        Assert.Contains("more (", error.Message, StringComparison.Ordinal);
        Assert.Contains("in all)", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void ChangeOfScaleInsideTheFile_IsNamedAtTheFirstLineWhereItHappens()
    {
        // Percent for 120 rows, then the same series in decimals from line 122 on.
        var sb = new StringBuilder("date,iv\n");
        var dates = Some.TradingDates(200);
        var random = new Random(3);
        for (var i = 0; i < dates.Length; i++)
        {
            var value = 20 + Gaussian.Next(random);
            sb.Append(CultureInfo.InvariantCulture, $"{dates[i]:yyyy-MM-dd},{(i < 120 ? value : value / 100):R}\n");
        }

        var load = ImpliedFileReader.Read(new StringReader(sb.ToString()), "iv.csv", ImpliedUnit.Percent);

        var warning = Assert.Single(load.Warnings, w => w.Message.Contains("changes scale", StringComparison.Ordinal));
        Assert.Equal(122, warning.Line);
        Assert.Contains(load.Suspects, s => s.Line == 122 && !s.Droppable);
    }

    [Fact]
    public void BadRows_AreAllListedInOneRefusal()
    {
        var rows = Trial.PriceRows.Take(40).ToList();
        rows[3] = rows[3][..11] + "1,1,1,abc";                   // line 5: unparseable close
        rows[7] = rows[7][..11] + "100,99,101,100";              // line 9: low above high
        rows[10] = rows[9][..10] + rows[10][10..];               // line 12: the date of line 11 again

        var error = Assert.Throws<InputDataException>(() => Prices("date,open,high,low,close\n" + string.Join('\n', rows) + "\n"));

        Assert.Contains("3 rows fail the row checks", error.Message, StringComparison.Ordinal);
        Assert.Contains("p.csv, line 5, column 'close'", error.Message, StringComparison.Ordinal);
        Assert.Contains("p.csv, line 9, column 'high'", error.Message, StringComparison.Ordinal);
        Assert.Contains("p.csv, line 12, column 'date'", error.Message, StringComparison.Ordinal);
        Assert.Contains("--skip-bad-rows", error.Message, StringComparison.Ordinal);
        Assert.Equal(5, error.Line);
    }

    [Fact]
    public void BadRows_MoreThanTheCap_AreCounted()
    {
        var rows = Trial.PriceRows.Take(60).Select((r, i) => i % 2 == 0 ? r[..11] + "x,x,x,x" : r).ToList();

        var error = Assert.Throws<InputDataException>(() => Prices("date,open,high,low,close\n" + string.Join('\n', rows) + "\n"));

        Assert.Contains("30 rows fail the row checks", error.Message, StringComparison.Ordinal);
        Assert.Contains($"... and {30 - DataChecks.MaxListed} more (30 in all).", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void SkipBadRows_LeavesThemOutAndListsThem()
    {
        var rows = Trial.PriceRows.Take(40).ToList();
        rows[3] = rows[3][..11] + "1,1,1,abc";
        rows[7] = rows[7][..11] + "100,99,101,100";
        var text = "date,open,high,low,close\n" + string.Join('\n', rows) + "\n";

        var load = Prices(text, new DataChecks(SkipBadRows: true));
        var clean = Prices(Trial.PriceText().Split('\n').Take(41).Where((_, i) => i != 4 && i != 8).Aggregate(new StringBuilder(), (sb, l) => sb.Append(l).Append('\n')).ToString());

        Assert.Equal([5, 9], load.Rejected.Select(r => r.Line));
        Assert.All(load.Rejected, r => Assert.Equal(RejectedRow.BadRow, r.Kind));
        Assert.Contains("is not a number", load.Rejected[0].Reason, StringComparison.Ordinal);
        Assert.Equal(40, load.RowsRead);
        Assert.Equal(clean.History.Close.ToArray(), load.History.Close.ToArray());
        Assert.Contains(load.Warnings, w => w.Message.Contains("rejected-rows.csv", StringComparison.Ordinal));
    }

    [Fact]
    public void SkipBadRows_ImpliedZeroAnd999_AreLeftOutAsBadRows()
    {
        // 0 and 999 (percent, 999%) fail the row check of (0%, 500%].
        var rows = Trial.ImpliedRows.Take(60).Select(r => r.Text).ToList();
        rows[10] = rows[10][..11] + "0";
        rows[20] = rows[20][..11] + "999";
        var text = "date,iv\n" + string.Join('\n', rows) + "\n";

        var refused = Assert.Throws<InputDataException>(() => Implied(text));
        Assert.Contains("2 rows fail the row checks", refused.Message, StringComparison.Ordinal);

        var load = Implied(text, new DataChecks(SkipBadRows: true));
        Assert.Equal([12, 22], load.Rejected.Select(r => r.Line));
        Assert.Equal(58, load.Series.Count);
    }
}
