namespace VolCast.Cli.Batch;

/// <summary>Where a batch stands after an asset finishes.</summary>
/// <param name="Done">Assets finished successfully (computed or reused).</param>
/// <param name="Reused">Of <paramref name="Done"/>, assets whose complete results were kept from an earlier run.</param>
/// <param name="Failed">Assets that failed.</param>
/// <param name="Total">All assets.</param>
/// <param name="Elapsed">Time since the batch started.</param>
/// <param name="EstimatedRemaining">Estimated time left, from the pace of the assets computed so far; null before one is.</param>
/// <param name="Last">The asset that just finished.</param>
internal sealed record BatchProgress(int Done, int Reused, int Failed, int Total, TimeSpan Elapsed, TimeSpan? EstimatedRemaining, string Last)
{
    /// <summary>Gets the assets not finished yet.</summary>
    public int Remaining => Total - Done - Failed;
}
