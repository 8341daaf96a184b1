using System.Globalization;

namespace VolCast.TestSupport;

/// <summary>
/// A seeded price file and implied file as they often arrive (invented data, not reference data), with known defects
/// planted at known rows, kept as lists of data rows so a test can also write the same files with chosen rows left out.
/// The price row of index i is on line i + 2 (the header is line 1); <see cref="ImpliedLine"/> maps implied rows.
/// </summary>
public sealed class TrialFiles
{
    /// <summary>Price rows in the file.</summary>
    public const int Days = 700;

    /// <summary>The price row whose whole bar is multiplied by ten (an isolated bad print that reverts the next day).</summary>
    public const int BadBar = 300;

    /// <summary>The implied series starts at this price row (about eight weeks late).</summary>
    public const int ImpliedStart = 40;

    /// <summary>Implied rows at these price rows repeat one value (seven equal values: six stale copies).</summary>
    public static readonly (int First, int Last) StaleRun = (100, 106);

    /// <summary>The implied value at this price row is a bad print of 99.9 (percent) that reverts the next day.</summary>
    public const int Spike = 200;

    /// <summary>No implied value at these price rows (an outage of ten trading days).</summary>
    public static readonly (int First, int Last) Outage = (420, 429);

    /// <summary>Implied values of 150 (percent) at these price rows, far above the realized volatility of the dates.</summary>
    public static readonly (int First, int Last) OutsideRange = (550, 559);

    private TrialFiles(List<string> priceRows, List<(int PriceRow, string Text)> impliedRows)
    {
        PriceRows = priceRows;
        ImpliedRows = impliedRows;
    }

    /// <summary>Gets the price data rows, date,open,high,low,close.</summary>
    public IReadOnlyList<string> PriceRows { get; }

    /// <summary>Gets the implied data rows (date,iv in percent) with the price row of their date.</summary>
    public IReadOnlyList<(int PriceRow, string Text)> ImpliedRows { get; }

    /// <summary>Builds the files from a seed: a random walk with 1% daily moves and implied near 18% (percent).</summary>
    /// <param name="seed">The seed.</param>
    /// <returns>The files.</returns>
    public static TrialFiles Make(int seed)
    {
        var c = CultureInfo.InvariantCulture;
        var bars = Some.GbmBars(seed, Days);
        var prices = new List<string>(Days);
        for (var i = 0; i < Days; i++)
        {
            var f = i == BadBar ? 10.0 : 1.0;
            prices.Add(string.Create(c, $"{bars.Dates[i]:yyyy-MM-dd},{bars.Open[i] * f:R},{bars.High[i] * f:R},{bars.Low[i] * f:R},{bars.Close[i] * f:R}"));
        }

        var random = new Random(seed + 1);
        var implied = new List<(int, string)>();
        var x = 0.0;
        var stale = 0.0;
        for (var i = ImpliedStart; i < Days; i++)
        {
            x = (0.97 * x) + (0.03 * Gaussian.Next(random));
            var value = Math.Round(18 * Math.Exp(x), 2);
            if (i == StaleRun.First)
            {
                stale = value;
            }

            if (i >= Outage.First && i <= Outage.Last)
            {
                continue;
            }

            value = i switch
            {
                _ when i >= StaleRun.First && i <= StaleRun.Last => stale,
                Spike => 99.9,
                _ when i >= OutsideRange.First && i <= OutsideRange.Last => 150,
                _ => value,
            };
            implied.Add((i, string.Create(c, $"{bars.Dates[i]:yyyy-MM-dd},{value:R}")));
        }

        return new TrialFiles(prices, implied);
    }

    /// <summary>The line of the implied row at a price row.</summary>
    /// <param name="priceRow">The price row.</param>
    /// <returns>The 1-based line in the implied file.</returns>
    public int ImpliedLine(int priceRow)
    {
        for (var k = 0; k < ImpliedRows.Count; k++)
        {
            if (ImpliedRows[k].PriceRow == priceRow)
            {
                return k + 2;
            }
        }

        throw new ArgumentOutOfRangeException(nameof(priceRow), priceRow, "no implied row at this price row.");
    }

    /// <summary>The price file's text, leaving out the rows of the given lines.</summary>
    /// <param name="leaveOutLines">Lines to leave out, or null.</param>
    /// <returns>The text.</returns>
    public string PriceText(ISet<int>? leaveOutLines = null) =>
        "date,open,high,low,close\n" + string.Concat(PriceRows.Where((_, i) => leaveOutLines?.Contains(i + 2) != true).Select(r => r + "\n"));

    /// <summary>The implied file's text, leaving out the rows of the given lines.</summary>
    /// <param name="leaveOutLines">Lines to leave out, or null.</param>
    /// <returns>The text.</returns>
    public string ImpliedText(ISet<int>? leaveOutLines = null) =>
        "date,iv\n" + string.Concat(ImpliedRows.Where((_, k) => leaveOutLines?.Contains(k + 2) != true).Select(r => r.Text + "\n"));
}
