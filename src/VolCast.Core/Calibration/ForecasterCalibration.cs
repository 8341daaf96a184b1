using System.Collections.Immutable;

namespace VolCast.Core.Calibration;

/// <summary>The probability calibration of one forecaster at every configured strike.</summary>
/// <remarks>
/// When <see cref="Count"/> is zero (the forecaster has no value on any date) <see cref="Strikes"/> is empty.
/// </remarks>
/// <param name="Spec">The forecaster's spec, as written in a configuration (for example <c>yang-zhang:21</c> or <c>implied</c>).</param>
/// <param name="HorizonDays">The horizon h in trading days.</param>
/// <param name="Count">Dates scored (the forecaster had a value).</param>
/// <param name="MissingCount">Dates on which the forecaster had no value; they are not scored.</param>
/// <param name="MissingDateIndices">Indices (into the aligned dates) of the missing dates.</param>
/// <param name="Strikes">One result per moneyness, in the configured order.</param>
public sealed record ForecasterCalibration(
    string Spec,
    int HorizonDays,
    int Count,
    int MissingCount,
    ImmutableArray<int> MissingDateIndices,
    ImmutableArray<StrikeCalibration> Strikes);
