using System.Collections.Immutable;
using System.Globalization;
using VolCast.Core.Estimators;

namespace VolCast.Core.Backtest;

/// <summary>Everything a backtest run is configured with; every setting has a default, so <c>new BacktestSettings()</c> runs the default backtest.</summary>
/// <remarks>
/// Immutable: change settings with <c>with</c> expressions. Settings are checked by <see cref="Validate"/>, which
/// <see cref="Backtester.Run"/> calls before it starts; settings that only fail against the data (a horizon
/// longer than the history) raise <see cref="BacktestDataException"/> there.
/// </remarks>
public sealed record BacktestSettings
{
    /// <summary>Gets the default forecasters when the price history has open, high and low.</summary>
    public static ImmutableArray<string> DefaultForecasters { get; } =
        ["close-to-close:21", "yang-zhang:21", "ewma:0.94", "garch", "gjr-garch", "har"];

    /// <summary>Gets the default forecasters for a close-only price history.</summary>
    public static ImmutableArray<string> DefaultCloseOnlyForecasters { get; } =
        ["close-to-close:21", "close-to-close:63", "ewma:0.94", "garch", "gjr-garch", "har"];

    /// <summary>Gets the default sweep of lookbacks in trading days.</summary>
    public static ImmutableArray<int> DefaultSweepLookbacks { get; } = [5, 10, 15, 21, 42, 63, 126, 252];

    /// <summary>Gets the default sweep of EWMA decays, 0.90 to 0.99 in steps of 0.01.</summary>
    public static ImmutableArray<double> DefaultEwmaLambdas { get; } = [0.90, 0.91, 0.92, 0.93, 0.94, 0.95, 0.96, 0.97, 0.98, 0.99];

    /// <summary>Gets the horizon: 21 trading days by default, or a calendar tenor.</summary>
    public BacktestHorizon Horizon { get; init; } = BacktestHorizon.Default;

    /// <summary>Gets the first forecast date (inclusive), or null for the first date of the history.</summary>
    public DateOnly? Start { get; init; }

    /// <summary>Gets the last forecast date (inclusive), or null for the last date of the history.</summary>
    public DateOnly? End { get; init; }

    /// <summary>Gets the forecaster specs, or empty (the default) for <see cref="DefaultForecasters"/> (or <see cref="DefaultCloseOnlyForecasters"/> on a close-only history).</summary>
    public ImmutableArray<string> Forecasters { get; init; } = [];

    /// <summary>Gets a value indicating whether the lookback sweep and the adaptive forecasters run (true by default).</summary>
    public bool Sweep { get; init; } = true;

    /// <summary>
    /// Gets a value indicating whether every family of <see cref="SweepEstimators"/> (and EWMA) is swept. False (the
    /// default) sweeps only the families of the listed forecasters: an estimator window such as <c>yang-zhang:21</c>
    /// sweeps its estimator, an <c>ewma</c> spec sweeps the EWMA decays; a configuration that names sweepEstimators asks
    /// for them in full.
    /// </summary>
    public bool FullSweep { get; init; }

    /// <summary>Gets the estimator families swept; by default all five (range-based ones are skipped on a close-only history).</summary>
    public ImmutableArray<Estimator> SweepEstimators { get; init; } =
        [Estimator.CloseToClose, Estimator.Parkinson, Estimator.GarmanKlass, Estimator.RogersSatchell, Estimator.YangZhang];

    /// <summary>Gets the lookbacks swept, in trading days (each at least 2).</summary>
    public ImmutableArray<int> SweepLookbacks { get; init; } = DefaultSweepLookbacks;

    /// <summary>Gets the EWMA decays swept (each strictly between 0 and 1); empty leaves EWMA out of the sweep.</summary>
    public ImmutableArray<double> EwmaLambdas { get; init; } = DefaultEwmaLambdas;

    /// <summary>Gets the trailing selection window of the adaptive lookback choice, in trading days (504 by default).</summary>
    public int SelectionWindowDays { get; init; } = 504;

    /// <summary>Gets the bootstrap replications B of the model confidence set (1,000 by default).</summary>
    public int McsReplications { get; init; } = 1000;

    /// <summary>Gets the size α of the model confidence set (0.10 by default).</summary>
    public double McsAlpha { get; init; } = 0.10;

    /// <summary>Gets the moving-block length of the bootstrap, or null (the default) for the horizon h (the longest h_t for a tenor).</summary>
    public int? McsBlockLength { get; init; }

    /// <summary>Gets the seed of the bootstrap (20240601 by default), so that a run can be repeated exactly.</summary>
    public int McsSeed { get; init; } = 20240601;

