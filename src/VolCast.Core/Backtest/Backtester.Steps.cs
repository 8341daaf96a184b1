using System.Collections.Concurrent;
using System.Collections.Immutable;
using System.Globalization;
using VolCast.Core.Data;
using VolCast.Core.Estimators;
using VolCast.Core.Forecasters;
using VolCast.Core.Scoring;

namespace VolCast.Core.Backtest;

/// <content>The steps of <see cref="Run"/> up to the forecasts: frame the dates, join implied, plan and run the forecasters, the adaptive choice.</content>
public static partial class Backtester
{
    private static string Text(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);

    /// <summary>The dates of the run: the whole history (forecasters warm up on it), the forecast dates first..last and each date's realized window.</summary>
    private sealed record Frame(DateOnly[] Dates, int First, int Last, RealizedWindows Windows)
    {
        public int Count => Last - First + 1;
    }

    /// <summary>Implied joined by date over the whole history, with what matched between start and end.</summary>
    private sealed record ImpliedJoin(double?[] Values, bool HasImplied, int Rows, int RowsInRange, int MatchedInRange);

    /// <summary>Every forecaster the run needs: the configured ones, the sweep's families, the rule's historical estimate; each spec once in <see cref="All"/>.</summary>
    private sealed record ForecasterPlan(
        List<IVolatilityForecaster> Configured,
        List<(string Family, IVolatilityForecaster[] Candidates)> Families,
        IVolatilityForecaster Historical,
        IVolatilityForecaster[] All);

    /// <summary>Each forecaster's forecasts at every row up to the end date, and the counts its session kept, by spec.</summary>
    private sealed record SessionOutput(Dictionary<string, double?[]> Series, Dictionary<string, ForecasterCounts> Counts);

    /// <summary>The scored dates (realized window closed, target above zero) and the window lengths among dates with a target.</summary>
    private sealed record ScoredDateSet(List<int> Dates, int WithTarget, int ZeroRealized, int MinimumWindow, int MaximumWindow)
    {
        /// <summary>Gets the HAC and Diebold-Mariano lag: the longest window − 1.</summary>
        public int Lag => MaximumWindow - 1;
    }

    private static Frame FrameDates(PriceHistory prices, BacktestSettings settings)
    {
        var n = prices.Count;
        var dates = prices.Dates.ToArray();
        if (n < 2)
        {
            throw new BacktestDataException(Text($"The price history has {n} row(s); a backtest needs at least two."));
        }

        var (first, last) = DateRange(dates, settings);
        var windows = RealizedWindows.Compute(prices, settings.Horizon, settings.Target, settings.AnnualizationFactor);
        CheckHorizon(dates, first, last, windows, settings.Horizon);
        return new Frame(dates, first, last, windows);
    }

