using System.Globalization;
using System.Text;
using VolCast.Core.Data;
using VolCast.IO.Reading;

namespace VolCast.IO;

/// <summary>
/// Applies the user's choice (<see cref="SuspectAction"/>) to the suspect values the readers found and to the checks of
/// the implied series against the prices (outages, a late start or early end, values far outside the realized range).
/// Nothing is dropped silently: every dropped row goes to <see cref="CheckedInputs.Rejected"/> with its reason.
/// </summary>
public static class SuspectRows
{
    /// <summary>Checks the loaded inputs and keeps, drops or refuses the suspect rows.</summary>
    /// <param name="prices">The loaded prices.</param>
    /// <param name="implied">The loaded implied series, or null.</param>
    /// <param name="impliedFile">The implied file as the user gave it (for the findings), or null.</param>
    /// <param name="action">What to do with suspect rows.</param>
    /// <returns>The inputs the run uses, the added warnings and the rows left out.</returns>
    /// <exception cref="InputDataException"><paramref name="action"/> is <see cref="SuspectAction.Stop"/> and something was found; the message lists every finding (up to <see cref="DataChecks.MaxListed"/>, with the count).</exception>
    public static CheckedInputs Apply(PriceLoad prices, ImpliedLoad? implied, string? impliedFile, SuspectAction action)
    {
        ArgumentNullException.ThrowIfNull(prices);
        var warnings = new List<InputWarning>();
        var rejected = new List<RejectedRow>(prices.Rejected);
        if (implied is not null)
        {
            rejected.AddRange(implied.Rejected);
        }

        var priceFindings = prices.Suspects;
        if (action == SuspectAction.Drop)
        {
            prices = DropBars(prices, rejected, warnings);
        }

        var cross = implied is null || implied.Lines.Count != implied.Series.Count
            ? []
            : ImpliedChecks.AgainstPrices(prices.History, implied.Series, [.. implied.Lines], impliedFile ?? "implied");
        var impliedFindings = implied is null ? [] : implied.Suspects.Concat(cross).ToList();
        if (action == SuspectAction.Stop)
        {
            var all = priceFindings.Concat(impliedFindings).ToList();
            if (all.Count > 0)
            {
                throw Refusal(all);
            }
        }

        foreach (var finding in cross)
        {
            warnings.Add(new InputWarning(finding.File, finding.Line, finding.Reason));
        }

        if (action == SuspectAction.Drop && implied is not null)
        {
            implied = DropQuotes(implied, impliedFindings, rejected, warnings);
        }

        rejected.Sort((a, b) => a.File == b.File ? a.Line.CompareTo(b.Line) : string.CompareOrdinal(a.File, b.File));
        return new CheckedInputs(prices, implied, warnings.AsReadOnly(), rejected.AsReadOnly());
    }

    private static InputDataException Refusal(List<SuspectFinding> all)
    {
        var c = CultureInfo.InvariantCulture;
        var text = new StringBuilder(string.Create(c, $"{all.Count} suspect value(s) found and --suspect stop was given; repair them, or run with --suspect warn (keep and list) or --suspect drop (leave out and list in rejected-rows.csv):"));
        for (var i = 0; i < Math.Min(all.Count, DataChecks.MaxListed); i++)
        {
            text.Append("\n  ").Append(all[i].ToString());
        }

        if (all.Count > DataChecks.MaxListed)
        {
            text.Append('\n').Append(string.Create(c, $"  ... and {all.Count - DataChecks.MaxListed} more ({all.Count} in all)."));
        }

        return new InputDataException(all[0].File, null, null, text.ToString());
    }

    private static PriceLoad DropBars(PriceLoad prices, List<RejectedRow> rejected, List<InputWarning> warnings)
    {
        var drop = Droppable(prices.Suspects, rejected);
        if (drop.Count == 0)
        {
            return prices;
        }

        var h = prices.History;
        var keep = new List<int>(h.Count);
        for (var i = 0; i < h.Count; i++)
        {
            if (!drop.Contains(h.Dates[i]))
            {
                keep.Add(i);
            }
        }

        var dates = Pick(h.Dates, keep);
        var close = Pick(h.Close, keep);
        var history = h.HasRange
            ? PriceHistory.FromBars(dates, Pick(h.Open, keep), Pick(h.High, keep), Pick(h.Low, keep), close)
            : PriceHistory.FromCloses(dates, close);
        warnings.Add(Dropped(prices.Suspects[0].File, drop.Count, "bar(s)", "missing days"));
        return prices with { History = history };
    }

    private static ImpliedLoad DropQuotes(ImpliedLoad implied, List<SuspectFinding> findings, List<RejectedRow> rejected, List<InputWarning> warnings)
    {
        var drop = Droppable(findings, rejected);
        if (drop.Count == 0)
        {
            return implied;
        }

        var s = implied.Series;
        var keep = new List<int>(s.Count);
        for (var i = 0; i < s.Count; i++)
        {
            if (!drop.Contains(s.Dates[i]))
            {
                keep.Add(i);
            }
        }

        if (keep.Count == 0)
        {
            throw new InputDataException(findings[0].File, null, null, "every implied value was found suspect; nothing is left to compare with. Check the file, or run with --suspect warn.");
        }

        var lines = new int[keep.Count];
        for (var k = 0; k < keep.Count; k++)
        {
            lines[k] = implied.Lines[keep[k]];
        }

        warnings.Add(Dropped(findings[0].File, drop.Count, "implied value(s)", "missing quotes"));
        return implied with { Series = new ImpliedSeries(Pick(s.Dates, keep), Pick(s.Volatility, keep)), Lines = lines };
    }

    /// <summary>The dates of the droppable findings, each recorded once as a rejected row (the first reason found for a date).</summary>
    private static HashSet<DateOnly> Droppable(IEnumerable<SuspectFinding> findings, List<RejectedRow> rejected)
    {
        var drop = new HashSet<DateOnly>();
        foreach (var f in findings)
        {
            if (f.Date is DateOnly d && drop.Add(d))
            {
                rejected.Add(new RejectedRow(f.File, f.Line ?? 0, d, RejectedRow.Suspect, f.Reason));
            }
        }

        return drop;
    }

    private static InputWarning Dropped(string file, int count, string what, string treatedAs) =>
        new(file, null, string.Create(CultureInfo.InvariantCulture,
            $"{count} suspect {what} dropped (--suspect drop) and treated as {treatedAs}; each is listed with its reason in rejected-rows.csv."));

    private static T[] Pick<T>(ReadOnlySpan<T> values, List<int> keep)
    {
        var result = new T[keep.Count];
        for (var k = 0; k < keep.Count; k++)
        {
            result[k] = values[keep[k]];
        }

        return result;
    }
}