    /// <summary>Gets the rule-test threshold in volatility points (decimal; 0.02 = two vol points by default).</summary>
    public double RuleThreshold { get; init; } = 0.02;

    /// <summary>Gets the forecast the rule test uses, or null for the candidate.</summary>
    public string? RuleForecaster { get; init; }

    /// <summary>Gets the plain historical estimate the rule test compares with, or null for close-to-close over the horizon (at least 2 days).</summary>
    public string? RuleHistorical { get; init; }

    /// <summary>Gets the forecaster the current rule uses, or null for implied (when given) or else the first forecaster.</summary>
    public string? Baseline { get; init; }

    /// <summary>Gets the proposed forecaster, or null for the first forecaster that is not the baseline.</summary>
    public string? Candidate { get; init; }

    /// <summary>Gets the trading days per year A used to annualize (252 by default).</summary>
    public double AnnualizationFactor { get; init; } = 252;

    /// <summary>Gets how the realized target is measured (zero-mean squared returns by default).</summary>
    public RealizedTarget Target { get; init; } = RealizedTarget.SquaredReturns;

    /// <summary>
    /// Gets the settings of the rule's trading backtest: rate, dividend yield, costs, entries, sides, hedge volatility and the
    /// threshold sweep (the defaults by default). Its threshold and trading days per year are taken from
    /// <see cref="RuleThreshold"/> and <see cref="AnnualizationFactor"/> when the trades are run.
    /// </summary>
    public Trading.TradingSettings Trading { get; init; } = new();

    /// <summary>Gets the bootstrap replications B of the data-snooping tests of the threshold search (1,000 by default).</summary>
    public int SnoopingReplications { get; init; } = 1000;

    /// <summary>Gets the mean block length of the stationary bootstrap of the data-snooping tests, or null (the default) for the Politis-White automatic length, at least the horizon (docs/methods.md#data-snooping-reality-check-spa-stepm).</summary>
    public int? SnoopingBlockLength { get; init; }

    /// <summary>Gets the seed of the data-snooping bootstrap (20240601 by default), so that a run can be repeated exactly.</summary>
    public int SnoopingSeed { get; init; } = 20240601;

    /// <summary>Checks every setting on its own (not against the data).</summary>
    /// <exception cref="ArgumentException">A setting is out of range; the message names it, its value and what is expected.</exception>
    public void Validate()
    {
        ArgumentNullException.ThrowIfNull(Horizon);
        if (Start is DateOnly s && End is DateOnly e && e < s)
        {
            throw Bad($"end ({e:yyyy-MM-dd}) is before start ({s:yyyy-MM-dd}); the end date must be on or after the start date");
        }

        foreach (var lookback in SweepLookbacks)
        {
            if (lookback < 2)
            {
                throw Bad($"every sweep lookback must be at least 2 trading days (was {lookback})");
            }
        }

        foreach (var lambda in EwmaLambdas)
        {
            if (!(lambda > 0 && lambda < 1))
            {
                throw Bad($"every EWMA decay in the sweep must be strictly between 0 and 1 (was {lambda})");
            }
        }

        foreach (var estimator in SweepEstimators)
        {
            if (!Enum.IsDefined(estimator))
            {
                throw Bad($"unknown estimator in the sweep ({(int)estimator})");
            }
        }

        if (SelectionWindowDays < 1)
        {
            throw Bad($"the selection window must be at least 1 trading day (was {SelectionWindowDays})");
        }

        if (McsReplications < 10)
        {
            throw Bad($"the model confidence set needs at least 10 bootstrap replications (was {McsReplications})");
        }

        if (!(McsAlpha > 0 && McsAlpha < 1))
        {
            throw Bad($"the model confidence set alpha must be strictly between 0 and 1 (was {McsAlpha})");
        }

        if (McsBlockLength is int block && block < 1)
        {
            throw Bad($"the bootstrap block length must be at least 1 date (was {block})");
        }

        if (!(RuleThreshold >= 0) || !double.IsFinite(RuleThreshold))
        {
            throw Bad($"the rule threshold must be a finite number of volatility points, zero or more (was {RuleThreshold})");
        }

        if (!(AnnualizationFactor > 0) || !double.IsFinite(AnnualizationFactor))
        {
            throw Bad($"the annualization factor must be a finite number above zero (was {AnnualizationFactor})");
        }

        if (!Enum.IsDefined(Target))
        {
            throw Bad($"unknown realized target ({(int)Target})");
        }
    }

    private static ArgumentException Bad(FormattableString problem) =>
        new(string.Create(CultureInfo.InvariantCulture, $"Invalid backtest setting: {problem.ToString(CultureInfo.InvariantCulture)}."));
}
