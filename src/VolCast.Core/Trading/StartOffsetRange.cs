namespace VolCast.Core.Trading;

/// <summary>
/// How much the one-at-a-time trade figures depend on the date of the first trade: each figure's lowest and highest
/// value over the h possible start offsets (the trade table and <see cref="RulePnl.TradeStatisticsNet"/> are the
/// first offset's). A figure is null when no start offset defines it (no trade, or too few for a skewness or a t).
/// </summary>
/// <param name="Starts">Number of start offsets tried (the horizon h in trading days).</param>
/// <param name="Trades">Number of trades.</param>
/// <param name="PnlPerYear">Sum of trade P&amp;L divided by the years of the path, vol points a year.</param>
/// <param name="HitRate">Share of trades above zero.</param>
/// <param name="MeanVolPoints">Mean P&amp;L per trade, vol points.</param>
/// <param name="MedianVolPoints">Median P&amp;L per trade, vol points.</param>
/// <param name="MeanPercentOfSpot">Mean P&amp;L per trade, percent of spot.</param>
/// <param name="MedianPercentOfSpot">Median P&amp;L per trade, percent of spot.</param>
/// <param name="MeanTStatistic">Newey-West t of the mean trade P&amp;L (lag 2 trades).</param>
/// <param name="WorstVolPoints">The worst trade, vol points.</param>
/// <param name="ExpectedShortfall5VolPoints">Mean of the worst 5% of trades, vol points.</param>
/// <param name="Skewness">Skewness of trade P&amp;L.</param>
/// <param name="PnlPerUnitStressLoss">Mean P&amp;L per unit of mean stress loss.</param>
public sealed record StartOffsetRange(
    int Starts,
    FigureRange Trades,
    FigureRange PnlPerYear,
    FigureRange? HitRate,
    FigureRange? MeanVolPoints,
    FigureRange? MedianVolPoints,
    FigureRange? MeanPercentOfSpot,
    FigureRange? MedianPercentOfSpot,
    FigureRange? MeanTStatistic,
    FigureRange? WorstVolPoints,
    FigureRange? ExpectedShortfall5VolPoints,
    FigureRange? Skewness,
    FigureRange? PnlPerUnitStressLoss)
{
    /// <summary>The range over the statistics of each start offset.</summary>
    /// <param name="byStart">Each start offset's trade statistics and P&amp;L per year; at least one.</param>
    /// <returns>The ranges.</returns>
    /// <exception cref="ArgumentException">No start offset.</exception>
    public static StartOffsetRange Over(IReadOnlyList<(TradeStatistics Statistics, double PnlPerYear)> byStart)
    {
        ArgumentNullException.ThrowIfNull(byStart);
        if (byStart.Count == 0)
        {
            throw new ArgumentException("The start-offset range needs at least one start offset.", nameof(byStart));
        }

        FigureRange? trades = null, perYear = null, hit = null, mean = null, median = null, meanPct = null, medianPct = null;
        FigureRange? t = null, worst = null, shortfall = null, skew = null, stress = null;
        foreach (var (s, year) in byStart)
        {
            trades = FigureRange.Include(trades, s.Count);
            perYear = FigureRange.Include(perYear, year);
            hit = FigureRange.Include(hit, s.HitRate);
            mean = FigureRange.Include(mean, s.MeanVolPoints);
            median = FigureRange.Include(median, s.MedianVolPoints);
            meanPct = FigureRange.Include(meanPct, s.MeanPercentOfSpot);
            medianPct = FigureRange.Include(medianPct, s.MedianPercentOfSpot);
            t = FigureRange.Include(t, s.MeanTest?.TStatistic);
            worst = FigureRange.Include(worst, s.WorstVolPoints);
            shortfall = FigureRange.Include(shortfall, s.ExpectedShortfall5VolPoints);
            skew = FigureRange.Include(skew, s.Skewness);
            stress = FigureRange.Include(stress, s.PnlPerUnitStressLoss);
        }

        return new StartOffsetRange(byStart.Count, trades!, perYear!, hit, mean, median, meanPct, medianPct, t, worst, shortfall, skew, stress);
    }
}
