using VolCast.IO.Results;

namespace VolCast.Cli.Batch;

/// <summary>What the reduce found and wrote.</summary>
/// <param name="Rows">One row per name in name order (a missing name is a row marked not finished), as written to the summary.</param>
/// <param name="Missing">Names with no complete, up-to-date results and no recorded failure, each with why.</param>
/// <param name="Failed">Names that failed (their recorded failure, or a name that cannot be used).</param>
/// <param name="Written">Whether the summary was written (every name finished, or --allow-missing).</param>
internal sealed record BatchReduceOutcome(IReadOnlyList<BatchAssetRow> Rows, IReadOnlyList<string> Missing, int Failed, bool Written)
{
    /// <summary>Gets which report pages the summary has (from the options given, or else from the shards' plan).</summary>
    public BatchReports Reports { get; init; } = BatchReports.Full;

    /// <summary>Gets what the user should know about how the names were checked or which were left out, one sentence each.</summary>
    public IReadOnlyList<string> Warnings { get; init; } = [];
}
