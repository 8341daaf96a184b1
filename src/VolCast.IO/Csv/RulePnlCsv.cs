using VolCast.Core.Trading;
using VolCast.IO.Tables;

namespace VolCast.IO.Csv;

/// <summary>Writes <c>rule-pnl.csv</c>: the daily P&amp;L path of every rule, at both entry timings (<see cref="RulePnlTables.Paths"/>).</summary>
public static class RulePnlCsv
{
    /// <summary>Writes the table to a writer the caller owns.</summary>
    /// <param name="writer">Where the text goes.</param>
    /// <param name="report">The rule's trading backtest.</param>
    public static void Write(TextWriter writer, RulePnlReport report) =>
        RulePnlTables.Paths.WriteCsv(writer, RulePnlTables.PathRows(report));
}
