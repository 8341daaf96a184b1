using System.Collections.Immutable;

namespace VolCast.IO.Results;

/// <summary>What run.json records besides the resolved settings: the tool version, the inputs and their hashes, and the times.</summary>
/// <param name="ToolVersion">The version of volcast that ran.</param>
/// <param name="Inputs">The input files with their SHA-256.</param>
/// <param name="StartedUtc">When the run started.</param>
/// <param name="FinishedUtc">When the computation finished (before the files were written).</param>
/// <param name="ImpliedUnit">The unit the implied file was read in (<c>percent</c> or <c>decimal</c>) and whether it was inferred, or null without implied.</param>
/// <param name="InputWarnings">Warnings raised while reading the inputs, repeated in the summary.</param>
public sealed record BacktestRunInfo(
    string ToolVersion,
    ImmutableArray<InputFileInfo> Inputs,
    DateTimeOffset StartedUtc,
    DateTimeOffset FinishedUtc,
    string? ImpliedUnit,
    ImmutableArray<string> InputWarnings)
{
    /// <summary>Gets statements about how the inputs were read (the adjusted-close scaling, a default forecaster replaced on a close-only file, rows left out), repeated in the report's data section.</summary>
    public ImmutableArray<string> InputNotes { get; init; } = [];

    /// <summary>Gets what was done with suspect rows: <c>warn</c>, <c>drop</c> or <c>stop</c>.</summary>
    public string Suspect { get; init; } = "warn";

    /// <summary>Gets how many rows were left out (bad rows with --skip-bad-rows, suspect rows with --suspect drop); they are listed in rejected-rows.csv.</summary>
    public int RowsLeftOut { get; init; }

    /// <summary>Gets how the price and implied files are written (date format, delimiter, decimal separator), the default ISO form unless one was declared.</summary>
    public CsvFormat InputFormat { get; init; } = CsvFormat.Default;
}
