using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Data;
using VolCast.Core.Tests.Backtest;

namespace VolCast.Core.Tests.Calibration;

public sealed class BacktestCalibratorTests
{
    private static BacktestSettings Settings(BacktestHorizon horizon) => new()
    {
        Horizon = horizon,
        Forecasters = ["close-to-close:21", "ewma:0.94"],
        Sweep = false,
        McsReplications = 200,
    };

    [Fact]
    public void Evaluate_BacktestWithImplied_ScoresImpliedThenEveryForecastOnTheClosedWindows()
    {
        var (prices, implied) = BacktestData.GarchWithTrueImplied(1200, 21, seed: 3);
        var result = Backtester.Run(prices, implied, Settings(BacktestHorizon.Days(21)));

        var calibration = BacktestCalibrator.Evaluate(result, prices);

        var names = new[] { "implied" }.Concat(result.Forecasts.Select(f => f.Spec)).ToArray();
        Assert.Equal(names, calibration.Forecasters.Select(f => f.Spec).ToArray());
        Assert.Equal(names, calibration.Forecasters.Select(f => f.Calibration.Spec).ToArray());
        Assert.Equal(names, calibration.Forecasters.Select(f => f.Coverage.Spec).ToArray());

        // The dates are exactly those whose window closed, with S_t and S_{t+21} from the history.
        var closed = Enumerable.Range(0, result.Dates.Length).Where(i => result.WindowDays[i] is not null).ToArray();
        Assert.Equal(closed, calibration.Aligned.DateIndices.ToArray());
        var close = prices.Close.ToArray();
        var dates = prices.Dates.ToArray();
        var k = closed[^1];
        var j = Array.IndexOf(dates, result.Dates[k]);
        Assert.Equal(close[j], calibration.Aligned.Outcomes.StartClose[^1]);
        Assert.Equal(close[j + 21], calibration.Aligned.Outcomes.EndClose[^1]);

        // Same numbers as the aligned-array call on the same columns.
        var direct = MoveBandCoverage.Evaluate(calibration.Aligned.Outcomes, calibration.Aligned.Select("ewma:0.94", result.Forecasts[1].Values));
        Assert.Equal(direct.ZScale, calibration.Forecasters[2].Coverage.ZScale);
        Assert.Equal(direct.Levels[0], calibration.Forecasters[2].Coverage.Levels[0]);

        // Lookback forecasters have a warm-up with no value: counted, not dropped.
        var warmUp = closed.Count(i => result.Forecasts[0].Values[i] is null);
        Assert.Equal(warmUp, calibration.Forecasters[1].Coverage.MissingCount);
        Assert.All(calibration.Forecasters, f => Assert.Equal(0, f.InvalidValueCount));
        Assert.All(calibration.Forecasters, f => Assert.Equal(3, f.Regimes.Length));
    }

    [Fact]
    public void Evaluate_ImpliedMissingOnSomeDates_CountsThemInBothChecksAndNamesThemInTheVerdict()
    {
        var (prices, full) = BacktestData.GarchWithTrueImplied(1200, 21, seed: 3);
        // Implied is missing on every 50th quote from the 7th; the forecasters are not.
        var keep = Enumerable.Range(0, full.Count).Where(i => i % 50 != 7).ToArray();
        var dates = full.Dates.ToArray();
        var volatility = full.Volatility.ToArray();
        var implied = new ImpliedSeries(keep.Select(i => dates[i]).ToArray(), keep.Select(i => volatility[i]).ToArray());
        var result = Backtester.Run(prices, implied, Settings(BacktestHorizon.Days(21)));

        var calibration = BacktestCalibrator.Evaluate(result, prices);

        // The dates without implied on closed windows are counted in both checks and said in implied's verdict.
        var closed = Enumerable.Range(0, result.Dates.Length).Where(i => result.WindowDays[i] is not null).ToArray();
        var missingImplied = closed.Count(i => result.Implied[i] is null);
        Assert.True(missingImplied > 0, "the gaps should fall on closed windows");
        Assert.Equal(missingImplied, calibration.Forecasters[0].Calibration.MissingCount);
        Assert.Equal(missingImplied, calibration.Forecasters[0].Coverage.MissingCount);
        Assert.StartsWith("move bands from implied ", calibration.Forecasters[0].Verdict, StringComparison.Ordinal);
        Assert.Contains($"{missingImplied} dates had no implied quote", calibration.Forecasters[0].Verdict, StringComparison.Ordinal);

        // A forecaster's missing dates are only its own (its warm-up), not implied's; every forecaster is scored at
        // the five default strikes.
        Assert.Equal(closed.Count(i => result.Forecasts[1].Values[i] is null), calibration.Forecasters[2].Coverage.MissingCount);
        Assert.All(calibration.Forecasters, f => Assert.Equal(5, f.Calibration.Strikes.Length));
    }

    [Fact]
    public void Evaluate_CalendarTenor_UsesEachDatesTradingDayWindow()
    {
        var (prices, _) = BacktestData.GarchWithTrueImplied(600, 21, seed: 4);
        var result = Backtester.Run(prices, null, Settings(BacktestHorizon.Tenor(30)));

        var calibration = BacktestCalibrator.Evaluate(result, prices);

        var expected = result.WindowDays.Where(w => w is not null).Select(w => w!.Value).ToArray();
        Assert.Equal(expected, calibration.Aligned.Outcomes.WindowDays.ToArray());
        Assert.True(expected.Distinct().Count() > 1, "a 30-day tenor over weekdays should give windows of different lengths");
        Assert.Equal(result.Forecasts.Select(f => f.Spec).ToArray(), calibration.Forecasters.Select(f => f.Coverage.Spec).ToArray());
    }
}
