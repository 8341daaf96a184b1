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
/// <param name="Force">Whether an existing output folder may be used, replacing only the tool's own files.</param>
internal sealed record BacktestJob(
    string Prices,
    string? Implied,
    ImpliedUnit ImpliedUnit,
    BacktestSettings Settings,
    string? Config,
    string OutputFolder,
    bool Force);
