namespace VolCast.IO.Results;

/// <summary>The adaptive lookback choice of one estimator family on one asset, reduced to its most chosen lookback and how stable the choice was.</summary>
/// <param name="Family">The estimator family, for example <c>yang-zhang</c>.</param>
/// <param name="MostChosen">The spec chosen on the most dates (the first listed wins a tie).</param>
/// <param name="Share">The share of dates with a choice on which <paramref name="MostChosen"/> was chosen, 0 to 1.</param>
/// <param name="Changes">How many times the choice changed from one date to the next.</param>
public sealed record BatchLookback(string Family, string MostChosen, double Share, int Changes);
