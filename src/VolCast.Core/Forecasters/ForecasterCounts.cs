namespace VolCast.Core.Forecasters;

/// <summary>Events a forecasting session counted: reported with the results so that no failure passes silently.</summary>
/// <param name="Refits">Model fits attempted.</param>
/// <param name="FailedFits">Fits that threw, did not converge or gave unusable coefficients; the previous good parameters were kept.</param>
/// <param name="NonStationaryFits">Fits whose persistence was not below one; the previous good parameters were kept.</param>
/// <param name="NegativeVarianceFallbacks">Forecasts whose fitted variance was not above zero and fell back to the long-run mean.</param>
public sealed record ForecasterCounts(int Refits, int FailedFits, int NonStationaryFits, int NegativeVarianceFallbacks)
{
    /// <summary>Gets the counts of a session that has done nothing worth counting.</summary>
    public static ForecasterCounts None { get; } = new(0, 0, 0, 0);
}
