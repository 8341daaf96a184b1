using VolCast.Core.Scoring;

namespace VolCast.Core.Backtest;

/// <summary>One forecaster (or implied) scored on the common dates of <see cref="CommonDateRanking"/>.</summary>
/// <param name="Spec">The forecaster's spec.</param>
/// <param name="Kind">Configured, adaptive or implied.</param>
/// <param name="Losses">Its losses on the common dates.</param>
/// <param name="VersusImplied">Diebold-Mariano against implied on the common dates (d_t = L(this) − L(implied)); null for implied itself or without implied.</param>
public sealed record CommonDateRow(string Spec, ForecastKind Kind, LossSummary Losses, PairComparison? VersusImplied);
