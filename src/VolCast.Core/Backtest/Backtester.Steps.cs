using System.Collections.Immutable;
using System.Globalization;
using VolCast.Core.Data;
using VolCast.Core.Estimators;
using VolCast.Core.Forecasters;
using VolCast.Core.Scoring;

namespace VolCast.Core.Backtest;

/// <content>The steps of <see cref="Run"/>.</content>
public static partial class Backtester
{
    private static string Text(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);

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

    private static List<(string Family, IVolatilityForecaster[] Candidates)> SweepFamilies(BacktestSettings settings, bool hasRange)
    {
        var families = new List<(string, IVolatilityForecaster[])>();
        if (!settings.Sweep)
        {
            return families;
        }

        foreach (var estimator in settings.SweepEstimators.Distinct())
        {
            if (EstimatorNames.NeedsRange(estimator) && !hasRange)
            {
                continue;
            }

            if (!settings.SweepLookbacks.IsDefaultOrEmpty)
            {
                families.Add((EstimatorNames.Name(estimator),
                    settings.SweepLookbacks.Distinct().Select(w => (IVolatilityForecaster)new HistoricalWindowForecaster(estimator, w)).ToArray()));
            }
        }

        if (!settings.EwmaLambdas.IsDefaultOrEmpty)
        {
            families.Add(("ewma", settings.EwmaLambdas.Distinct().Select(l => (IVolatilityForecaster)new EwmaForecaster(l)).ToArray()));
        }

        return families;
    }

    private static (Dictionary<string, double?[]> Series, Dictionary<string, ForecasterCounts> Counts) RunSessions(
        PriceHistory prices,
        ImpliedSeries? implied,
        BacktestSettings settings,
        IVolatilityForecaster[] forecasters,
        int last,
        IProgress<BacktestProgress>? progress,
        CancellationToken cancellationToken)
    {
        var input = new ForecastInput(prices, implied, settings.Horizon.NominalDays, settings.AnnualizationFactor);
        EstimatorTerms? terms = forecasters.Any(f => f is HistoricalWindowForecaster) ? EstimatorTerms.From(prices) : null;

        // Start every session first, on this thread, so that a forecaster that cannot run says so before any work.
        var sessions = new IForecastSession[forecasters.Length];
        for (var i = 0; i < forecasters.Length; i++)
        {
            sessions[i] = forecasters[i] is HistoricalWindowForecaster hw ? hw.Start(input, terms!) : forecasters[i].Start(input);
        }

        // The slow ones (model fits) first, so that the parallel loop ends evenly.
        var order = Enumerable.Range(0, forecasters.Length)
            .OrderBy(i => forecasters[i] is HistoricalWindowForecaster or EwmaForecaster ? 1 : 0)
            .ThenBy(i => i)
            .ToArray();
        var values = new double?[forecasters.Length][];
        var done = 0;
        progress?.Report(new BacktestProgress("forecasting", 0, forecasters.Length));
        Parallel.For(
            0,
            order.Length,
            new ParallelOptions { CancellationToken = cancellationToken, MaxDegreeOfParallelism = Environment.ProcessorCount },
            k =>
            {
                var i = order[k];
                var session = sessions[i];
                var v = new double?[last + 1];
                for (var t = 0; t <= last; t++)
                {
                    v[t] = session.Forecast(t);
                }

                values[i] = v;
                var now = Interlocked.Increment(ref done);
                progress?.Report(new BacktestProgress("forecasting", now, forecasters.Length));
            });

        var series = new Dictionary<string, double?[]>(StringComparer.Ordinal);
        var counts = new Dictionary<string, ForecasterCounts>(StringComparer.Ordinal);
        for (var i = 0; i < forecasters.Length; i++)
        {
            series[forecasters[i].Spec] = values[i];
            counts[forecasters[i].Spec] = sessions[i].Counts;
        }

        return (series, counts);
    }

    private static McsSummary ConfidenceSet(
        List<(string Spec, ForecastKind Kind, double?[] Values, ForecasterCounts Counts)> named,
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
            : ForecasterSpec.Parse(trimmed).Spec;
        if (!available.Contains(canonical))
        {
            throw new ArgumentException(Text(
                $"The {role} '{spec}' is not among the forecasters of this run; choose one of: {string.Join(", ", available)} (add it to the forecasters list first)."));
        }

        return canonical;
    }

    private static double?[] Lookup(List<(string Spec, ForecastKind Kind, double?[] Values, ForecasterCounts Counts)> named, string spec) =>
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
            rows.Add(new SweepRow(family, candidates[c].Spec, common.Count, s?.Qlike, s?.MseVariance, s?.RmseVolatility, c == best, InSample: true));
        }

        return rows;
    }
}
