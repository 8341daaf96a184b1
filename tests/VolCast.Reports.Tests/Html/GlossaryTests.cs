using System.Text.RegularExpressions;
using VolCast.Reports.Html;
using VolCast.Reports.Tests.Pnl;

namespace VolCast.Reports.Tests.Html;

/// <summary>
/// The "Terms used" section: the named tests and losses the page uses without defining them each get one sentence with
/// the paper, and the first use of each on the page links to it. Invented demo data with the rule's option trades.
/// </summary>
public sealed partial class GlossaryTests
{
    /// <summary>What a reader would call a use of each term, written here apart from the code: the name and the abbreviation.</summary>
    private static readonly Dictionary<string, string[]> Uses = new()
    {
        ["qlike"] = ["QLIKE"],
        ["dm"] = ["Diebold-Mariano", "DM"],
        ["mz"] = ["Mincer-Zarnowitz", "MZ"],
        ["mcs"] = ["model confidence set", "Model confidence set", "MCS"],
        ["newey-west"] = ["Newey-West"],
        ["kupiec"] = ["Kupiec"],
        ["christoffersen"] = ["Christoffersen"],
        ["reality-check"] = ["Reality Check"],
        ["spa"] = ["SPA"],
        ["stepm"] = ["StepM"],
        ["hac"] = ["HAC"],
        ["sortino"] = ["Sortino"],
        ["hodges-tompkins"] = ["Hodges-Tompkins"],
    };

    private static readonly string Page = HtmlReport.Render(ReportWriter.Build(PnlSectionTests.RunWith(PnlSectionTests.BuildReport(seed: 17, days: 700))));

    [Fact]
    public void Section_ListsTheTermsOfTheBriefWithAPaperEach_AndSitsJustBeforeTheCautions()
    {
        var terms = Page.IndexOf("<section id=\"terms\">", StringComparison.Ordinal);
        var cautions = Page.IndexOf("<section id=\"cautions\">", StringComparison.Ordinal);
        var run = Page.IndexOf("<section id=\"run\">", StringComparison.Ordinal);
        Assert.True(run < terms && terms < cautions, $"run {run}, terms {terms}, cautions {cautions}");

        // The terms a cold reader met undefined: every one is on this page, so every one has its entry.
        foreach (var id in new[] { "qlike", "spa", "reality-check", "stepm", "kupiec", "mcs", "dm", "mz" })
        {
            Assert.Contains($"<dt id=\"term-{id}\">", Page, StringComparison.Ordinal);
        }

        // One sentence each, naming the paper as author and year.
        foreach (var term in Glossary.Terms)
        {
            Assert.Matches(@"\([A-Z][^()]*\b(19|20)\d\d\)\.$", term.Definition);
            Assert.DoesNotMatch(@"\.\s", term.Definition);
        }
    }

    [Fact]
    public void FirstUseOfEachTerm_LinksToItsEntry_AndNoEarlierUseIsLeftUnlinked()
    {
        var terms = Page.IndexOf("<section id=\"terms\">", StringComparison.Ordinal);
        var body = Page[Page.IndexOf("<body>", StringComparison.Ordinal)..terms];

        // The visible text of the page before the terms section, each link to a term kept as a marker.
        var marked = TermLink().Replace(body, m => "⟦" + m.Groups[1].Value + "⟧" + m.Groups[2].Value);
        var text = System.Net.WebUtility.HtmlDecode(Tag().Replace(marked, " "));
        foreach (var (id, names) in Uses)
        {
            var links = Regex.Count(body, $"<a href=\"#term-{id}\">");
            var firstUse = names.Select(n => Regex.Match(text, $@"(?<![\w-]){Regex.Escape(n)}(?![\w-])")).Where(m => m.Success).Select(m => m.Index).DefaultIfEmpty(-1).Min();
            if (firstUse < 0)
            {
                Assert.Equal(0, links);
                Assert.DoesNotContain($"id=\"term-{id}\"", Page, StringComparison.Ordinal);
                continue;
            }

            Assert.Equal(1, links);
            var marker = "⟦" + id + "⟧";
            Assert.True(text.IndexOf(marker, StringComparison.Ordinal) + marker.Length == firstUse, $"{id}: the first use is not the linked one");
            Assert.Contains($"<dt id=\"term-{id}\">", Page, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Links_AreNeverAddedInsideTagsOrTheTitle()
    {
        // Attributes (alt texts of the charts hold QLIKE and DM) stay plain, and every link points inside the page.
        foreach (Match alt in Regex.Matches(Page, "alt=\"([^\"]*)\""))
        {
            Assert.DoesNotContain("<a ", alt.Groups[1].Value, StringComparison.Ordinal);
        }

        Assert.DoesNotContain("<a ", Page[..Page.IndexOf("<body>", StringComparison.Ordinal)], StringComparison.Ordinal);
        Assert.All(Regex.Matches(Page, "<a href=\"([^\"]*)\"").Select(m => m.Groups[1].Value), href => Assert.StartsWith("#term-", href, StringComparison.Ordinal));
    }

    [GeneratedRegex("<a href=\"#term-([a-z-]+)\">([^<]*)</a>")]
    private static partial Regex TermLink();

    [GeneratedRegex("<[^>]*>")]
    private static partial Regex Tag();
}
