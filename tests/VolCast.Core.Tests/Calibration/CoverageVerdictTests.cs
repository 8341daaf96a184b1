using VolCast.Core.Calibration;

namespace VolCast.Core.Tests.Calibration;

public sealed class CoverageVerdictTests
{
    [Fact]
    public void Describe_VolatilityTooHigh_SaysTooWideByAbout()
    {
        // σ_F = 0.3 against a true 0.2: z scale ≈ 0.2/0.3, so the ranges were about 1/0.667 − 1 = 50% too wide [D].
        var outcomes = CalibrationData.Outcomes(CalibrationData.Closes(11, 5000, 0.2), 21);
        var coverage = MoveBandCoverage.Evaluate(outcomes, CalibrationData.Constant("implied", outcomes.Count, 0.3));

        var text = CoverageVerdict.Describe(coverage);

        Assert.StartsWith("move bands from implied were too wide by about", text, StringComparison.Ordinal);
        Assert.Contains("against 68% expected", text, StringComparison.Ordinal);
        Assert.Contains("238 non-overlapping dates", text, StringComparison.Ordinal);
        Assert.InRange(1 / coverage.ZScale!.Value - 1, 0.35, 0.65);
        // The percentage is read off the spread of z, which the sentence states so a reader can see where it comes from.
        Assert.Contains($"(the spread of z was {coverage.ZScale.Value.ToString("0.00", System.Globalization.CultureInfo.InvariantCulture)}, against 1 for calibrated bands)", text, StringComparison.Ordinal);
    }

    [Fact]
    public void Describe_ExactVolatilityNotRejected_SaysHeldAsForecast()
    {
        var outcomes = CalibrationData.Outcomes(CalibrationData.Closes(1, 5000, 0.2), 21);
        var coverage = MoveBandCoverage.Evaluate(outcomes, CalibrationData.Constant("garch", outcomes.Count, 0.2));
        Assert.True(coverage.Levels[0].Kupiec!.PValue >= 0.05, "seed 1 should not be rejected");

        Assert.StartsWith("move bands from garch held as forecast: |z| ≤ 1 held", CoverageVerdict.Describe(coverage), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("implied", "; 10 dates had no implied quote and were not scored")]
    [InlineData("garch", "; 10 dates had no forecast and were not scored")]
    public void Describe_MissingDates_AreMissingQuotesForImpliedAndMissingForecastsForTheRest(string spec, string expected)
    {
        // Implied is quoted by the market, not forecast: its missing dates are said as such.
        var outcomes = CalibrationData.Outcomes(CalibrationData.Closes(1, 1000, 0.2), 21);
        var values = new double?[outcomes.Count];
        for (var t = 10; t < values.Length; t++)
        {
            values[t] = 0.2;
        }

        var text = CoverageVerdict.Describe(MoveBandCoverage.Evaluate(outcomes, new ForecasterVolatility(spec, values)));

        Assert.Contains(expected, text, StringComparison.Ordinal);
    }

    [Fact]
    public void Describe_NoForecastAtAll_SaysItCouldNotBeChecked()
    {
        var outcomes = new HorizonOutcomes(1, [100, 100], [101, 99]);
        var coverage = MoveBandCoverage.Evaluate(outcomes, new ForecasterVolatility("har", new double?[2]));

        Assert.Equal("move bands from har could not be checked: the forecaster had no value on any of the 2 dates", CoverageVerdict.Describe(coverage));
    }

    [Fact]
    public void Describe_WithRegimes_NamesTheHighThirdOfRealizedVolatilityInHindsightWhereRangesWereTooNarrow()
    {
        // h = 1, σ_F = 0.2: the first 40 dates do not move (z = 0), the last 20 move by 5% (z ≈ 3.97), and the regime
        // variable is the date index, so the top third (stressed) holds exactly the big moves.
        var n = 60;
        var start = Enumerable.Repeat(100.0, n).ToArray();
        var end = Enumerable.Range(0, n).Select(t => t < 40 ? 100.0 : 105.0).ToArray();
        var coverage = MoveBandCoverage.Evaluate(new HorizonOutcomes(1, start, end), CalibrationData.Constant("yang-zhang:21", n, 0.2));
        var regimes = CoverageRegimes.ByTerciles(coverage, Enumerable.Range(0, n).Select(t => (double)t).ToArray());

        Assert.Equal(["calm", "middle", "stressed"], regimes.Select(r => r.Label).ToArray());
        Assert.All(regimes, r => Assert.Equal(20, r.Count));
        Assert.Equal(1.0, regimes[0].ShareWithinOne);
        Assert.Equal(0.0, regimes[2].ShareWithinOne);
        Assert.Equal(40.0, regimes[2].Lower);
        Assert.Equal(59.0, regimes[2].Upper);
        Assert.Contains("too narrow in the high third of realized volatility, known in hindsight (|z| ≤ 1 held 0%)", CoverageVerdict.Describe(coverage, regimes), StringComparison.Ordinal);
    }

    [Fact]
    public void ByTerciles_RegimeValuesNotAligned_Throws()
    {
        var coverage = MoveBandCoverage.Evaluate(new HorizonOutcomes(1, [100, 100], [101, 99]), CalibrationData.Constant("x", 2, 0.2));

        Assert.Throws<ArgumentException>(() => CoverageRegimes.ByTerciles(coverage, [1.0]));
    }
}
