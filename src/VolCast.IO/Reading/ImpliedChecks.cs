using System.Globalization;
using VolCast.Core.Data;

namespace VolCast.IO.Reading;

/// <summary>
/// Checks of an implied-volatility series on its own and against the prices of the same dates. Rules (common
/// practice, no source; the thresholds are stated in each finding):
/// <list type="bullet">
/// <item>Stale: the same value on <see cref="StaleRun"/> or more rows in a row; every row after the first is a copy (droppable).</item>
/// <item>Outage: <see cref="OutageDays"/> or more price dates in a row with no implied value.</item>
/// <item>Late start or early end: the implied series starts more than <see cref="EdgeDays"/> calendar days after the prices, or ends that long before them.</item>
/// <item>Outside the realized range: a value above <see cref="RangeFactor"/> times the highest, or below the lowest divided by it, of the
/// 21-day close-to-close realized volatility (annualized with √252) over the <see cref="RangeDays"/> price dates either side (droppable).</item>
/// </list>
/// </summary>
internal static class ImpliedChecks
{
    /// <summary>A run of this many identical values (or more) is stale.</summary>
    public const int StaleRun = 5;

    /// <summary>This many missing price dates in a row (or more) is an outage.</summary>
    public const int OutageDays = 5;

    /// <summary>A start or end this many calendar days (or more) away from the prices' is named.</summary>
    public const int EdgeDays = 31;

    /// <summary>How far (in price dates either side) the realized range reaches.</summary>
    public const int RangeDays = 42;

    /// <summary>A value beyond this factor of the realized range is named.</summary>
    public const double RangeFactor = 4;

    private const int RealizedWindow = 21;

    /// <summary>Finds runs of <see cref="StaleRun"/> or more identical values.</summary>
    public static void Stale(ReadOnlySpan<DateOnly> dates, ReadOnlySpan<double> values, ReadOnlySpan<int> lines, string file, List<InputWarning> warnings, List<SuspectFinding> suspects)
    {
        var c = CultureInfo.InvariantCulture;
        var start = 0;
        for (var i = 1; i <= values.Length; i++)
        {
            if (i < values.Length && values[i] == values[start])
            {
                continue;
            }

            var run = i - start;
            if (run >= StaleRun)
            {
                var message = string.Create(c,
                    $"the implied volatility stays at {ValueText.Number(values[start])} for {run} rows in a row, {ValueText.Date(dates[start])} (line {lines[start]}) to {ValueText.Date(dates[i - 1])} (line {lines[i - 1]}); a stale quote carried forward ({StaleRun} or more equal values) is not a market price.");
                warnings.Add(new InputWarning(file, lines[start], message));
                for (var k = start + 1; k < i; k++)
                {
                    suspects.Add(new SuspectFinding(file, lines[k], dates[k], string.Create(c,
                        $"stale: the implied volatility {ValueText.Number(values[k])} on {ValueText.Date(dates[k])} repeats the value of line {lines[start]} ({run} equal values in a row)")));
                }
            }

            start = i;
        }
    }

