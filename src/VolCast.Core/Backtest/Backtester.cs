using System.Collections.Immutable;
using System.Globalization;
using VolCast.Core.Data;
using VolCast.Core.Estimators;
using VolCast.Core.Forecasters;
using VolCast.Core.Scoring;

namespace VolCast.Core.Backtest;

/// <summary>
/// The walk-forward backtest: every forecaster's h-day forecast at each date's close from data up to that date, the
/// realized volatility that followed, implied joined by date, and every score and test of <see cref="BacktestResult"/>.
/// </summary>
/// <remarks>
/// <para>
/// Forecasters walk forward over the whole history from its first row (so they are warmed up at the start date)
/// and stop at the end date. Their sessions run in parallel, one per forecaster; each session is sequential and
/// independent, so results do not depend on the number of cores.
/// </para>
/// <para>
/// Scored dates are the forecast dates whose realized window closed inside the history and whose target is above zero.
/// Each forecaster is scored on the scored dates where it has a forecast above zero; every comparison of two uses the
/// dates both have. HAC and Diebold-Mariano lags are h − 1 (the longest h_t − 1 for a calendar tenor, see
/// <see cref="BacktestHorizon"/>), with no prewhitening; HAC errors use Bartlett weights, Diebold-Mariano the
/// rectangular window (Bartlett where that estimate is not positive, marked in the result).
/// </para>
/// </remarks>
public static partial class Backtester
{
    private const string ImpliedSpec = ImpliedSeries.Name;

    /// <summary>Runs the backtest.</summary>
    /// <param name="prices">The daily price history.</param>
    /// <param name="implied">The implied-volatility series, or null (forecasters are then ranked among themselves).</param>
    /// <param name="settings">The settings; <c>new BacktestSettings()</c> for the defaults.</param>
    /// <param name="additionalForecasters">Forecasters to run besides the configured specs (for example a method not
    /// reachable by a spec string), or null.</param>
    /// <param name="progress">Receives progress reports, or null.</param>
    /// <param name="sessionsInParallel">How many forecaster sessions run at the same time: 0 (the default) for one per
    /// processor core, 1 to run them one after another on the calling thread (a batch that already keeps every core busy
    /// with other names saves the cost of coordinating threads). The result does not depend on it.</param>
    /// <param name="cancellationToken">Stops the run between steps.</param>
    /// <returns>The result.</returns>
    /// <exception cref="ArgumentNullException"><paramref name="prices"/> or <paramref name="settings"/> is null.</exception>
    /// <exception cref="ArgumentException">A setting is invalid, a spec is unknown (the message lists the valid
    /// specs), or a forecaster needs data the history lacks (for example open/high/low).</exception>
    /// <exception cref="BacktestDataException">The data cannot support the backtest: no dates between start and end,
    /// a horizon longer than the history allows, no implied date shared with the prices, or a selection window longer
    /// than the sample.</exception>
    public static BacktestResult Run(
        PriceHistory prices,
        ImpliedSeries? implied,
        BacktestSettings settings,
        IReadOnlyList<IVolatilityForecaster>? additionalForecasters = null,
        IProgress<BacktestProgress>? progress = null,
        int sessionsInParallel = 0,
        CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(prices);
        ArgumentNullException.ThrowIfNull(settings);
        settings.Validate();
        ArgumentOutOfRangeException.ThrowIfNegative(sessionsInParallel);
        var frame = FrameDates(prices, settings);
        var join = JoinImplied(frame, implied);
        var plan = PlanForecasters(frame, settings, prices.HasRange, additionalForecasters, implied is not null);
        var sessions = RunSessions(prices, implied, settings, plan.All, frame.Last, sessionsInParallel, progress, cancellationToken);
        var adaptive = ChooseAdaptive(frame, plan.Families, sessions.Series, settings, cancellationToken);
        progress?.Report(new BacktestProgress("scoring", 0, 1));
        var scored = ScoredDates(frame);
        var named = SeriesToScore(join, plan.Configured, sessions, adaptive);
        var warnings = new List<string>();
        var scores = ScoresAndTests(frame, scored, named, join, settings, plan.Configured, warnings, cancellationToken);
        var common = CommonDates(frame, scored, named, join, scores.ConfidenceSet, scores.Baseline, scores.Candidate);
        scores = scores with { CandidateVersusBaseline = common.HeadToHead ?? scores.CandidateVersusBaseline };
        var sweep = Sweep(plan.Families, sessions.Series, scored.Dates, frame.Windows.Realized);
        var lookbacks = LookbackAnswers(frame, scored, plan.Families, sessions.Series, adaptive, settings, cancellationToken);
        var rule = RuleStep(frame, scored, named, join, settings, scores, plan, sessions.Series);
        progress?.Report(new BacktestProgress("scoring", 1, 1));
        return Assemble(settings, frame, join, plan, scored, named, adaptive, scores, sweep, rule, warnings) with { Common = common.Ranking, Lookbacks = lookbacks };
    }
}
