using System.Collections.Immutable;

namespace VolCast.Core.Calibration;

/// <summary>The odds checks of every forecaster of a backtest, one record per forecaster.</summary>
/// <param name="Aligned">The scorable forecast dates and their closes at t and t + h_t.</param>
/// <param name="Forecasters">One record per forecaster: implied first (when the backtest had it), then the backtest's forecasts in order.</param>
public sealed record BacktestCalibration(
    AlignedOutcomes Aligned,
    ImmutableArray<ForecasterOdds> Forecasters);
