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
/// <see cref="ForecasterOdds.InvalidValueCount"/>. Regimes are terciles of the realized target RV(t, h_t)
/// (hindsight: see <see cref="CoverageRegimes"/>); they are left empty when a scorable date has no realized value.
/// </para>
/// </remarks>
public static class BacktestCalibrator
{
    /// <summary>Scores every forecaster of <paramref name="result"/>.</summary>
    /// <param name="result">The backtest.</param>
    /// <param name="prices">The price history the backtest ran on.</param>
    /// <param name="options">Strikes, drift, bins and the minimum sample; the defaults when null. Its annualization factor is replaced by the backtest's.</param>
    /// <param name="cancellationToken">Stops before the checks and between forecasters.</param>
    /// <returns>One record per forecaster, implied first.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">A forecast date is not in the price history, or an option is invalid.</exception>
    /// <exception cref="OperationCanceledException">The token was cancelled.</exception>
    public static BacktestCalibration Evaluate(BacktestResult result, PriceHistory prices, CalibrationOptions? options = null, CancellationToken cancellationToken = default)
    {
        cancellationToken.ThrowIfCancellationRequested();
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(prices);
        options = (options ?? new CalibrationOptions()) with { AnnualizationFactor = result.Settings.AnnualizationFactor };
        options.Validate();

        var aligned = OutcomeAlignment.FromPrices(prices, result.Dates, result.WindowDays);
        var regimeValues = RegimeValues(result, aligned);
        var odds = ImmutableArray.CreateBuilder<ForecasterOdds>(result.Forecasts.Length + 1);
        if (result.HasImplied)
        {
            cancellationToken.ThrowIfCancellationRequested();
            odds.Add(Score(aligned.Outcomes, Pick(aligned, ImpliedSeries.Name, result.Implied, out var bad), options, regimeValues, bad));
        }

        foreach (var series in result.Forecasts)
        {
            odds.Add(Score(aligned.Outcomes, Pick(aligned, series.Spec, series.Values, out var bad), options, regimeValues, bad));
        }

        return new BacktestCalibration(aligned, odds.ToImmutable());
    }

    /// <summary>Runs every odds check on one forecaster.</summary>
    /// <param name="outcomes">The closes at t and t + h.</param>
    /// <param name="forecaster">The forecaster's volatility, aligned with <paramref name="outcomes"/>.</param>
    /// <param name="options">Strikes, drift, bins, the interval's quantile and the minimum sample (validated here).</param>
    /// <param name="regimeValues">The realized volatility per aligned date for the regimes, or null to leave the regimes empty.</param>
    /// <param name="invalidValueCount">How many of the forecaster's values were dropped as invalid before the call.</param>
    /// <returns>The forecaster's record.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">The series is not aligned, or an option is invalid.</exception>
    public static ForecasterOdds Score(HorizonOutcomes outcomes, ForecasterVolatility forecaster, CalibrationOptions options, double[]? regimeValues = null, int invalidValueCount = 0)
    {
        ArgumentNullException.ThrowIfNull(outcomes);
        ArgumentNullException.ThrowIfNull(forecaster);
        ArgumentNullException.ThrowIfNull(options);
        options.Validate();
        var calibration = ProbabilityCalibration.Evaluate(outcomes, forecaster, options);
        var coverage = MoveBandCoverage.Evaluate(outcomes, forecaster, options);
        var regimes = regimeValues is null ? ImmutableArray<RegimeCoverage>.Empty : CoverageRegimes.ByTerciles(coverage, regimeValues, options.IntervalZ);
        return new ForecasterOdds(
            forecaster.Spec,
            calibration,
            coverage,
            regimes,
            CoverageVerdict.Describe(coverage, regimes),
            invalidValueCount,
            ReliabilityPooling.Pool(calibration, options.IntervalZ));
    }

    /// <summary>The realized target per aligned date, or null when a scorable date has none (the regimes are then left out).</summary>
    private static double[]? RegimeValues(BacktestResult result, AlignedOutcomes aligned)
    {
        var values = new double[aligned.DateIndices.Length];
        for (var i = 0; i < values.Length; i++)
        {
            if (result.Realized[aligned.DateIndices[i]] is { } rv && double.IsFinite(rv))
            {
                values[i] = rv;
            }
            else
            {
                return null;
            }
        }

        return values;
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
