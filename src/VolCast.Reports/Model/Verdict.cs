namespace VolCast.Reports.Model;

/// <summary>The verdict in plain words: a headline and the points behind it.</summary>
/// <param name="Headline">The answer about implied: whether the best forecaster scores lower or higher than implied, by how much in words that grow with the gap, and whether that is significant.</param>
/// <param name="Points">In order: the head-to-head of candidate against baseline naming the winner on each loss, the model confidence set, the premium, the rule (with its option P&amp;L when run).</param>
internal sealed record Verdict(string Headline, IReadOnlyList<string> Points);
