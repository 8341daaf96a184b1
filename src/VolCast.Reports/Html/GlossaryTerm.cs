using System.Text.RegularExpressions;

namespace VolCast.Reports.Html;

/// <summary>One entry of the "Terms used" section.</summary>
/// <param name="Id">The anchor's suffix, such as <c>qlike</c>.</param>
/// <param name="Name">The term as the entry shows it.</param>
/// <param name="Definition">One plain sentence, with the paper (author year).</param>
/// <param name="Use">What counts as a use of the term in the page's text (its name or its abbreviation).</param>
internal sealed record GlossaryTerm(string Id, string Name, string Definition, Regex Use);
