using System.Collections.Immutable;
using VolCast.Core.Calibration;

namespace VolCast.Core.Tests.Calibration;

/// <summary>
/// The call the backtest harness makes, written against the shapes of its per-date columns (dates, h_t with nulls
/// where the window had not closed, implied and each forecaster's values with nulls, realized volatility).
/// </summary>
public sealed class HarnessCallTests
{
    [Fact]
    public void HarnessCall_ColumnsOfABacktest_ScoresEveryForecasterOnTheClosedWindows()
    {
        const int h = 21;
        var prices = Some.GbmBars(seed: 5, days: 1500, dailyVolatility: 0.0126);
        var close = prices.Close.ToArray();
        var dates = prices.Dates[300..].ToArray().ToImmutableArray();
        var n = dates.Length;
        var windowDays = Enumerable.Range(0, n).Select(i => i + h < n ? (int?)h : null).ToImmutableArray();
        var realized = Enumerable.Range(0, n).Select(i => windowDays[i] is null ? (double?)null : 0.2).ToImmutableArray();
        var implied = Enumerable.Range(0, n).Select(i => i % 50 == 7 ? (double?)null : 0.22).ToImmutableArray();
        var ewma = Enumerable.Range(0, n).Select(i => (double?)0.19).ToImmutableArray();

        // The harness's call:
        var aligned = OutcomeAlignment.FromPrices(prices, dates, windowDays);
        var forecasters = new List<ForecasterVolatility> { aligned.Select("implied", implied), aligned.Select("ewma:0.94", ewma) };
        var report = CalibrationSuite.Evaluate(aligned.Outcomes, forecasters, new CalibrationOptions { AnnualizationFactor = 252 });
        var regimeValues = aligned.DateIndices.Select(k => realized[k]!.Value).ToArray();
        var regimes = CoverageRegimes.ByTerciles(report.Coverages[0], regimeValues);
        var verdict = CoverageVerdict.Describe(report.Coverages[0], regimes);

        Assert.Equal(n - h, aligned.Outcomes.Count);
        Assert.Equal(close[300 + 5], aligned.Outcomes.StartClose[5]);
        Assert.Equal(close[300 + 5 + h], aligned.Outcomes.EndClose[5]);
        // Implied is missing on every 50th date from 7: those on closed windows are counted and marked.
        var missingImplied = Enumerable.Range(0, n - h).Count(i => i % 50 == 7);
        Assert.Equal(missingImplied, report.Calibrations[0].MissingCount);
        Assert.Equal(missingImplied, report.Coverages[0].MissingCount);
        Assert.Equal(0, report.Coverages[1].MissingCount);
        Assert.Equal(5, report.Calibrations[1].Strikes.Length);
        Assert.Equal(3, regimes.Length);
        Assert.StartsWith("ranges from implied ", verdict, StringComparison.Ordinal);
        Assert.Contains($"{missingImplied} dates had no forecast", verdict, StringComparison.Ordinal);
    }
}