    private static ImpliedJoin JoinImplied(Frame frame, ImpliedSeries? implied)
    {
        var (dates, first, last) = (frame.Dates, frame.First, frame.Last);
        var n = dates.Length;
        var impliedAt = new double?[n];
        if (implied is null)
        {
            return new ImpliedJoin(impliedAt, false, 0, 0, 0);
        }

        var impliedRowsInRange = 0;
        var matchedInRange = 0;
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
                $"No date is shared by the prices ({dates[first]:yyyy-MM-dd} to {dates[last]:yyyy-MM-dd}, {last - first + 1} forecast dates) and the implied series ({(implied.Count == 0 ? "empty" : Text($"{id[0]:yyyy-MM-dd} to {id[implied.Count - 1]:yyyy-MM-dd}, {implied.Count} rows"))}); check that both files cover the same period, or leave out --implied."),
                BacktestInput.Implied);
        }

        return new ImpliedJoin(impliedAt, true, implied.Count, impliedRowsInRange, matchedInRange);
    }

    /// <summary>Configured, then extra, then the sweep, then the rule's historical estimate; each spec runs once.</summary>
    private static ForecasterPlan PlanForecasters(
        Frame frame, BacktestSettings settings, bool hasRange, IReadOnlyList<IVolatilityForecaster>? additional, bool hasImplied)
    {
        var configured = ConfiguredForecasters(settings, hasRange, hasImplied, additional);
        var all = new Dictionary<string, IVolatilityForecaster>(StringComparer.Ordinal);
        foreach (var f in configured)
        {
            all.TryAdd(f.Spec, f);
        }

        var families = SweepFamilies(settings, hasRange, configured);
        foreach (var (_, candidates) in families)
        {
            foreach (var c in candidates)
            {
                all.TryAdd(c.Spec, c);
            }
        }

        if (settings.Sweep && families.Count > 0 && settings.SelectionWindowDays > frame.Last + 1)
        {
            throw new BacktestDataException(Text(
                $"The selection window of {settings.SelectionWindowDays} trading days is longer than the sample: the history has {frame.Last + 1} rows up to the end date {frame.Dates[frame.Last]:yyyy-MM-dd}; set a shorter selectionWindowDays in the configuration or use a longer history."));
        }

        var historical = ForecasterSpec.Parse(settings.RuleHistorical ?? Text($"close-to-close:{Math.Max(2, settings.Horizon.NominalDays)}"));
        all.TryAdd(historical.Spec, historical);
        return new ForecasterPlan(configured, families, historical, [.. all.Values]);
    }

    private static (int First, int Last) DateRange(DateOnly[] dates, BacktestSettings settings)
    {
        var n = dates.Length;
        var first = 0;
        while (first < n && settings.Start is DateOnly s && dates[first] < s)
        {
            first++;
        }

        var last = n - 1;
        while (last >= 0 && settings.End is DateOnly e && dates[last] > e)
        {
            last--;
        }

        if (first > last)
        {
            throw new BacktestDataException(Text(
                $"No price date lies between start {settings.Start?.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture) ?? "(first)"} and end {settings.End?.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture) ?? "(last)"}: the prices run from {dates[0]:yyyy-MM-dd} to {dates[n - 1]:yyyy-MM-dd}; change --start/--end."));
        }

        return (first, last);
    }

    private static void CheckHorizon(DateOnly[] dates, int first, int last, RealizedWindows windows, BacktestHorizon horizon)
    {
        for (var t = first; t <= last; t++)
        {
            if (windows.Realized[t] is not null)
            {
                return;
            }
        }

        var what = horizon.TradingDays is int h
            ? Text($"a horizon of {h} trading days needs at least {h} more price rows after the first forecast date {dates[first]:yyyy-MM-dd}, but only {dates.Length - 1 - first} follow it")
            : Text($"a tenor of {horizon.TenorCalendarDays} calendar days needs prices at least {horizon.TenorCalendarDays} days after the first forecast date {dates[first]:yyyy-MM-dd}, but they end on {dates[^1]:yyyy-MM-dd}");
        throw new BacktestDataException(Text(
            $"The horizon is longer than the data allows: {what} (the prices have {dates.Length} rows from {dates[0]:yyyy-MM-dd} to {dates[^1]:yyyy-MM-dd}; forecast dates {dates[first]:yyyy-MM-dd} to {dates[last]:yyyy-MM-dd}). Choose a shorter --horizon/--tenor or an earlier --start."));
    }

    private static List<IVolatilityForecaster> ConfiguredForecasters(
        BacktestSettings settings, bool hasRange, bool hasImplied, IReadOnlyList<IVolatilityForecaster>? additional)
    {
        var specs = settings.Forecasters.IsDefaultOrEmpty
            ? (hasRange ? BacktestSettings.DefaultForecasters : BacktestSettings.DefaultCloseOnlyForecasters)
            : settings.Forecasters;
        var list = new List<IVolatilityForecaster>();
        foreach (var spec in specs)
        {
            if (UserForecaster.IsUserSpec(spec))
            {
                // A user's column runs as an additional forecaster; listing it only says it is wanted.
                var canonical = UserForecaster.Canonical(spec);
                if (additional is null || !additional.Any(a => a.Spec == canonical))
                {
                    throw new ArgumentException(Text($"The forecaster '{spec}' is in the configuration but no forecasts file has a column '{canonical[UserForecaster.Prefix.Length..]}'; give it with --forecasts FILE or remove it."));
                }

                continue;
            }

            var f = ForecasterSpec.Parse(spec);
            if (f.Spec == ImpliedSpec)
            {
                if (!hasImplied)
                {
                    throw new ArgumentException("The forecaster 'implied' is in the configuration but no implied series was given; add --implied FILE or remove 'implied'.");
                }

                // Implied is always scored as the reference; listing it adds nothing.
                continue;
            }

            list.Add(f);
        }

        if (additional is not null)
        {
            list.AddRange(additional);
        }

        if (list.Count == 0)
        {
            throw new ArgumentException("The configuration names no forecaster besides implied; add at least one, for example \"yang-zhang:21\".");
        }

        return list;
    }

    private static List<(string Family, IVolatilityForecaster[] Candidates)> SweepFamilies(
        BacktestSettings settings, bool hasRange, List<IVolatilityForecaster> configured)
    {
        var families = new List<(string, IVolatilityForecaster[])>();
        if (!settings.Sweep)
        {
            return families;
        }

        // Unless the full sweep is asked for, only the families the user listed are swept.
        var listed = configured.OfType<HistoricalWindowForecaster>().Select(f => f.Estimator).ToHashSet();
        foreach (var estimator in settings.SweepEstimators.Distinct())
        {
            if ((EstimatorNames.NeedsRange(estimator) && !hasRange) || (!settings.FullSweep && !listed.Contains(estimator)))
            {
                continue;
            }

            if (!settings.SweepLookbacks.IsDefaultOrEmpty)
            {
                families.Add((EstimatorNames.Name(estimator),
                    settings.SweepLookbacks.Distinct().Select(w => (IVolatilityForecaster)new HistoricalWindowForecaster(estimator, w)).ToArray()));
            }
        }

        if (!settings.EwmaLambdas.IsDefaultOrEmpty && (settings.FullSweep || configured.OfType<EwmaForecaster>().Any()))
        {
            families.Add(("ewma", settings.EwmaLambdas.Distinct().Select(l => (IVolatilityForecaster)new EwmaForecaster(l)).ToArray()));
        }

        return families;
    }

    private static SessionOutput RunSessions(
        PriceHistory prices,
        ImpliedSeries? implied,
        BacktestSettings settings,
        IVolatilityForecaster[] forecasters,
        int last,
        int sessionsInParallel,
        IProgress<BacktestProgress>? progress,
        CancellationToken cancellationToken)
    {
        // One input for every session, so that per-history work (the estimators' bar terms) is done once.
        var input = new ForecastInput(prices, implied, settings.Horizon.NominalDays, settings.AnnualizationFactor)
        {
            SelectionWindowDays = settings.SelectionWindowDays,
        };

        // Start every session first, on this thread, so that a forecaster that cannot run says so before any work.
        var sessions = new IForecastSession[forecasters.Length];
        for (var i = 0; i < forecasters.Length; i++)
        {
            sessions[i] = forecasters[i].Start(input);
        }

        // Taken one at a time in plan order (configured forecasters, the model fits among them, come first), so that
        // the parallel loop ends evenly.
        var values = new double?[forecasters.Length][];
        var done = 0;
        progress?.Report(new BacktestProgress("forecasting", 0, forecasters.Length));
        void Walk(int i)
        {
            var session = sessions[i];
            var v = new double?[last + 1];
            for (var t = 0; t <= last; t++)
            {
                // A model forecaster refits as it walks; checking every 64 dates keeps Ctrl-C prompt at no measurable cost.
                if ((t & 63) == 0)
                {
                    cancellationToken.ThrowIfCancellationRequested();
                }

                v[t] = session.Forecast(t);
            }

            values[i] = v;
            var now = Interlocked.Increment(ref done);
            progress?.Report(new BacktestProgress("forecasting", now, forecasters.Length));
        }

        if (sessionsInParallel == 1)
        {
            for (var i = 0; i < forecasters.Length; i++)
            {
                Walk(i);
            }
        }
        else
        {
            Parallel.ForEach(
                Partitioner.Create(Enumerable.Range(0, forecasters.Length), EnumerablePartitionerOptions.NoBuffering),
                new ParallelOptions { CancellationToken = cancellationToken, MaxDegreeOfParallelism = sessionsInParallel > 0 ? sessionsInParallel : Environment.ProcessorCount },
                Walk);
        }

        var output = new SessionOutput(new(StringComparer.Ordinal), new(StringComparer.Ordinal));
        for (var i = 0; i < forecasters.Length; i++)
        {
            output.Series[forecasters[i].Spec] = values[i];
            output.Counts[forecasters[i].Spec] = sessions[i].Counts;
        }

        return output;
    }

    private static List<(AdaptiveSelection Selection, double?[] Values)> ChooseAdaptive(
        Frame frame,
        List<(string Family, IVolatilityForecaster[] Candidates)> families,
        Dictionary<string, double?[]> series,
        BacktestSettings settings,
        CancellationToken cancellationToken)
    {
        var (first, last) = (frame.First, frame.Last);
        var adaptive = new List<(AdaptiveSelection Selection, double?[] Values)>();
        foreach (var (family, candidates) in families)
        {
            cancellationToken.ThrowIfCancellationRequested();
            var candidateSeries = candidates.Select(c => series[c.Spec]).ToArray();
            var choice = new int[last + 1];
            var values = AdaptiveLookback.Choose(candidateSeries, frame.Windows, last, settings.SelectionWindowDays, choice);
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
        }

        return adaptive;
    }

    private static McsSummary ConfidenceSet(
        List<ScoredSeries> named,
        List<int> scored,
        double?[] realized,
        BacktestSettings settings,
        int maxH,
        List<string> warnings)
    {
        var members = new List<(string Spec, double?[] Values)>();
        var excluded = ImmutableArray.CreateBuilder<string>();
        foreach (var (spec, _, values, _) in named)
        {
            var have = scored.Count(t => Preconditions.IsPositive(values[t]));
            if (2 * have >= scored.Count && have > 0)
            {
                members.Add((spec, values));
            }
            else
            {
                excluded.Add(spec);
            }
        }

        var common = scored.Where(t => members.TrueForAll(m => Preconditions.IsPositive(m.Values[t]))).ToList();
        var memberSpecs = members.Select(m => m.Spec).ToImmutableArray();
        if (members.Count < 2 || common.Count < 2)
        {
            var note = members.Count < 2
                ? Text($"fewer than two forecasters with forecasts on at least half of the {scored.Count} scored dates")
                : Text($"only {common.Count} date(s) on which every member has a forecast");
            warnings.Add("Model confidence set not computed: " + note + ".");
            return new McsSummary(memberSpecs, excluded.ToImmutable(), common.Count, null, note);
        }

        var losses = new List<double[]>(members.Count);
        foreach (var (_, values) in members)
        {
            var l = new double[common.Count];
            for (var i = 0; i < common.Count; i++)
            {
                l[i] = Losses.Qlike(realized[common[i]]!.Value, values[common[i]]!.Value);
            }

            losses.Add(l);
        }

        var options = new ModelConfidenceSetOptions(
            Math.Min(settings.McsBlockLength ?? maxH, common.Count), settings.McsSeed, settings.McsAlpha, settings.McsReplications);
        var result = ModelConfidenceSet.Compute(losses, options);
        return new McsSummary(memberSpecs, excluded.ToImmutable(), common.Count, result, null);
    }

    private static string? Resolve(string? spec, List<string> available, string role)
    {
        if (spec is null)
        {
            return null;
        }

        var trimmed = spec.Trim();
        var canonical = trimmed.Equals(ImpliedSpec, StringComparison.OrdinalIgnoreCase) || trimmed.StartsWith("adaptive:", StringComparison.OrdinalIgnoreCase)
            ? trimmed.ToLowerInvariant()
            : UserForecaster.IsUserSpec(trimmed) ? UserForecaster.Canonical(trimmed) : ForecasterSpec.Parse(trimmed).Spec;
        if (!available.Contains(canonical))
        {
            throw new ArgumentException(Text(
                $"The {role} '{spec}' is not among the forecasters of this run; choose one of: {string.Join(", ", available)} (add it to the forecasters list first)."));
        }

        return canonical;
    }

    private static double?[] Lookup(List<ScoredSeries> named, string spec) =>
        named.First(x => x.Spec == spec).Values;

    private static ImmutableArray<double?> Slice(double?[] values, int first, int count) => [.. values.AsSpan(first, count)];

    private static List<SweepRow> SweepTable(string family, List<(string Spec, double?[] Values)> candidates, List<int> scored, double?[] realized)
    {
        var common = scored.Where(t => candidates.TrueForAll(c => Preconditions.IsPositive(c.Values[t]))).ToList();
        var rows = new List<SweepRow>(candidates.Count);
        var best = -1;
        var summaries = new LossSummary?[candidates.Count];
        for (var c = 0; c < candidates.Count; c++)
        {
            if (common.Count == 0)
            {
                continue;
            }

            var rv = common.Select(t => realized[t]!.Value).ToArray();
            var f = common.Select(t => candidates[c].Values[t]!.Value).ToArray();
            summaries[c] = Losses.Summarize(rv, f);
            if (best < 0 || summaries[c]!.Qlike < summaries[best]!.Qlike)
            {
                best = c;
            }
        }

        for (var c = 0; c < candidates.Count; c++)
        {
            var s = summaries[c];
            rows.Add(new SweepRow(family, candidates[c].Spec, common.Count, s?.Qlike, s?.MseVariance, s?.RmseVolatility, c == best));
        }

        return rows;
    }
}
