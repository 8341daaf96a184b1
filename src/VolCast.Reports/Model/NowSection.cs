namespace VolCast.Reports.Model;

/// <summary>The report's "Now" section: today's reading of the data, labelled as a reading and not a recommendation.</summary>
/// <param name="Caution">The sentence that says what the section is and is not.</param>
/// <param name="Points">Sentences in plain words: the date, implied, the realized volatility just past and its place in the cone.</param>
/// <param name="Tables">The forecasters' table and the rules' table.</param>
internal sealed record NowSection(string Caution, IReadOnlyList<string> Points, IReadOnlyList<TextTable> Tables);
