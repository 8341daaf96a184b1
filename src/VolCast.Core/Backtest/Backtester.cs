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
/// <see cref="BacktestHorizon"/>), with Bartlett weights and no prewhitening.
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
        CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(prices);
        ArgumentNullException.ThrowIfNull(settings);
        settings.Validate();
        var warnings = new List<string>();
        var n = prices.Count;
        var dates = prices.Dates.ToArray();
        if (n < 2)
        {
            throw new BacktestDataException(Text($"The price history has {n} row(s); a backtest needs at least two."));
        }

        var (first, last) = DateRange(dates, settings);
        var horizon = settings.Horizon;
        var windows = RealizedWindows.Compute(prices, horizon, settings.Target, settings.AnnualizationFactor);
        CheckHorizon(dates, first, last, windows, horizon);

        // Implied joined by date over the whole history.
        var impliedAt = new double?[n];
        var impliedRowsInRange = 0;
        var matchedInRange = 0;
        if (implied is not null)
        {
            var id = implied.Dates;
            var iv = implied.Volatility;
            var p = 0;
            for (var k = 0; k < implied.Count; k++)
            {
                while (p < n && dates[p] < id[k])
                {
                    p++;
                }

                var inRange = id[k] >= dates[first] && id[k] <= dates[last];
                impliedRowsInRange += inRange ? 1 : 0;
                if (p < n && dates[p] == id[k])
                {
                    impliedAt[p] = iv[k];
                    matchedInRange += inRange ? 1 : 0;
                }
            }

            if (matchedInRange == 0)
            {
                throw new BacktestDataException(Text(
                    $"No date is shared by the prices ({dates[first]:yyyy-MM-dd} to {dates[last]:yyyy-MM-dd}, {last - first + 1} forecast dates) and the implied series ({(implied.Count == 0 ? "empty" : Text($"{id[0]:yyyy-MM-dd} to {id[implied.Count - 1]:yyyy-MM-dd}, {implied.Count} rows"))}); check that both files cover the same period, or leave out --implied."));
            }
        }

        // Forecasters: configured, then extra, then the sweep, then the rule's historical estimate; each spec runs once.
        var configured = ConfiguredForecasters(settings, prices.HasRange, implied is not null, additionalForecasters);
        var all = new Dictionary<string, IVolatilityForecaster>(StringComparer.Ordinal);
        foreach (var f in configured)
        {
            all.TryAdd(f.Spec, f);
        }

        var families = SweepFamilies(settings, prices.HasRange);
        foreach (var (_, candidates) in families)
        {
            foreach (var c in candidates)
            {
                all.TryAdd(c.Spec, c);
            }
        }

        if (settings.Sweep && families.Count > 0 && settings.SelectionWindowDays > last + 1)
        {
            throw new BacktestDataException(Text(
                $"The selection window of {settings.SelectionWindowDays} trading days is longer than the sample: the history has {last + 1} rows up to the end date {dates[last]:yyyy-MM-dd}; set a shorter selectionWindowDays in the configuration or use a longer history."));
        }

        var historical = ForecasterSpec.Parse(settings.RuleHistorical ?? Text($"close-to-close:{Math.Max(2, horizon.NominalDays)}"));
        all.TryAdd(historical.Spec, historical);

        var (series, sessionCounts) = RunSessions(prices, implied, settings, all.Values.ToArray(), last, progress, cancellationToken);

        // Adaptive choices.
        var adaptive = new List<(AdaptiveSelection Selection, double?[] Values)>();
        foreach (var (family, candidates) in families)
        {
            cancellationToken.ThrowIfCancellationRequested();
            var candidateSeries = candidates.Select(c => series[c.Spec]).ToArray();
            var choice = new int[last + 1];
            var values = AdaptiveLookback.Choose(candidateSeries, windows, last, settings.SelectionWindowDays, choice);
            var specs = candidates.Select(c => c.Spec).ToImmutableArray();
            var choices = ImmutableArray.CreateBuilder<string?>(last - first + 1);
            var changes = 0;
            var withChoice = 0;
            for (var t = first; t <= last; t++)
            {
                choices.Add(choice[t] < 0 ? null : specs[choice[t]]);
                withChoice += choice[t] < 0 ? 0 : 1;
                if (t > first && choice[t] >= 0 && choice[t - 1] >= 0 && choice[t] != choice[t - 1])
                {
                    changes++;
                }
            }

            var spec = "adaptive:" + family;
            adaptive.Add((new AdaptiveSelection(spec, family, specs, choices.MoveToImmutable(), changes, withChoice), values));
            series[spec] = values;
        }

        progress?.Report(new BacktestProgress("scoring", 0, 1));

        // Scored dates and the lag.
        var scored = new List<int>();
        var zeroRealized = 0;
        var withTarget = 0;
        var minH = int.MaxValue;
        var maxH = 0;
        for (var t = first; t <= last; t++)
        {
            if (windows.Realized[t] is double rv)
            {
                withTarget++;
                minH = Math.Min(minH, windows.WindowDays[t]);
                maxH = Math.Max(maxH, windows.WindowDays[t]);
                if (rv > 0)
                {
                    scored.Add(t);
                }
                else
                {
                    zeroRealized++;
                }
            }
        }

        var lag = maxH - 1;
        var scoring = new Scorer(windows.Realized, scored, lag, maxH, warnings);

        // Everything scored: implied first, then configured in order, then adaptive.
        var named = new List<(string Spec, ForecastKind Kind, double?[] Values, ForecasterCounts Counts)>();
        if (implied is not null)
        {
            named.Add((ImpliedSpec, ForecastKind.Implied, impliedAt, ForecasterCounts.None));
        }

        var configuredSeen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var f in configured)
        {
            if (configuredSeen.Add(f.Spec))
            {
                named.Add((f.Spec, ForecastKind.Configured, series[f.Spec], sessionCounts[f.Spec]));
            }
        }

        foreach (var (selection, values) in adaptive)
        {
            named.Add((selection.Spec, ForecastKind.Adaptive, values, ForecasterCounts.None));
        }

        var mcs = ConfidenceSet(named, scored, windows.Realized, settings, maxH, warnings);
        var metrics = ImmutableArray.CreateBuilder<ForecasterMetrics>(named.Count);
        foreach (var (spec, kind, values, _) in named)
        {
            cancellationToken.ThrowIfCancellationRequested();
            var missing = 0;
            foreach (var t in scored)
            {
                missing += Preconditions.IsPositive(values[t]) ? 0 : 1;
            }

            var mcsIndex = mcs.Members.IndexOf(spec);
            metrics.Add(new ForecasterMetrics(
                spec,
                kind,
                missing,
                scoring.Losses(spec, values),
                scoring.MincerZarnowitz(spec, values),
                implied is null || kind == ForecastKind.Implied ? null : scoring.Compare(spec, values, ImpliedSpec, impliedAt),
                implied is null || kind == ForecastKind.Implied ? null : scoring.Encompassing(spec, values, impliedAt),
                mcsIndex >= 0 && mcs.Result is not null ? mcs.Result.PValues[mcsIndex] : null,
                mcsIndex >= 0 && mcs.Result is not null ? mcs.Result.InSet[mcsIndex] : null));
        }

        var pairs = ImmutableArray.CreateBuilder<PairComparison>();
        for (var a = 0; a < named.Count; a++)
        {
            for (var b = a + 1; b < named.Count; b++)
            {
                pairs.Add(scoring.Compare(named[a].Spec, named[a].Values, named[b].Spec, named[b].Values));
            }
        }

        // Baseline and candidate.
        var available = named.Select(x => x.Spec).ToList();
        var baseline = Resolve(settings.Baseline, available, "baseline") ?? (implied is not null ? ImpliedSpec : configured[0].Spec);
        var candidate = Resolve(settings.Candidate, available, "candidate")
            ?? available.FirstOrDefault(s => s != baseline && s != ImpliedSpec)
            ?? baseline;
        var headToHead = scoring.Compare(candidate, Lookup(named, candidate), baseline, Lookup(named, baseline));

        // Sweep table (in-sample).
        var sweep = ImmutableArray.CreateBuilder<SweepRow>();
        foreach (var (family, candidates) in families)
        {
            sweep.AddRange(SweepTable(family, candidates.Select(c => (c.Spec, series[c.Spec])).ToList(), scored, windows.Realized));
        }

        // Rule test.
        RuleTestResult? rule = null;
        var ruleForecast = settings.RuleForecaster is null
            ? (candidate != ImpliedSpec ? candidate : configured[0].Spec)
            : Resolve(settings.RuleForecaster, available, "rule forecaster")!;
        if (implied is not null)
        {
            var f = Lookup(named, ruleForecast);
            var h = series[historical.Spec];
            var ruleDates = scored.Where(t => Preconditions.IsPositive(impliedAt[t]) && Preconditions.IsPositive(f[t]) && Preconditions.IsPositive(h[t])).ToList();
            var rows = RuleTest.Rows(ruleForecast, ruleDates, impliedAt, f, windows.Realized, settings.RuleThreshold, lag)
                .AddRange(RuleTest.Rows(historical.Spec, ruleDates, impliedAt, h, windows.Realized, settings.RuleThreshold, lag));
            rule = new RuleTestResult(settings.RuleThreshold, ruleForecast, historical.Spec, rows);
        }

        var count = last - first + 1;
        var impliedSlice = Slice(impliedAt, first, count);
        var forecasts = named.Where(x => x.Kind != ForecastKind.Implied)
            .Select(x => new ForecastSeries(x.Spec, x.Kind, Slice(x.Values, first, count), x.Counts))
            .ToImmutableArray();
        var quality = new DataQualityCounts(
            n,
            count,
            withTarget,
            count - withTarget,
            zeroRealized,
            implied?.Count ?? 0,
            matchedInRange,
            count - matchedInRange,
            impliedRowsInRange - matchedInRange,
            withTarget == 0 ? 0 : minH,
            maxH);

        progress?.Report(new BacktestProgress("scoring", 1, 1));
        return new BacktestResult
        {
            Settings = settings with
            {
                Forecasters = configured.Select(f => f.Spec).Distinct().ToImmutableArray(),
                Baseline = baseline,
                Candidate = candidate,
                RuleForecaster = ruleForecast,
                RuleHistorical = historical.Spec,
                McsBlockLength = settings.McsBlockLength ?? maxH,
            },
            Dates = [.. dates.AsSpan(first, count)],
            WindowDays = [.. Enumerable.Range(first, count).Select(t => windows.Realized[t] is null ? (int?)null : windows.WindowDays[t])],
            Realized = Slice(windows.Realized, first, count),
            Implied = impliedSlice,
            HasImplied = implied is not null,
            Forecasts = forecasts,
            HacLag = lag,
            Metrics = metrics.ToImmutable(),
            Baseline = baseline,
            Candidate = candidate,
            BaselineVersusCandidate = headToHead,
            Pairs = pairs.ToImmutable(),
            ModelConfidenceSet = mcs,
            Sweep = sweep.ToImmutable(),
            Adaptive = [.. adaptive.Select(a => a.Selection)],
            RuleTest = rule,
            DataQuality = quality,
            Warnings = [.. warnings],
        };
    }
}
