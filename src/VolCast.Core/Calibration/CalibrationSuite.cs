using System.Collections.Immutable;

namespace VolCast.Core.Calibration;

/// <summary>Runs the probability-calibration and coverage checks for many forecasters on the same outcomes.</summary>
public static class CalibrationSuite
{
    /// <summary>Scores every forecaster's probabilities and ranges against the same closes.</summary>
    /// <param name="outcomes">The closes at t and t + h.</param>
    /// <param name="forecasters">Each forecaster's volatility, aligned with <paramref name="outcomes"/> (implied included, if any).</param>
    /// <param name="options">Strikes, drift, bins and the minimum sample; the defaults when null.</param>
    /// <returns>Results in the order of <paramref name="forecasters"/>.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">A series is not aligned, or an option is invalid.</exception>
    public static CalibrationReport Evaluate(HorizonOutcomes outcomes, IReadOnlyList<ForecasterVolatility> forecasters, CalibrationOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(outcomes);
        ArgumentNullException.ThrowIfNull(forecasters);
        options ??= new CalibrationOptions();
        options.Validate();
        var calibrations = ImmutableArray.CreateBuilder<ForecasterCalibration>(forecasters.Count);
        var coverages = ImmutableArray.CreateBuilder<CoverageResult>(forecasters.Count);
        foreach (var forecaster in forecasters)
        {
            ArgumentNullException.ThrowIfNull(forecaster);
            calibrations.Add(ProbabilityCalibration.Evaluate(outcomes, forecaster, options));
            coverages.Add(ExpectedMoveCoverage.Evaluate(outcomes, forecaster, options));
        }

        return new CalibrationReport(calibrations.MoveToImmutable(), coverages.MoveToImmutable());
    }
}
