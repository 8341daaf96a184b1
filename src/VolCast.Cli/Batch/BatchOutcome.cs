using VolCast.IO.Results;

namespace VolCast.Cli.Batch;

/// <summary>What a batch did.</summary>
/// <param name="Rows">The summary rows of the assets that finished (or failed), in name order; all assets unless cancelled.</param>
/// <param name="Computed">Assets whose backtest ran in this batch.</param>
/// <param name="Reused">Assets whose complete, up-to-date results were kept.</param>
/// <param name="Failed">Assets that failed.</param>
/// <param name="Cancelled">Whether the batch was stopped before every asset finished or before its summary was in place (no summary is written then).</param>
internal sealed record BatchOutcome(IReadOnlyList<BatchAssetRow> Rows, int Computed, int Reused, int Failed, bool Cancelled);
