namespace VolCast.Core.Calibration;

/// <summary>
/// The backtest of one forecast move band, |z| ≤ bound, whose nominal coverage under a calibrated forecast is
/// 2N(bound) − 1 (68.27% for 1, 95.45% for 2). A failure is |z| &gt; bound.
/// </summary>
/// <remarks>
/// <see cref="ShareWithin"/> uses every date with a forecast (overlapping windows; a fair share, but its draws are
/// not independent). The tests use non-overlapping dates only: every h-th aligned date from the first (indices 0, h,
/// 2h, …; with a per-date horizon, the next sampled date is t + h_t), skipping a sampled date with no forecast; Christoffersen's transitions are counted only between
/// consecutive sampled dates that both have a forecast, so a gap never joins two distant dates. When fewer than the
/// configured minimum of sampled dates have a forecast, <see cref="Status"/> is
/// <see cref="CoverageTestStatus.NotEnoughData"/> and the three tests are null.
/// </remarks>
/// <param name="Bound">The bound on |z|: 1 or 2.</param>
/// <param name="NominalCoverage">2N(bound) − 1.</param>
/// <param name="ShareWithin">Share of all dates with a forecast where |z| ≤ bound.</param>
/// <param name="Status">Whether the tests were computed.</param>
/// <param name="NonOverlappingCount">Non-overlapping dates with a forecast used by the tests.</param>
/// <param name="SamplesNeeded">The minimum number of non-overlapping dates the tests need.</param>
/// <param name="Failures">Failures among the non-overlapping dates.</param>
/// <param name="Kupiec">Kupiec's proportion-of-failures test, or null when not enough data.</param>
/// <param name="Independence">Christoffersen's independence test, or null when not enough data.</param>
/// <param name="ConditionalCoverage">Christoffersen's conditional-coverage test, or null when not enough data.</param>
public sealed record CoverageLevelResult(
    double Bound,
    double NominalCoverage,
    double? ShareWithin,
    CoverageTestStatus Status,
    int NonOverlappingCount,
    int SamplesNeeded,
    int Failures,
    LikelihoodRatioTest? Kupiec,
    LikelihoodRatioTest? Independence,
    LikelihoodRatioTest? ConditionalCoverage);
