using System.Collections.Immutable;
using VolCast.Core.Backtest;
using VolCast.Core.Data;

namespace VolCast.Core.Calibration;

/// <summary>Runs the probability-calibration and range-coverage checks on every forecaster of a backtest.</summary>
/// <remarks>
/// <para>
/// Dates: the backtest's forecast dates whose realized window closed (<see cref="BacktestResult.WindowDays"/> not
/// null), with S_t and S_{t+h_t} taken from the price history the backtest ran on (the result does not carry the
/// closes). Forecasters: implied first when the backtest had an implied series (named <c>implied</c>), then
/// <see cref="BacktestResult.Forecasts"/> in order, the order of the metrics rows. The annualization factor is the
/// backtest's (<see cref="BacktestSettings.AnnualizationFactor"/>), whatever the options say.
/// </para>
/// <para>
/// A value that is not a finite volatility above zero is treated like a missing one, as the backtest's scoring does
/// (it scores only forecasts above zero): it is counted in the result's missing dates and in
/// <see cref="BacktestCalibration.InvalidValueCounts"/>. Regimes are terciles of the realized target RV(t, h_t)
/// (hindsight: see <see cref="CoverageRegimes"/>); they are left empty when a scorable date has no realized value.
/// </para>
/// </remarks>
public static class BacktestCalibrator
{
    /// <summary>Scores every forecaster of <paramref name="result"/>.</summary>
    /// <param name="result">The backtest.</param>
    /// <param name="prices">The price history the backtest ran on.</param>
    /// <param name="options">Strikes, drift, bins and the minimum sample; the defaults when null. Its annualization factor is replaced by the backtest's.</param>
    /// <returns>Results per forecaster, implied first.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">A forecast date is not in the price history, or an option is invalid.</exception>
    public static BacktestCalibration Evaluate(BacktestResult result, PriceHistory prices, CalibrationOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(prices);
        options = (options ?? new CalibrationOptions()) with { AnnualizationFactor = result.Settings.AnnualizationFactor };
        options.Validate();

        var aligned = OutcomeAlignment.FromPrices(prices, result.Dates, result.WindowDays);
        var forecasters = new List<ForecasterVolatility>(result.Forecasts.Length + 1);
        var invalid = ImmutableArray.CreateBuilder<int>(result.Forecasts.Length + 1);
        if (result.HasImplied)
        {
            forecasters.Add(Pick(aligned, ImpliedSeries.Name, result.Implied, out var bad));
            invalid.Add(bad);
        }

        foreach (var series in result.Forecasts)
        {
            forecasters.Add(Pick(aligned, series.Spec, series.Values, out var bad));
            invalid.Add(bad);
        }

        var report = CalibrationSuite.Evaluate(aligned.Outcomes, forecasters, options);

        double[]? regimeValues = new double[aligned.DateIndices.Length];
        for (var i = 0; i < regimeValues.Length; i++)
        {
            if (result.Realized[aligned.DateIndices[i]] is { } rv && double.IsFinite(rv))
            {
                regimeValues[i] = rv;
            }
            else
            {
                regimeValues = null;
                break;
            }
        }

        var regimes = ImmutableArray.CreateBuilder<ImmutableArray<RegimeCoverage>>(forecasters.Count);
        var verdicts = ImmutableArray.CreateBuilder<string>(forecasters.Count);
        foreach (var coverage in report.Coverages)
        {
            var rows = regimeValues is null ? ImmutableArray<RegimeCoverage>.Empty : CoverageRegimes.ByTerciles(coverage, regimeValues, options.IntervalZ);
            regimes.Add(rows);
            verdicts.Add(CoverageVerdict.Describe(coverage, rows));
        }

        return new BacktestCalibration(aligned, report, regimes.MoveToImmutable(), verdicts.MoveToImmutable(), invalid.ToImmutable());
    }

    private static ForecasterVolatility Pick(AlignedOutcomes aligned, string name, ImmutableArray<double?> values, out int invalid)
    {
        var picked = new double?[aligned.DateIndices.Length];
        invalid = 0;
        for (var i = 0; i < picked.Length; i++)
        {
            var k = aligned.DateIndices[i];
            var v = k < values.Length ? values[k] : null;
            if (v is not null && !Preconditions.IsPositive(v))
            {
                invalid++;
                v = null;
            }

            picked[i] = v;
        }

        return new ForecasterVolatility(name, picked);
    }
}
