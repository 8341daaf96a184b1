using System.Collections.Immutable;

namespace VolCast.Core.Calibration;

/// <summary>The probability calibration and range coverage of every forecaster of a run, in the order given.</summary>
/// <param name="Calibrations">One probability-calibration result per forecaster.</param>
/// <param name="Coverages">One coverage result per forecaster.</param>
public sealed record CalibrationReport(
    ImmutableArray<ForecasterCalibration> Calibrations,
    ImmutableArray<CoverageResult> Coverages);
