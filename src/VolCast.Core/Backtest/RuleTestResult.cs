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
}
