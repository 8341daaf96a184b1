using VolCast.Core.Backtest;
using VolCast.IO;

namespace VolCast.Cli.Batch;

/// <summary>A whole batch: where the inputs are, the one configuration every asset runs with, and where the results go.</summary>
/// <param name="PricesFolder">The folder of price files, one <c>NAME.csv</c> per asset.</param>
/// <param name="ImpliedFolder">The folder of implied files matched by name, or null.</param>
/// <param name="ImpliedUnit">The unit of every implied file's iv column.</param>
/// <param name="Settings">The resolved settings, the same for every asset.</param>
/// <param name="Config">The configuration file the settings came from, if any.</param>
/// <param name="OutputFolder">The batch's folder: <c>assets/NAME/</c>, summary.csv, lookbacks.csv, beats-implied.csv and summary.html go here.</param>
/// <param name="Jobs">How many assets run at the same time (at least 1).</param>
/// <param name="Force">Recompute every asset even when its results are complete and up to date.</param>
internal sealed record BatchRequest(
    string PricesFolder,
    string? ImpliedFolder,
    ImpliedUnit ImpliedUnit,
    BacktestSettings Settings,
    string? Config,
    string OutputFolder,
    int Jobs,
    bool Force)
{
    /// <summary>Gets how every price and implied file is written (date format, delimiter, decimal separator).</summary>
    public CsvFormat Format { get; init; } = CsvFormat.Default;

    /// <summary>Gets the implied files' declared tenor in calendar days, or null when it is the backtest's own.</summary>
    public int? ImpliedTenorDays { get; init; }

    /// <summary>Gets the shard this process computes, or null for every name.</summary>
    public BatchShard? Shard { get; init; }

    /// <summary>Gets which report pages are drawn.</summary>
    public BatchReports Reports { get; init; } = BatchReports.Full;

    /// <summary>Gets how each name's bad and suspect rows are treated (default: refuse bad rows, warn about suspect ones).</summary>
    public DataChecks Checks { get; init; } = DataChecks.Default;

    /// <summary>Gets whether each name also gets results.xlsx.</summary>
    public bool Workbook { get; init; }
}
