namespace VolCast.Core.Trading;

/// <summary>Statistics of a rule's trades (one at a time, from the first start date), in vol points and percent of spot.</summary>
/// <remarks>
/// Expected shortfall at 5% is the mean of the worst ⌈0.05·n⌉ trades; skewness is m₃ / m₂^{3/2} (moments about the mean,
/// divisor n). Every value that needs a trade is null when the rule made none.
/// </remarks>
/// <param name="Count">Number of trades.</param>
/// <param name="HitRate">Share of trades with a P&amp;L above zero.</param>
/// <param name="MeanVolPoints">Mean P&amp;L per trade in vol points.</param>
/// <param name="MedianVolPoints">Median P&amp;L per trade in vol points.</param>
/// <param name="MeanPercentOfSpot">Mean P&amp;L per trade in percent of the entry spot.</param>
/// <param name="MedianPercentOfSpot">Median P&amp;L per trade in percent of the entry spot.</param>
/// <param name="WorstVolPoints">The worst trade's P&amp;L in vol points.</param>
/// <param name="WorstEntryDate">Entry date of the worst trade.</param>
/// <param name="ExpectedShortfall5VolPoints">Mean of the worst 5% of trades (at least one), vol points.</param>
/// <param name="Skewness">Skewness of trade P&amp;L; null with fewer than three trades or no spread.</param>
/// <param name="MeanTest">Newey-West t-test of the mean trade P&amp;L (lag 2 trades); null with fewer than two trades.</param>
/// <param name="PnlPerUnitStressLoss">Mean P&amp;L ÷ mean stress loss per trade; null when the mean stress is not a loss.</param>
public sealed record TradeStatistics(
    int Count,
    double? HitRate,
    double? MeanVolPoints,
    double? MedianVolPoints,
    double? MeanPercentOfSpot,
    double? MedianPercentOfSpot,
    double? WorstVolPoints,
    DateOnly? WorstEntryDate,
    double? ExpectedShortfall5VolPoints,
    double? Skewness,
    NeweyWestMeanTest? MeanTest,
    double? PnlPerUnitStressLoss);
