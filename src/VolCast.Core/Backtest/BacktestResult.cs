using System.Collections.Immutable;

namespace VolCast.Core.Backtest;

/// <summary>Everything a backtest produced, for the report, the results files and notebooks. Immutable.</summary>
/// <remarks>
/// All per-date arrays (<see cref="Realized"/>, <see cref="Implied"/>, <see cref="WindowDays"/>, each
/// <see cref="ForecastSeries.Values"/>, each <see cref="AdaptiveSelection.Choices"/>) are aligned with
/// <see cref="Dates"/>, the forecast dates between start and end. The last dates have forecasts but no target
/// (their windows had not closed) and are not scored. Volatilities are decimals, annualized with
/// <see cref="BacktestSettings.AnnualizationFactor"/>. Sign convention of every Diebold-Mariano statistic:
/// d_t = L(first) − L(second); negative means the first named has the lower loss.
/// </remarks>
public sealed record BacktestResult
{
    /// <summary>Gets the settings as run, with defaults filled in (forecaster list, baseline, candidate, rule sources, block length).</summary>
    public required BacktestSettings Settings { get; init; }

    /// <summary>Gets the forecast dates.</summary>
    public required ImmutableArray<DateOnly> Dates { get; init; }

    /// <summary>Gets h_t, the number of trading days in each date's realized window; null where the window had not closed.</summary>
    public required ImmutableArray<int?> WindowDays { get; init; }

    /// <summary>Gets the realized target RV(t, h_t) at each date; null where the window had not closed.</summary>
    public required ImmutableArray<double?> Realized { get; init; }

    /// <summary>Gets implied volatility joined by date; null where there was no quote (or no implied series at all).</summary>
    public required ImmutableArray<double?> Implied { get; init; }

    /// <summary>Gets a value indicating whether an implied series was given.</summary>
    public required bool HasImplied { get; init; }

    /// <summary>Gets the forecast series: configured forecasters in configuration order, then the adaptive ones. Implied is in <see cref="Implied"/>.</summary>
    public required ImmutableArray<ForecastSeries> Forecasts { get; init; }

    /// <summary>Gets the HAC and Diebold-Mariano lag used: the longest h_t − 1.</summary>
    public required int HacLag { get; init; }

    /// <summary>Gets one metrics row per forecaster: implied first (when given), then <see cref="Forecasts"/> in order.</summary>
    public required ImmutableArray<ForecasterMetrics> Metrics { get; init; }

    /// <summary>Gets the baseline's spec (the forecaster the current rule uses).</summary>
    public required string Baseline { get; init; }

    /// <summary>Gets the candidate's spec (the proposed forecaster).</summary>
    public required string Candidate { get; init; }

    /// <summary>Gets the head-to-head test that leads the results: First = candidate, Second = baseline, so a negative statistic means the candidate's loss is lower.</summary>
    public required PairComparison CandidateVersusBaseline { get; init; }

    /// <summary>Gets the Diebold-Mariano comparison of every pair (implied and every forecaster), each on that pair's common dates.</summary>
    public required ImmutableArray<PairComparison> Pairs { get; init; }

    /// <summary>Gets the model confidence set on QLIKE.</summary>
    public required McsSummary ModelConfidenceSet { get; init; }

    /// <summary>Gets the in-sample lookback sweep table (empty when the sweep is off).</summary>
    public required ImmutableArray<SweepRow> Sweep { get; init; }

    /// <summary>Gets the adaptive lookback choices, one per swept family (empty when the sweep is off).</summary>
    public required ImmutableArray<AdaptiveSelection> Adaptive { get; init; }

    /// <summary>Gets the rule test; null without an implied series.</summary>
    public required RuleTestResult? RuleTest { get; init; }

    /// <summary>Gets the data-quality counts.</summary>
    public required DataQualityCounts DataQuality { get; init; }

    /// <summary>Gets warnings raised while running (a statistic that could not be computed, and why).</summary>
    public required ImmutableArray<string> Warnings { get; init; }

    /// <summary>Gets every compared forecaster and implied on the dates all of them share: the ranking, the verdict and the head-to-head use these dates; null when the result was built without it.</summary>
    public CommonDateRanking? Common { get; init; }

    /// <summary>Gets the answer to "which lookback?", one per swept family (empty when the sweep is off).</summary>
    public ImmutableArray<LookbackAnswer> Lookbacks { get; init; } = [];
}
