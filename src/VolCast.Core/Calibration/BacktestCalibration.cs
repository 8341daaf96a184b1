using System.Collections.Immutable;

namespace VolCast.Core.Calibration;

/// <summary>The calibration and coverage of every forecaster of a backtest, with the realized-volatility regimes and verdicts.</summary>
/// <param name="Aligned">The scorable forecast dates and their closes at t and t + h_t.</param>
/// <param name="Report">Calibration and coverage per forecaster: implied first (when given), then the backtest's forecasts in order.</param>
/// <param name="Regimes">Per forecaster, in the same order, the |z| ≤ 1 coverage in terciles of realized volatility RV(t, h_t) (empty when too few dates).</param>
/// <param name="Verdicts">Per forecaster, in the same order, the plain-words verdict on its ranges, naming the regimes where they failed.</param>
/// <param name="InvalidValueCounts">Per forecaster, in the same order, how many present values were not a volatility above zero and were counted as missing.</param>
public sealed record BacktestCalibration(
    AlignedOutcomes Aligned,
    CalibrationReport Report,
    ImmutableArray<ImmutableArray<RegimeCoverage>> Regimes,
    ImmutableArray<string> Verdicts,
    ImmutableArray<int> InvalidValueCounts);
