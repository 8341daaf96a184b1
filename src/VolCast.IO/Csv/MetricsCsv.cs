using VolCast.Core.Backtest;
using VolCast.IO.Tables;

namespace VolCast.IO.Csv;

/// <summary>Writes metrics.csv: the forecaster table (<see cref="ForecasterTable"/>), one row per forecaster, implied first; the dm_* columns are versus implied.</summary>
internal static class MetricsCsv
{
    /// <summary>Gets the column names.</summary>
    public static IReadOnlyList<string> Columns => ForecasterTable.Definition.Names;

    public static void Write(TextWriter writer, BacktestResult result) =>
        ForecasterTable.Definition.WriteCsv(writer, ForecasterTable.Rows(result));
}
