using VolCast.Core.Backtest;
using VolCast.IO;

namespace VolCast.Cli;

/// <summary>One unit of backtest work: one asset's input files, one resolved configuration, one output folder.</summary>
/// <param name="Prices">The price file, as the user gave it.</param>
/// <param name="Implied">The implied-volatility file, or null to rank forecasters among themselves.</param>
/// <param name="ImpliedUnit">The unit of the implied file's iv column.</param>
/// <param name="Settings">The resolved settings.</param>
/// <param name="Config">The configuration file the settings came from, if any (its SHA-256 goes into run.json).</param>
/// <param name="OutputFolder">The folder to write; it must not exist unless <paramref name="Force"/> is set.</param>
/// <param name="Force">Whether an existing output folder may be used, replacing only the tool's own files (those in its run.json manifest).</param>
internal sealed record BacktestJob(
    string Prices,
    string? Implied,
    ImpliedUnit ImpliedUnit,
    BacktestSettings Settings,
    string? Config,
    string OutputFolder,
    bool Force)
{
    /// <summary>Gets the price file's bytes when the caller has already read them (the batch hashes them first), or null to read the file.</summary>
    public InputBytes? PricesRead { get; init; }

    /// <summary>Gets the implied file's bytes when already read, or null.</summary>
    public InputBytes? ImpliedRead { get; init; }

    /// <summary>Gets how the price and implied files are written (date format, delimiter, decimal separator).</summary>
    public CsvFormat Format { get; init; } = CsvFormat.Default;

    /// <summary>Gets the implied series' declared tenor in calendar days, or null when it is the backtest's own.</summary>
    public int? ImpliedTenorDays { get; init; }

    /// <summary>Gets how rows that fail a row check and suspect rows are treated (default: refuse bad rows, warn about suspect ones).</summary>
    public DataChecks Checks { get; init; } = DataChecks.Default;

    /// <summary>Gets whether results.xlsx is written beside the CSV files.</summary>
    public bool Workbook { get; init; }

    /// <summary>Gets the configuration file's SHA-256 when already known, or null to hash the file.</summary>
    public string? ConfigSha256 { get; init; }

    /// <summary>Gets whether the report page and its charts are drawn (the batch may leave them to the summary page).</summary>
    public bool WriteReport { get; init; } = true;

    /// <summary>
    /// Gets how many threads the run keeps busy at once: 0 (the default) for one per core; a batch that keeps every core
    /// busy with names passes 1. That many forecaster sessions run at the same time, and with two or more the rule's
    /// trades are computed beside the grouped scores and the odds checks, and the P&amp;L charts drawn beside the others.
    /// </summary>
    public int Threads { get; init; }

    /// <summary>Gets the file of the user's own forecasts (date, NAME1, NAME2, …), or null.</summary>
    public string? Forecasts { get; init; }

    /// <summary>Gets the unit of the forecasts file's values.</summary>
    public ImpliedUnit ForecastsUnit { get; init; } = ImpliedUnit.Infer;

    /// <summary>Gets the events file (dates whose forecast windows are scored apart), or null.</summary>
    public string? Events { get; init; }

    /// <summary>Gets every input file of the job.</summary>
    public IEnumerable<string> Inputs =>
        new[] { Prices, Implied, Config, Forecasts, Events }.OfType<string>();
}
