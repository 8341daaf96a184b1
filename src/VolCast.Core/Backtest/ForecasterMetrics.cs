using VolCast.Core.Scoring;

namespace VolCast.Core.Backtest;

/// <summary>Every score and test of one forecaster (implied included) in a backtest: one row of metrics.csv.</summary>
/// <remarks>
/// Losses and Mincer-Zarnowitz use the dates where this forecaster has a positive forecast and the realized target is
/// positive. Comparisons with implied use the dates where implied is also quoted. Sign convention of the
/// Diebold-Mariano statistics: d_t = L(this forecaster) − L(implied), so negative means this forecaster's loss is lower.
/// </remarks>
/// <param name="Spec">The forecaster's spec.</param>
/// <param name="Kind">Configured, adaptive or implied.</param>
/// <param name="MissingForecasts">Dates with a target where this forecaster had no usable forecast (none yet, no quote, or not above zero).</param>
/// <param name="Losses">n, bias, MAE and RMSE on volatility, MSE on variance, QLIKE; null when no date could be scored.</param>
/// <param name="MincerZarnowitz">RV² = a + b F² + e with Newey-West errors (Bartlett, lag h − 1) and the Wald test of a = 0, b = 1; null with fewer than 3 dates.</param>
/// <param name="VersusImplied">Diebold-Mariano against implied on QLIKE and MSE; null for implied itself or without an implied series.</param>
/// <param name="Encompassing">RV² = a + b IV² + c F² + e with HAC errors: does the forecast add information beyond implied; null when not computable.</param>
/// <param name="McsPValue">The model confidence set p-value; null when the forecaster was not a member (see <see cref="McsSummary"/>).</param>
/// <param name="InMcs">Whether it is in the model confidence set at level α; null when not a member.</param>
public sealed record ForecasterMetrics(
    string Spec,
    ForecastKind Kind,
    int MissingForecasts,
    LossSummary? Losses,
    MincerZarnowitzResult? MincerZarnowitz,
    PairComparison? VersusImplied,
    EncompassingResult? Encompassing,
    double? McsPValue,
    bool? InMcs);
