namespace VolCast.Core.Cone;

/// <summary>A volatility cone: one row of percentiles per horizon, and the horizons that were too long for the sample.</summary>
/// <param name="ReturnCount">T, the number of daily log returns the cone was drawn from.</param>
/// <param name="AnnualizationFactor">A, trading days per year used to annualize.</param>
/// <param name="Horizons">The computed horizons, shortest first.</param>
/// <param name="SkippedHorizons">Requested horizons left out because the sample gives fewer than 2h windows.</param>
public sealed record VolatilityConeResult(
    int ReturnCount,
    double AnnualizationFactor,
    IReadOnlyList<ConeHorizon> Horizons,
    IReadOnlyList<int> SkippedHorizons);
