namespace VolCast.Reports.Model;

/// <summary>The verdict in plain words: a headline and the points behind it.</summary>
/// <param name="Headline">One sentence a reader can act on, e.g. which forecaster ranks first and whether it beats implied.</param>
/// <param name="Points">Short sentences: the margin and its significance, the model confidence set, the lookback choice and its stability, the baseline-vs-candidate result.</param>
internal sealed record Verdict(string Headline, IReadOnlyList<string> Points);
