using System.Text;
using System.Text.RegularExpressions;

namespace VolCast.Reports.Html;

/// <summary>
/// The "Terms used" section: one plain sentence and the paper for each named test or loss the page uses without
/// defining it, and a link from the first use of each on the page to its entry.
/// </summary>
/// <remarks>
/// The links are added to the rendered page in one pass over its text (never inside a tag, an attribute, code or a
/// link), so every section keeps writing plain escaped text. The sources are those of docs/methods.md.
/// </remarks>
internal static partial class Glossary
{
    /// <summary>The terms, in the order the section lists them.</summary>
    internal static IReadOnlyList<GlossaryTerm> Terms { get; } =
    [
        new("qlike", "QLIKE",
            "A loss for volatility forecasts, RV²/F² − ln(RV²/F²) − 1 on variances, zero for a perfect forecast and heavier on forecasts that are too low; it ranks forecasts as the true volatility would even though the realized volatility it is scored against is noisy (Patton 2011).",
            QlikeUse()),
        new("dm", "Diebold-Mariano (DM)",
            "A test of whether two forecasts' mean losses differ, on the day-by-day difference of their losses with a standard error that allows for overlapping windows; a negative statistic favours the forecast named first (Diebold and Mariano 1995, with the small-sample correction of Harvey, Leybourne and Newbold 1997).",
            DmUse()),
        new("mz", "Mincer-Zarnowitz (MZ)",
            "The regression of realized on forecast variance, RV² = a + b F²: an unbiased forecast has a = 0 and b = 1, and R² is the share of the realized variance it explains (Mincer and Zarnowitz 1969).",
            MzUse()),
        new("mcs", "Model confidence set (MCS)",
            "The forecasters that cannot be told apart from the best at the stated level, found by dropping the worst one until the rest are statistically tied; a forecaster's MCS p-value is the level at which it would leave the set (Hansen, Lunde and Nason 2011).",
            McsUse()),
        new("newey-west", "Newey-West",
            "A standard error that allows for the correlation between overlapping windows, weighting each lag less the further it is (Newey and West 1987).",
            NeweyWestUse()),
        new("hac", "HAC",
            "Heteroskedasticity- and autocorrelation-consistent: a standard error such as Newey-West's that stays valid when the days' values vary in size and overlap (Newey and West 1987).",
            HacUse()),
        new("sortino", "Sortino ratio",
            "Mean daily P&L over the downside deviation, the root mean square of min(P&L, 0) over all days, annualized: the Sharpe ratio without the penalty for gains (Sortino and Price 1994).",
            SortinoUse()),
        new("hodges-tompkins", "Hodges-Tompkins",
            "A correction of the downward bias that overlapping windows put into the variance of realized volatility across dates, applied to the cone's bands (Hodges and Tompkins 2002).",
            HodgesTompkinsUse()),
        new("kupiec", "Kupiec",
            "A test of whether a range held as often as it should, for example |z| ≤ 1 on 68.3% of dates, counted on non-overlapping dates (Kupiec 1995).",
            KupiecUse()),
        new("christoffersen", "Christoffersen",
            "Kupiec's count together with a check that the misses do not come in clusters (Christoffersen 1998).",
            ChristoffersenUse()),
        new("reality-check", "Reality Check",
            "A bootstrap test of whether the best of many rules searched beats the benchmark once the search itself is allowed for (White 2000).",
            RealityCheckUse()),
        new("spa", "SPA",
            "The test of superior predictive ability: the Reality Check made less sensitive to poor rules in the search, with consistent, lower and upper p-values (Hansen 2005).",
            SpaUse()),
        new("stepm", "StepM",
            "The Reality Check done step by step to name every rule that beats the benchmark, with the chance of naming any rule wrongly held at the stated level (Romano and Wolf 2005).",
            StepMUse()),
    ];

    /// <summary>The anchor of a term's entry.</summary>
    internal static string Anchor(GlossaryTerm term) => "term-" + term.Id;

    /// <summary>
    /// Links the first use of each term in the page's text to its entry and says which terms the page uses. Text
    /// inside tags (and so every attribute and image), in the head, in code and in links is left as it is.
    /// </summary>
    /// <param name="page">The page rendered so far.</param>
    /// <param name="used">The terms found, in the order of <see cref="Terms"/>.</param>
    /// <returns>The page with the links.</returns>
    internal static string LinkFirstUses(string page, out IReadOnlyList<GlossaryTerm> used)
    {
        var start = page.IndexOf("<body>", StringComparison.Ordinal);
        start = start < 0 ? 0 : start;
        var linked = new HashSet<GlossaryTerm>();
        var result = new StringBuilder(page.Length + 1024);
        result.Append(page, 0, start);
        var skip = 0;
        foreach (Match piece in Piece().Matches(page, start))
        {
            if (piece.Groups["tag"].Success)
            {
                var tag = piece.Value;
                if (Skipped().IsMatch(tag))
                {
                    skip += tag.StartsWith("</", StringComparison.Ordinal) ? -1 : 1;
                }

                result.Append(tag);
                continue;
            }

            result.Append(skip > 0 || linked.Count == Terms.Count ? piece.Value : Link(piece.Value, linked));
        }

        used = [.. Terms.Where(linked.Contains)];
        return result.ToString();
    }

