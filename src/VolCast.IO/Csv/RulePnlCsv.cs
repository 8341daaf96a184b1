using VolCast.Core.Trading;
using VolCast.IO.Tables;

namespace VolCast.IO.Csv;

/// <summary>
/// Writes the daily P&amp;L paths of every rule: <c>rule-pnl.csv</c> for the trades entered at the firing close
/// (<see cref="RulePnlTables.Paths"/>) and <c>rule-pnl-next-day.csv</c> for those entered one trading day later
/// (<see cref="RulePnlTables.PathsNextDay"/>).
/// </summary>
public static class RulePnlCsv
{
    /// <summary>Writes the paths at the firing close to a writer the caller owns.</summary>
    /// <param name="writer">Where the text goes.</param>
    /// <param name="report">The rule's trading backtest.</param>
    public static void Write(TextWriter writer, RulePnlReport report) =>
        RulePnlTables.Paths.WriteCsv(writer, RulePnlTables.PathRows(report, nextDay: false));

    /// <summary>Writes the net paths of the trades entered one trading day later to a writer the caller owns.</summary>
    /// <param name="writer">Where the text goes.</param>
    /// <param name="report">The rule's trading backtest.</param>
    public static void WriteNextDay(TextWriter writer, RulePnlReport report) =>
        RulePnlTables.PathsNextDay.WriteCsv(writer, RulePnlTables.PathRows(report, nextDay: true));
}
