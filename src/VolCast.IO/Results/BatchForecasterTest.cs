namespace VolCast.IO.Results;

/// <summary>One forecaster's Diebold-Mariano test on QLIKE against implied on one asset, kept for the cross-asset summary.</summary>
/// <param name="Spec">The forecaster's spec.</param>
/// <param name="Statistic">The DM statistic, d_t = L(forecaster) − L(implied): negative means the forecaster's loss is lower.</param>
/// <param name="PValue">The two-sided p-value.</param>
public sealed record BatchForecasterTest(string Spec, double Statistic, double PValue);
