using VolCast.Core.Backtest;
using VolCast.Core.Data;

namespace VolCast.IO.Results;

/// <summary>Writes metrics.csv: one row per forecaster (implied first) with every score and test; the dm_* columns are versus implied.</summary>
internal static class MetricsCsv
{
    public static IReadOnlyList<string> Columns { get; } =
    [
        "forecaster", "kind", "n", "missing", "bias", "mae_vol", "rmse_vol", "mse_var", "qlike",
        "mz_a", "mz_b", "mz_a_se", "mz_b_se", "mz_r2", "mz_wald", "mz_wald_p",
        "dm_n", "dm_qlike_stat", "dm_qlike_p", "dm_mse_stat", "dm_mse_p",
        "enc_implied_b", "enc_forecast_c", "enc_forecast_c_se", "enc_forecast_c_p",
        "mcs_p", "in_mcs", "refits", "failed_fits", "nonstationary_fits", "variance_fallbacks",
    ];

    public static void Write(TextWriter writer, BacktestResult result)
    {
        writer.Write(string.Join(',', Columns));
        writer.Write('\n');
        foreach (var m in result.Metrics)
        {
            var counts = result.Forecasts.FirstOrDefault(f => f.Spec == m.Spec)?.Counts;
            var l = m.Losses;
            var mz = m.MincerZarnowitz;
            var dm = m.VersusImplied;
            var enc = m.Encompassing;
            string[] cells =
            [
                Numbers.Field(m.Spec), Kind(m.Kind), Numbers.Csv(l?.Count ?? 0), Numbers.Csv(m.MissingForecasts),
                Numbers.Csv(l?.Bias), Numbers.Csv(l?.MaeVolatility), Numbers.Csv(l?.RmseVolatility), Numbers.Csv(l?.MseVariance), Numbers.Csv(l?.Qlike),
                Numbers.Csv(mz?.Intercept), Numbers.Csv(mz?.Slope), Numbers.Csv(mz?.InterceptStandardError), Numbers.Csv(mz?.SlopeStandardError),
                Numbers.Csv(mz?.RSquared), Numbers.Csv(mz?.Wald), Numbers.Csv(mz?.WaldPValue),
                dm is null ? string.Empty : Numbers.Csv(dm.Count), Numbers.Csv(dm?.Qlike?.Statistic), Numbers.Csv(dm?.Qlike?.PValue),
                Numbers.Csv(dm?.MseVariance?.Statistic), Numbers.Csv(dm?.MseVariance?.PValue),
                Numbers.Csv(enc?.ImpliedSlope), Numbers.Csv(enc?.ForecastSlope), Numbers.Csv(enc?.ForecastStandardError), Numbers.Csv(enc?.ForecastPValue),
                Numbers.Csv(m.McsPValue), Numbers.Csv(m.InMcs),
                Numbers.Csv(counts?.Refits), Numbers.Csv(counts?.FailedFits), Numbers.Csv(counts?.NonStationaryFits), Numbers.Csv(counts?.NegativeVarianceFallbacks),
            ];
            writer.Write(string.Join(',', cells));
            writer.Write('\n');
        }
    }

    public static string Kind(ForecastKind kind) => kind switch
    {
        ForecastKind.Implied => ImpliedSeries.Name,
        ForecastKind.Adaptive => "adaptive",
        _ => "configured",
    };
}
