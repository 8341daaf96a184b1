using VolCast.IO.Results;

namespace VolCast.Cli.Scan;

/// <summary>What a scan did.</summary>
/// <param name="Rows">The summary rows of the assets that finished (or failed), in name order; all assets unless cancelled.</param>
/// <param name="Computed">Assets whose backtest ran in this scan.</param>
/// <param name="Reused">Assets whose complete, up-to-date results were kept.</param>
/// <param name="Failed">Assets that failed.</param>
/// <param name="Cancelled">Whether the scan was stopped before every asset finished (no summary is written then).</param>
internal sealed record ScanOutcome(IReadOnlyList<ScanAssetRow> Rows, int Computed, int Reused, int Failed, bool Cancelled);
