using System.Collections.Immutable;

namespace VolCast.Core.Calibration;

/// <summary>How well one forecaster's forecast move bands held: the standardized moves, their shares and the tests.</summary>
/// <remarks>
/// z_t = ln(S_{t+h}/S_t) / (σ_F √(h/A)); if the forecaster is calibrated, z is close to standard normal. Summary
/// numbers are over the dates with a forecast and are null when there are none. <see cref="ZScale"/> = √(mean z²)
/// is the factor by which the bands should have been wider (above 1) or narrower (below 1).
/// </remarks>
/// <param name="Spec">The forecaster's spec, as written in a configuration (for example <c>yang-zhang:21</c> or <c>implied</c>).</param>
/// <param name="HorizonDays">The horizon h in trading days.</param>
/// <param name="Count">Dates with a forecast.</param>
/// <param name="MissingCount">Dates without a forecast; their z is null.</param>
/// <param name="MissingDateIndices">Indices (into the aligned dates) of the missing dates.</param>
/// <param name="ZScale">√(mean z²).</param>
/// <param name="MaxAbsZ">The largest |z|.</param>
/// <param name="ShareAboveThree">Share of dates with |z| &gt; 3 (0.27% expected under a normal z).</param>
/// <param name="Levels">The |z| ≤ 1 and |z| ≤ 2 ranges.</param>
/// <param name="Z">z per aligned date, null where the forecaster had no value.</param>
public sealed record CoverageResult(
    string Spec,
    int HorizonDays,
    int Count,
    int MissingCount,
    ImmutableArray<int> MissingDateIndices,
    double? ZScale,
    double? MaxAbsZ,
    double? ShareAboveThree,
    ImmutableArray<CoverageLevelResult> Levels,
    ImmutableArray<double?> Z);
