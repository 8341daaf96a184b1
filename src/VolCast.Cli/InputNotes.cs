using System.Collections.Immutable;
using System.Globalization;
using VolCast.IO;

namespace VolCast.Cli;

/// <summary>Statements about how the inputs were read that a reader of the report needs (not defects): shown in the console and in the report's data section.</summary>
internal static class InputNotes
{
    /// <summary>The notes of one job's inputs.</summary>
    /// <param name="job">The job (its settings say whether the default forecaster list is used).</param>
    /// <param name="inputs">The inputs as the run uses them.</param>
    /// <returns>The notes, in a fixed order.</returns>
    public static ImmutableArray<string> For(BacktestJob job, CheckedInputs inputs)
    {
        var notes = ImmutableArray.CreateBuilder<string>();
        var prices = inputs.Prices;
        if (prices.AdjustedCloseApplied)
        {
            notes.Add($"{job.Prices}: the adj_close column was applied: each row's open, high, low and close were multiplied by adj_close / close, so splits and dividends do not show as jumps and every price in this run is an adjusted price.");
        }

        if (!prices.History.HasRange && job.Settings.Forecasters.IsDefaultOrEmpty)
        {
            notes.Add($"{job.Prices}: the file has closes only (no open, high, low), so the default forecaster list uses close-to-close:63 in place of yang-zhang:21, which needs the day's range; the range estimators are left out of the lookback sweep as well.");
        }

        if (inputs.Rejected.Count > 0)
        {
            var bad = inputs.Rejected.Count(r => r.Kind == RejectedRow.BadRow);
            notes.Add(string.Create(CultureInfo.InvariantCulture,
                $"{inputs.Rejected.Count} input row(s) were left out of the run ({bad} failing the row checks, {inputs.Rejected.Count - bad} suspect); each is listed with its reason in rejected-rows.csv."));
        }

        return notes.ToImmutable();
    }
}
