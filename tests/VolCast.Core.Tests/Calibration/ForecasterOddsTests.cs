using VolCast.Core.Calibration;

namespace VolCast.Core.Tests.Calibration;

public sealed class ForecasterOddsTests
{
    [Fact]
    public void Score_TwoForecasters_GivesTheSameResultsAsTheSingleCalls()
    {
        var outcomes = CalibrationData.Outcomes(CalibrationData.Closes(9, 800, 0.2), 10);
        var a = CalibrationData.Constant("a", outcomes.Count, 0.18);
        var b = CalibrationData.Constant("b", outcomes.Count, 0.25);
        var options = new CalibrationOptions();

        var odds = new[] { a, b }.Select(f => BacktestCalibrator.Score(outcomes, f, options)).ToArray();

        Assert.Equal(["a", "b"], odds.Select(o => o.Spec).ToArray());
        Assert.Equal(["a", "b"], odds.Select(o => o.Calibration.Spec).ToArray());
        Assert.Equal(["a", "b"], odds.Select(o => o.Coverage.Spec).ToArray());
        Assert.Equal(ProbabilityCalibration.Evaluate(outcomes, b).Strikes[0].Decomposition, odds[1].Calibration.Strikes[0].Decomposition);
        Assert.Equal(MoveBandCoverage.Evaluate(outcomes, a).Levels[0], odds[0].Coverage.Levels[0]);
        Assert.Equal(CoverageVerdict.Describe(odds[0].Coverage), odds[0].Verdict);
        Assert.Empty(odds[0].Regimes);
    }
}