    /// <summary>The page without the links to the terms section (their text kept), to compare with text rendered elsewhere.</summary>
    /// <param name="page">A rendered page.</param>
    /// <returns>The page with every term link replaced by its text.</returns>
    internal static string WithoutLinks(string page) => TermLink().Replace(page, "$1");

    /// <summary>Writes the section, listing the terms the page uses; nothing when it uses none.</summary>
    internal static void Section(StringBuilder html, IReadOnlyList<GlossaryTerm> used)
    {
        if (used.Count == 0)
        {
            return;
        }

        html.Append("<section id=\"terms\">\n<h2>Terms used</h2>\n<dl class=\"terms\">\n");
        foreach (var term in used)
        {
            html.Append("<dt id=\"").Append(Anchor(term)).Append("\">").Append(HtmlReport.E(term.Name)).Append("</dt><dd>")
                .Append(HtmlReport.E(term.Definition)).Append("</dd>\n");
        }

        html.Append("</dl>\n</section>\n");
    }

    /// <summary>Links, in one piece of escaped text, the first use of every term not linked yet, earliest first.</summary>
    private static string Link(string text, HashSet<GlossaryTerm> linked)
    {
        var result = new StringBuilder(text.Length + 64);
        var at = 0;
        while (true)
        {
            Match? first = null;
            GlossaryTerm? which = null;
            foreach (var term in Terms)
            {
                if (!linked.Contains(term) && term.Use.Match(text, at) is { Success: true } m && (first is null || m.Index < first.Index))
                {
                    (first, which) = (m, term);
                }
            }

            if (first is null || which is null)
            {
                return result.Append(text, at, text.Length - at).ToString();
            }

            linked.Add(which);
            result.Append(text, at, first.Index - at)
                .Append("<a href=\"#").Append(Anchor(which)).Append("\">").Append(first.Value).Append("</a>");
            at = first.Index + first.Length;
        }
    }

    /// <summary>A link to an entry of the terms section.</summary>
    [GeneratedRegex("<a href=\"#term-[a-z-]+\">([^<]*)</a>", RegexOptions.CultureInvariant)]
    private static partial Regex TermLink();

    /// <summary>A tag, or a run of text between tags.</summary>
    [GeneratedRegex("(?<tag><[^>]*>)|[^<]+", RegexOptions.CultureInvariant)]
    private static partial Regex Piece();

    /// <summary>The opening or closing tag of an element whose text is never linked.</summary>
    [GeneratedRegex(@"^</?(a|code|title|style|h1)[\s>]", RegexOptions.CultureInvariant)]
    private static partial Regex Skipped();

    [GeneratedRegex(@"\bQLIKE\b", RegexOptions.CultureInvariant)]
    private static partial Regex QlikeUse();

    [GeneratedRegex(@"\bDiebold-Mariano\b|\bDM\b", RegexOptions.CultureInvariant)]
    private static partial Regex DmUse();

    [GeneratedRegex(@"\bMincer-Zarnowitz\b|\bMZ\b", RegexOptions.CultureInvariant)]
    private static partial Regex MzUse();

    [GeneratedRegex(@"\b[Mm]odel confidence set\b|\bMCS\b", RegexOptions.CultureInvariant)]
    private static partial Regex McsUse();

    [GeneratedRegex(@"\bNewey-West\b", RegexOptions.CultureInvariant)]
    private static partial Regex NeweyWestUse();

    [GeneratedRegex(@"\bKupiec\b", RegexOptions.CultureInvariant)]
    private static partial Regex KupiecUse();

    [GeneratedRegex(@"\bChristoffersen\b", RegexOptions.CultureInvariant)]
    private static partial Regex ChristoffersenUse();

    [GeneratedRegex(@"\bReality Check\b", RegexOptions.CultureInvariant)]
    private static partial Regex RealityCheckUse();

    [GeneratedRegex(@"\bSPA\b", RegexOptions.CultureInvariant)]
    private static partial Regex SpaUse();

    [GeneratedRegex(@"\bStepM\b", RegexOptions.CultureInvariant)]
    private static partial Regex StepMUse();

    [GeneratedRegex(@"\bHAC\b", RegexOptions.CultureInvariant)]
    private static partial Regex HacUse();

    [GeneratedRegex(@"\bSortino\b", RegexOptions.CultureInvariant)]
    private static partial Regex SortinoUse();

    [GeneratedRegex(@"\bHodges-Tompkins\b", RegexOptions.CultureInvariant)]
    private static partial Regex HodgesTompkinsUse();
}