    /// <summary>Checks the implied series against the price dates and the realized volatility of the same dates.</summary>
    /// <param name="prices">The price history.</param>
    /// <param name="implied">The implied series (decimals).</param>
    /// <param name="lines">Each implied value's physical line, in the series' order.</param>
    /// <param name="file">The implied file, for the findings.</param>
    /// <returns>The findings, in date order.</returns>
    public static List<SuspectFinding> AgainstPrices(PriceHistory prices, ImpliedSeries implied, ReadOnlySpan<int> lines, string file)
    {
        ArgumentNullException.ThrowIfNull(prices);
        ArgumentNullException.ThrowIfNull(implied);
        var c = CultureInfo.InvariantCulture;
        var found = new List<SuspectFinding>();
        var pd = prices.Dates;
        var id = implied.Dates;
        var iv = implied.Volatility;
        if (pd.Length == 0 || id.Length == 0)
        {
            return found;
        }

        if (id[0].DayNumber - pd[0].DayNumber > EdgeDays)
        {
            found.Add(new SuspectFinding(file, lines[0], null, string.Create(c,
                $"late start: the implied series starts on {ValueText.Date(id[0])}, {id[0].DayNumber - pd[0].DayNumber} calendar days after the prices ({ValueText.Date(pd[0])}); dates before it have no implied value to compare with.")));
        }

        if (pd[^1].DayNumber - id[^1].DayNumber > EdgeDays)
        {
            found.Add(new SuspectFinding(file, lines[^1], null, string.Create(c,
                $"early end: the implied series ends on {ValueText.Date(id[^1])}, {pd[^1].DayNumber - id[^1].DayNumber} calendar days before the prices ({ValueText.Date(pd[^1])}); later dates have no implied value to compare with.")));
        }

        // Outages: price dates strictly between two consecutive implied dates (both within the price dates).
        var p = 0;
        for (var k = 1; k < id.Length; k++)
        {
            while (p < pd.Length && pd[p] <= id[k - 1])
            {
                p++;
            }

            var missing = 0;
            var q = p;
            while (q < pd.Length && pd[q] < id[k])
            {
                missing++;
                q++;
            }

            if (missing >= OutageDays && id[k - 1] >= pd[0])
            {
                found.Add(new SuspectFinding(file, lines[k], null, string.Create(c,
                    $"outage: no implied volatility on {missing} price dates in a row, {ValueText.Date(pd[p])} to {ValueText.Date(pd[q - 1])}, between line {lines[k - 1]} and line {lines[k]} ({OutageDays} or more missing trading days).")));
            }
        }

        OutsideRealized(prices, implied, lines, file, found);
        found.Sort((a, b) => (a.Line ?? 0).CompareTo(b.Line ?? 0));
        return found;
    }

    private static void OutsideRealized(PriceHistory prices, ImpliedSeries implied, ReadOnlySpan<int> lines, string file, List<SuspectFinding> found)
    {
        var pd = prices.Dates;
        var close = prices.Close;
        var n = pd.Length;
        if (n <= RealizedWindow + 1)
        {
            return;
        }

        // rv[t]: 21-day close-to-close volatility ending at t (zero mean, annualized with √252), NaN before the first full window.
        var rv = new double[n];
        var sum = 0.0;
        for (var t = 0; t < n; t++)
        {
            if (t > 0)
            {
                var r = Math.Log(close[t] / close[t - 1]);
                sum += r * r;
            }

            if (t > RealizedWindow)
            {
                var old = Math.Log(close[t - RealizedWindow] / close[t - RealizedWindow - 1]);
                sum -= old * old;
            }

            rv[t] = t >= RealizedWindow ? Math.Sqrt(Math.Max(sum, 0) / RealizedWindow * 252) : double.NaN;
        }

        var c = CultureInfo.InvariantCulture;
        var id = implied.Dates;
        var iv = implied.Volatility;
        var p = 0;
        for (var k = 0; k < id.Length; k++)
        {
            while (p < n && pd[p] < id[k])
            {
                p++;
            }

            if (p >= n || pd[p] != id[k])
            {
                continue;
            }

            double lo = double.PositiveInfinity, hi = 0;
            for (var t = Math.Max(RealizedWindow, p - RangeDays); t <= Math.Min(n - 1, p + RangeDays); t++)
            {
                lo = Math.Min(lo, rv[t]);
                hi = Math.Max(hi, rv[t]);
            }

            if (!(hi > 0) || !double.IsFinite(lo))
            {
                continue;
            }

            if (iv[k] > RangeFactor * hi || iv[k] < lo / RangeFactor)
            {
                found.Add(new SuspectFinding(file, lines[k], id[k], string.Create(c,
                    $"the implied volatility {ValueText.Number(iv[k])} on {ValueText.Date(id[k])} is far outside the realized volatility of the dates around it ({ValueText.Number(Math.Round(lo, 4))} to {ValueText.Number(Math.Round(hi, 4))}, 21-day close-to-close over {RangeDays} trading days either side; more than a factor {ValueText.Number(RangeFactor)} away).")));
            }
        }
    }
}
