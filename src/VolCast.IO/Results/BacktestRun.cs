using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Data;
using VolCast.Core.Trading;

namespace VolCast.IO.Results;

/// <summary>
/// One finished backtest run, everything its writers need: the data files (<see cref="BacktestResultsWriter"/>) and
/// the report are written from this one record.
/// </summary>
/// <param name="Result">The backtest result.</param>
/// <param name="Calibration">The probability-calibration and range-coverage checks of the same run (<see cref="BacktestCalibrator.Evaluate"/>).</param>
/// <param name="Info">Tool version, inputs with their SHA-256, times, implied unit and input warnings (run.json).</param>
/// <param name="Prices">The price history the backtest ran on (the cone is drawn from its closes).</param>
/// <param name="PriceRowsRead">Data rows read from the price file, for the data-quality section.</param>
public sealed record BacktestRun(
    BacktestResult Result,
    BacktestCalibration Calibration,
    BacktestRunInfo Info,
    PriceHistory Prices,
    int PriceRowsRead)
{
    /// <summary>Gets the rule as delta-hedged option trades, or null when it was not run (see <see cref="RulePnlAbsence"/>).</summary>
    public RulePnlReport? RulePnl { get; init; }

    /// <summary>Gets the input rows left out of the run, with their reasons (written to rejected-rows.csv when there are any).</summary>
    public IReadOnlyList<VolCast.IO.RejectedRow> RejectedRows { get; init; } = [];

    /// <summary>Gets why <see cref="RulePnl"/> is null (for example: no implied series was given), or null when it was run.</summary>
    public string? RulePnlAbsence { get; init; }

    /// <summary>Gets the results by calendar year, by volatility regime and by event windows (<see cref="GroupedScores.Compute"/>).</summary>
    public GroupedResults Groups { get; init; } = GroupedResults.Empty;
}
