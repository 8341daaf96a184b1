using VolCast.Core.Trading;
using VolCast.IO.Tables;

namespace VolCast.IO.Csv;

/// <summary>Writes <c>trades.csv</c>: one row per delta-hedged straddle of every rule, at both entry timings (<see cref="RulePnlTables.Trades"/>).</summary>
public static class TradesCsv
{
    /// <summary>Writes the table to a writer the caller owns.</summary>
    /// <param name="writer">Where the text goes.</param>
    /// <param name="report">The rule's trading backtest.</param>
    public static void Write(TextWriter writer, RulePnlReport report) =>
        RulePnlTables.Trades.WriteCsv(writer, RulePnlTables.TradeRows(report));
}
