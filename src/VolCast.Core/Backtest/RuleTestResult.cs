using System.Collections.Immutable;
using VolCast.Core.Trading;

namespace VolCast.Core.Backtest;

/// <summary>
/// The rule test "implied minus forecast above a threshold ⇒ sell volatility" (and the mirror for buying), with the
/// forecast and, side by side, a plain historical estimate in its place. NOT A TRADING P&amp;L: no costs, no
/// hedging path, overlapping windows.
/// </summary>
/// <remarks>
/// The per-date series (<see cref="Dates"/>, <see cref="Implied"/>, <see cref="Realized"/>, <see cref="Forecast"/>,
/// <see cref="Historical"/>) hold every number the rows are computed from, so a chart or a file can show them without
/// looking either source up among the result's forecasts (the historical estimate is often not one of them).
/// </remarks>
/// <param name="ThresholdVolatility">The threshold in volatility points (decimal; 0.02 = two vol points).</param>
/// <param name="ForecastSpec">The forecast the rule uses.</param>
/// <param name="HistoricalSpec">The plain historical estimate compared with it.</param>
/// <param name="Rows">For each source (forecast, then historical): all dates, sell signals, buy signals, all on <see cref="Dates"/>.</param>
/// <param name="Dates">The dates the rule test counts: scored dates where implied and both sources have a forecast above zero.</param>
/// <param name="Implied">Implied volatility on each of <see cref="Dates"/> (decimal).</param>
/// <param name="Realized">The realized target on each of <see cref="Dates"/> (decimal).</param>
/// <param name="Forecast">The rule forecast on each of <see cref="Dates"/> (decimal).</param>
/// <param name="Historical">The historical estimate on each of <see cref="Dates"/> (decimal).</param>
public sealed record RuleTestResult(
    double ThresholdVolatility,
    string ForecastSpec,
    string HistoricalSpec,
    ImmutableArray<RuleTestRow> Rows,
    ImmutableArray<DateOnly> Dates,
    ImmutableArray<double> Implied,
    ImmutableArray<double> Realized,
    ImmutableArray<double> Forecast,
    ImmutableArray<double> Historical)
{
    /// <summary>Gets the caution shown wherever the rule test is shown.</summary>
    public static string Caution { get; } =
        "Not a trading P&L: no transaction costs, no hedging path, overlapping windows; it says how often and by how much implied was above or below the realized volatility that followed when the rule fired.";

    /// <summary>Implied minus realized volatility (IV − RV, decimal) on the dates of one row of the rule forecast's signals, in date order.</summary>
    /// <param name="signal">All dates, or the dates where the rule forecast signalled selling or buying volatility.</param>
    /// <returns>The gaps; their count and mean are that row's <see cref="RuleTestRow.Count"/> and <see cref="RuleTestRow.MeanVolatilityGap"/>.</returns>
    public ImmutableArray<double> VolatilityGaps(RuleSignal signal)
    {
        var gaps = ImmutableArray.CreateBuilder<double>(Dates.Length);
        for (var i = 0; i < Dates.Length; i++)
        {
            if (signal == RuleSignal.AllDates || RuleTest.SignalOf(Implied[i], Forecast[i], ThresholdVolatility) == signal)
            {
                gaps.Add(Implied[i] - Realized[i]);
            }
        }

        return gaps.ToImmutable();
    }

    /// <summary>
    /// The difference the rule test asks about: mean IV − RV on the dates the rule forecast gave <paramref name="signal"/>
    /// minus the mean on all dates, with a Newey-West (Bartlett) standard error and a two-sided normal p-value.
    /// </summary>
    /// <remarks>
    /// The signalled dates are a share π of all dates, so the two means are not independent. The error is that of the
    /// delta method: the difference is the mean of d_t = s_t (g_t − μ_S) / π − (g_t − μ_A) + (μ_S − μ_A), where g_t is
    /// IV − RV, s_t is 1 on a signalled date and 0 otherwise, and μ_S and μ_A are the two means; its Newey-West
    /// long-run variance (Newey and West, 1987) allows for the overlapping windows.
    /// </remarks>
    /// <param name="signal">Sell or buy signals (all dates gives a difference of zero).</param>
    /// <param name="lag">The Newey-West lag (the run's HAC lag), capped at n − 1.</param>
    /// <returns>The difference (decimal) as the mean, its error and p; no error or p when no date signalled or every date did.</returns>
    public NeweyWestMeanTest SignalledMinusAll(RuleSignal signal, int lag)
    {
        var n = Dates.Length;
        var signalled = new bool[n];
        double sumAll = 0, sumSignalled = 0;
        var count = 0;
        for (var i = 0; i < n; i++)
        {
            var gap = Implied[i] - Realized[i];
            signalled[i] = signal == RuleSignal.AllDates || RuleTest.SignalOf(Implied[i], Forecast[i], ThresholdVolatility) == signal;
            sumAll += gap;
            if (signalled[i])
            {
                sumSignalled += gap;
                count++;
            }
        }

        if (count == 0 || count == n)
        {
            var same = count == 0 ? 0 : (sumSignalled / count) - (sumAll / n);
            return new NeweyWestMeanTest(n, Math.Max(0, Math.Min(lag, n - 1)), same, null, null, null);
        }

        var meanAll = sumAll / n;
        var meanSignalled = sumSignalled / count;
        var share = count / (double)n;
        var terms = new double[n];
        for (var i = 0; i < n; i++)
        {
            var gap = Implied[i] - Realized[i];
            terms[i] = ((signalled[i] ? (gap - meanSignalled) / share : 0) - (gap - meanAll)) + (meanSignalled - meanAll);
        }

        return PnlStatisticsCalculator.MeanTest(terms, lag);
    }
}
