using VolCast.Core.Backtest;
using VolCast.Core.Data;

namespace VolCast.IO.Tables;

/// <summary>
/// The forecaster table of a backtest, defined once: one row per forecaster (implied first) with every score and
/// test. metrics.csv is this table; each element of <c>forecasters</c> in metrics.json is one of its rows, with the
/// same keys in the same order. The dm_* and enc_* columns are versus implied.
/// </summary>
public static class ForecasterTable
{
    private const string Vol = "decimal annualized volatility";
    private const string Variance = "annualized variance";
    private const string PValue = "p-value, two-sided";

    /// <summary>Gets the definition.</summary>
    public static TableDefinition<ForecasterRow> Definition { get; } = new(
    [
        Text("forecaster", "the forecaster's spec", r => r.Metrics.Spec),
        Text("kind", "implied, adaptive or configured", r => Kind(r.Metrics.Kind)),
        Integer("n", "count of scored dates", r => r.Metrics.Losses?.Count ?? 0),
        Integer("missing", "count of dates without a forecast", r => r.Metrics.MissingForecasts),
        Number("bias", Vol + ", mean of forecast − realized", r => r.Metrics.Losses?.Bias),
        Number("mae_vol", Vol, r => r.Metrics.Losses?.MaeVolatility),
        Number("rmse_vol", Vol, r => r.Metrics.Losses?.RmseVolatility),
        Number("mse_var", Variance + " squared", r => r.Metrics.Losses?.MseVariance),
        Number("qlike", "unitless, lower is better", r => r.Metrics.Losses?.Qlike),
        Number("mz_a", Variance + ", Mincer-Zarnowitz intercept", r => r.Metrics.MincerZarnowitz?.Intercept),
        Number("mz_b", "unitless, Mincer-Zarnowitz slope, 1 = unbiased", r => r.Metrics.MincerZarnowitz?.Slope),
        Number("mz_a_se", Variance + ", standard error (Newey-West)", r => r.Metrics.MincerZarnowitz?.InterceptStandardError),
        Number("mz_b_se", "unitless, standard error (Newey-West)", r => r.Metrics.MincerZarnowitz?.SlopeStandardError),
        Number("mz_r2", "0 to 1", r => r.Metrics.MincerZarnowitz?.RSquared),
        Number("mz_wald", "chi-squared statistic, 2 degrees of freedom", r => r.Metrics.MincerZarnowitz?.Wald),
        Number("mz_wald_p", "p-value", r => r.Metrics.MincerZarnowitz?.WaldPValue),
        Integer("dm_n", "count of dates shared with implied", r => r.Metrics.VersusImplied?.Count),
        Number("dm_qlike_stat", "Diebold-Mariano statistic, negative = lower loss than implied", r => r.Metrics.VersusImplied?.Qlike?.Statistic),
        Number("dm_qlike_p", PValue, r => r.Metrics.VersusImplied?.Qlike?.PValue),
        Number("dm_mse_stat", "Diebold-Mariano statistic, negative = lower loss than implied", r => r.Metrics.VersusImplied?.MseVariance?.Statistic),
        Number("dm_mse_p", PValue, r => r.Metrics.VersusImplied?.MseVariance?.PValue),
        Flag("dm_bartlett_fallback", "true when a Diebold-Mariano test against implied used Bartlett weights because the rectangular long-run variance was not positive", r => DmFallback(r.Metrics.VersusImplied)),
        Number("enc_implied_b", "unitless, weight on implied variance", r => r.Metrics.Encompassing?.ImpliedSlope),
        Number("enc_forecast_c", "unitless, weight on the forecast variance", r => r.Metrics.Encompassing?.ForecastSlope),
        Number("enc_forecast_c_se", "unitless, standard error (Newey-West)", r => r.Metrics.Encompassing?.ForecastStandardError),
        Number("enc_forecast_c_p", PValue, r => r.Metrics.Encompassing?.ForecastPValue),
        Number("mcs_p", "model confidence set p-value", r => r.Metrics.McsPValue),
        Flag("in_mcs", "true when in the model confidence set", r => r.Metrics.InMcs),
        Integer("refits", "count of model refits", r => r.Series?.Counts.Refits),
        Integer("failed_fits", "count of refits that failed", r => r.Series?.Counts.FailedFits),
        Integer("nonstationary_fits", "count of fits outside the stationary region", r => r.Series?.Counts.NonStationaryFits),
        Integer("variance_fallbacks", "count of negative-variance fallbacks", r => r.Series?.Counts.NegativeVarianceFallbacks),
    ]);

    /// <summary>The rows of a result, in the order of its metrics (implied first).</summary>
    /// <param name="result">The backtest.</param>
    /// <returns>One row per forecaster.</returns>
    public static IEnumerable<ForecasterRow> Rows(BacktestResult result) =>
        result.Metrics.Select(m => new ForecasterRow(m, result.Forecasts.FirstOrDefault(f => f.Spec == m.Spec)));

    private static bool? DmFallback(PairComparison? pair) =>
        pair?.Qlike is null && pair?.MseVariance is null
            ? null
            : (pair.Qlike?.FellBackToBartlett ?? false) || (pair.MseVariance?.FellBackToBartlett ?? false);

    /// <summary>The kind as written in the files.</summary>
    /// <param name="kind">The kind.</param>
    /// <returns><c>implied</c>, <c>adaptive</c> or <c>configured</c>.</returns>
    public static string Kind(ForecastKind kind) => kind switch
    {
        ForecastKind.Implied => ImpliedSeries.Name,
        ForecastKind.Adaptive => "adaptive",
        _ => "configured",
    };

    private static TableColumn<ForecasterRow> Text(string name, string unit, Func<ForecasterRow, string> value) => new(name, unit, r => TableCell.Text(value(r)));

    private static TableColumn<ForecasterRow> Number(string name, string unit, Func<ForecasterRow, double?> value) => new(name, unit, r => TableCell.Number(value(r)));

    private static TableColumn<ForecasterRow> Integer(string name, string unit, Func<ForecasterRow, int?> value) => new(name, unit, r => TableCell.Count(value(r)));

    private static TableColumn<ForecasterRow> Flag(string name, string unit, Func<ForecasterRow, bool?> value) => new(name, unit, r => TableCell.Flag(value(r)));
}
