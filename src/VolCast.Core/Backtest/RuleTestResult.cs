using System.Collections.Immutable;

namespace VolCast.Core.Backtest;

/// <summary>
/// The rule test "implied minus forecast above a threshold ⇒ sell volatility" (and the mirror for buying), with the
/// forecast and, side by side, a plain historical estimate in its place. NOT A TRADING P&amp;L: no costs, no
/// hedging path, overlapping windows.
/// </summary>
/// <param name="ThresholdVolatility">The threshold in volatility points (decimal; 0.02 = two vol points).</param>
/// <param name="ForecastSpec">The forecast the rule uses.</param>
/// <param name="HistoricalSpec">The plain historical estimate compared with it.</param>
/// <param name="Rows">For each source (forecast, then historical): all dates, sell signals, buy signals, all on the dates where implied, both sources and a target exist.</param>
public sealed record RuleTestResult(double ThresholdVolatility, string ForecastSpec, string HistoricalSpec, ImmutableArray<RuleTestRow> Rows)
{
    /// <summary>Gets the caution shown wherever the rule test is shown.</summary>
    public static string Caution { get; } =
        "Not a trading P&L: no transaction costs, no hedging path, overlapping windows; it says how often and by how much implied was above or below the realized volatility that followed when the rule fired.";
}
