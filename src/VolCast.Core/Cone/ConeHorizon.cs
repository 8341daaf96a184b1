namespace VolCast.Core.Cone;

/// <summary>One horizon of a volatility cone: the spread of realized volatility over every h-day window.</summary>
/// <param name="HorizonDays">h, the window length in trading days.</param>
/// <param name="WindowCount">n = T − h + 1, the number of overlapping windows.</param>
/// <param name="VarianceFactor">The Hodges-Tompkins factor m that multiplies each window's variance in <see cref="Adjusted"/>.</param>
/// <param name="Raw">Percentiles of the zero-mean annualized window volatilities, unadjusted.</param>
/// <param name="Adjusted">The same percentiles after the overlapping-window adjustment: <see cref="Raw"/> × √m.</param>
/// <param name="Latest">The volatility of the most recent window (unadjusted), to show where today sits in the cone.</param>
public sealed record ConeHorizon(
    int HorizonDays,
    int WindowCount,
    double VarianceFactor,
    ConePercentiles Raw,
    ConePercentiles Adjusted,
    double Latest);
