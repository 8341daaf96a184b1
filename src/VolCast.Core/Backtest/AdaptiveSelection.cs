using System.Collections.Immutable;

namespace VolCast.Core.Backtest;

/// <summary>The out-of-sample adaptive lookback choice of one estimator family.</summary>
/// <remarks>
/// At each date t the adaptive forecaster uses the lookback with the lowest mean QLIKE over the forecast dates s in
/// the trailing selection window (t − W, t] whose realized windows had closed by t (all of s's target days are on or
/// before t; s + h ≤ t for a trading-day horizon), counting only dates where every lookback of the family had a
/// forecast and the target was positive, so that all lookbacks are compared on the same dates. Ties go to the
/// lookback listed first. Before any such date exists it has no forecast.
/// </remarks>
/// <param name="Spec">The adaptive forecaster's spec, <c>adaptive:FAMILY</c>.</param>
/// <param name="Family">The estimator family, for example <c>yang-zhang</c> or <c>ewma</c>.</param>
/// <param name="Candidates">The specs it chooses between, in sweep order.</param>
/// <param name="Choices">The spec chosen at each date of <see cref="BacktestResult.Dates"/>; null before a choice was possible.</param>
/// <param name="ChangeCount">How many times the choice changed from one date to the next.</param>
/// <param name="DatesWithChoice">How many dates had a choice.</param>
public sealed record AdaptiveSelection(
    string Spec,
    string Family,
    ImmutableArray<string> Candidates,
    ImmutableArray<string?> Choices,
    int ChangeCount,
    int DatesWithChoice);
