using VolCast.Core.Calibration;

namespace VolCast.Core.Tests.Calibration;

public sealed class CalibrationSuiteTests
{
    [Fact]
    public void Evaluate_TwoForecasters_GivesTheSameResultsAsTheSingleCalls()
    {
        var outcomes = CalibrationData.Outcomes(CalibrationData.Closes(9, 800, 0.2), 10);
        var a = CalibrationData.Constant("a", outcomes.Count, 0.18);
        var b = CalibrationData.Constant("b", outcomes.Count, 0.25);

        var report = CalibrationSuite.Evaluate(outcomes, [a, b]);

        Assert.Equal(["a", "b"], report.Calibrations.Select(c => c.Forecaster).ToArray());
        Assert.Equal(["a", "b"], report.Coverages.Select(c => c.Forecaster).ToArray());
        Assert.Equal(ProbabilityCalibration.Evaluate(outcomes, b).Strikes[0].Decomposition, report.Calibrations[1].Strikes[0].Decomposition);
        Assert.Equal(ExpectedMoveCoverage.Evaluate(outcomes, a).Levels[0], report.Coverages[0].Levels[0]);
    }
}
