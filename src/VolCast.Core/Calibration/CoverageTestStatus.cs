namespace VolCast.Core.Calibration;

/// <summary>Whether the coverage tests could be computed.</summary>
public enum CoverageTestStatus
{
    /// <summary>The tests were computed.</summary>
    Computed,

    /// <summary>Too few non-overlapping dates with a forecast; the result says how many were needed.</summary>
    NotEnoughData,
}
