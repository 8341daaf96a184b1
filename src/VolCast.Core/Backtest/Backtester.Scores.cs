using System.Collections.Immutable;
using VolCast.Core.Forecasters;

namespace VolCast.Core.Backtest;

/// <content>The scoring steps of <see cref="Run"/>: scored dates, scores and tests, the sweep, the rule test, the result.</content>
public static partial class Backtester
{
    /// <summary>Every score and test of the scored series, and the baseline and candidate they were resolved to.</summary>
    private sealed record Scores(
        ImmutableArray<ForecasterMetrics> Metrics,
        ImmutableArray<PairComparison> Pairs,
        McsSummary ConfidenceSet,
        string Baseline,
        string Candidate,
        PairComparison CandidateVersusBaseline);

    /// <summary>The rule test (null without implied) and the forecast it uses, resolved whether or not it runs.</summary>
    private sealed record RuleOutcome(RuleTestResult? Result, string Forecast);

    private static ScoredDateSet ScoredDates(Frame frame)
    {
        var windows = frame.Windows;
        var scored = new List<int>();
        var zeroRealized = 0;
        var withTarget = 0;
        var minH = int.MaxValue;
        var maxH = 0;
        for (var t = frame.First; t <= frame.Last; t++)
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

        return new ScoredDateSet(scored, withTarget, zeroRealized, minH, maxH);
    }

    /// <summary>Everything scored: implied first, then configured in order (each spec once), then adaptive.</summary>
    private static List<ScoredSeries> SeriesToScore(
        ImpliedJoin join, List<IVolatilityForecaster> configured, SessionOutput sessions, List<(AdaptiveSelection Selection, double?[] Values)> adaptive)
    {
        var named = new List<ScoredSeries>();
        if (join.HasImplied)
        {
            named.Add(new ScoredSeries(ImpliedSpec, ForecastKind.Implied, join.Values, ForecasterCounts.None));
        }

        var configuredSeen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var f in configured)
        {
            if (configuredSeen.Add(f.Spec))
            {
                named.Add(new ScoredSeries(f.Spec, ForecastKind.Configured, sessions.Series[f.Spec], sessions.Counts[f.Spec]));
            }
        }

        foreach (var (selection, values) in adaptive)
        {
            named.Add(new ScoredSeries(selection.Spec, ForecastKind.Adaptive, values, ForecasterCounts.None));
        }

        return named;
    }

    private static Scores ScoresAndTests(
        Frame frame,
        ScoredDateSet scored,
        List<ScoredSeries> named,
        ImpliedJoin join,
        BacktestSettings settings,
        List<IVolatilityForecaster> configured,
        List<string> warnings,
        CancellationToken cancellationToken)
    {
        var scorer = new Scorer(frame.Windows.Realized, scored.Dates, scored.Lag, scored.MaximumWindow, warnings);
        var mcs = ConfidenceSet(named, scored.Dates, frame.Windows.Realized, settings, scored.MaximumWindow, warnings);
        var metrics = ImmutableArray.CreateBuilder<ForecasterMetrics>(named.Count);
        foreach (var series in named)
        {
            cancellationToken.ThrowIfCancellationRequested();
            metrics.Add(Metrics(series, scored.Dates, scorer, mcs, join));
        }

        var pairs = ImmutableArray.CreateBuilder<PairComparison>();
        for (var a = 0; a < named.Count; a++)
        {
            for (var b = a + 1; b < named.Count; b++)
            {
                pairs.Add(scorer.Compare(named[a].Spec, named[a].Values, named[b].Spec, named[b].Values));
            }
        }

        var available = named.Select(x => x.Spec).ToList();
        var baseline = Resolve(settings.Baseline, available, "baseline") ?? (join.HasImplied ? ImpliedSpec : configured[0].Spec);
        var candidate = Resolve(settings.Candidate, available, "candidate")
            ?? available.FirstOrDefault(s => s != baseline && s != ImpliedSpec)
            ?? baseline;
        var headToHead = scorer.Compare(candidate, Lookup(named, candidate), baseline, Lookup(named, baseline));
        return new Scores(metrics.MoveToImmutable(), pairs.ToImmutable(), mcs, baseline, candidate, headToHead);
    }

    private static ForecasterMetrics Metrics(ScoredSeries series, List<int> scored, Scorer scorer, McsSummary mcs, ImpliedJoin join)
    {
        var (spec, kind, values, _) = series;
        var missing = 0;
        foreach (var t in scored)
        {
            missing += Preconditions.IsPositive(values[t]) ? 0 : 1;
        }

        var versusImplied = join.HasImplied && kind != ForecastKind.Implied;
        var mcsIndex = mcs.Members.IndexOf(spec);
        return new ForecasterMetrics(
            spec,
            kind,
            missing,
            scorer.Losses(spec, values),
            scorer.MincerZarnowitz(spec, values),
            versusImplied ? scorer.Compare(spec, values, ImpliedSpec, join.Values) : null,
            versusImplied ? scorer.Encompassing(spec, values, join.Values) : null,
            mcsIndex >= 0 && mcs.Result is not null ? mcs.Result.PValues[mcsIndex] : null,
            mcsIndex >= 0 && mcs.Result is not null ? mcs.Result.InSet[mcsIndex] : null);
    }

    /// <summary>The in-sample sweep table, family by family.</summary>
    private static ImmutableArray<SweepRow> Sweep(
        List<(string Family, IVolatilityForecaster[] Candidates)> families, Dictionary<string, double?[]> series, List<int> scored, double?[] realized)
    {
        var sweep = ImmutableArray.CreateBuilder<SweepRow>();
        foreach (var (family, candidates) in families)
        {
            sweep.AddRange(SweepTable(family, candidates.Select(c => (c.Spec, series[c.Spec])).ToList(), scored, realized));
        }

        return sweep.ToImmutable();
    }

    private static RuleOutcome RuleStep(
        Frame frame,
        ScoredDateSet scored,
        List<ScoredSeries> named,
        ImpliedJoin join,
        BacktestSettings settings,
        Scores scores,
        ForecasterPlan plan,
        Dictionary<string, double?[]> series)
    {
        var ruleForecast = settings.RuleForecaster is null
            ? (scores.Candidate != ImpliedSpec ? scores.Candidate : plan.Configured[0].Spec)
            : Resolve(settings.RuleForecaster, named.Select(x => x.Spec).ToList(), "rule forecaster")!;
        if (!join.HasImplied)
        {
            return new RuleOutcome(null, ruleForecast);
        }

        var impliedAt = join.Values;
        var f = Lookup(named, ruleForecast);
        var h = series[plan.Historical.Spec];
        var ruleDates = scored.Dates.Where(t => Preconditions.IsPositive(impliedAt[t]) && Preconditions.IsPositive(f[t]) && Preconditions.IsPositive(h[t])).ToList();
        var rule = RuleTest.Compute(
            settings.RuleThreshold, ruleForecast, plan.Historical.Spec, ruleDates, frame.Dates, impliedAt, f, h, frame.Windows.Realized, scored.Lag);
        return new RuleOutcome(rule, ruleForecast);
    }

    private static BacktestResult Assemble(
        BacktestSettings settings,
        Frame frame,
        ImpliedJoin join,
        ForecasterPlan plan,
        ScoredDateSet scored,
        List<ScoredSeries> named,
        List<(AdaptiveSelection Selection, double?[] Values)> adaptive,
        Scores scores,
        ImmutableArray<SweepRow> sweep,
        RuleOutcome rule,
        List<string> warnings)
    {
        var (first, count, windows) = (frame.First, frame.Count, frame.Windows);
        return new BacktestResult
        {
            Settings = settings with
            {
                Forecasters = plan.Configured.Select(f => f.Spec).Distinct().ToImmutableArray(),
                Baseline = scores.Baseline,
                Candidate = scores.Candidate,
                RuleForecaster = rule.Forecast,
                RuleHistorical = plan.Historical.Spec,
                McsBlockLength = settings.McsBlockLength ?? scored.MaximumWindow,
            },
            Dates = [.. frame.Dates.AsSpan(first, count)],
            WindowDays = [.. Enumerable.Range(first, count).Select(t => windows.Realized[t] is null ? (int?)null : windows.WindowDays[t])],
            Realized = Slice(windows.Realized, first, count),
            Implied = Slice(join.Values, first, count),
            HasImplied = join.HasImplied,
            Forecasts = [.. named.Where(x => x.Kind != ForecastKind.Implied).Select(x => new ForecastSeries(x.Spec, x.Kind, Slice(x.Values, first, count), x.Counts))],
            HacLag = scored.Lag,
            Metrics = scores.Metrics,
            Baseline = scores.Baseline,
            Candidate = scores.Candidate,
            CandidateVersusBaseline = scores.CandidateVersusBaseline,
            Pairs = scores.Pairs,
            ModelConfidenceSet = scores.ConfidenceSet,
            Sweep = sweep,
            Adaptive = [.. adaptive.Select(a => a.Selection)],
            RuleTest = rule.Result,
            DataQuality = Quality(frame, join, scored),
            Warnings = [.. warnings],
        };
    }

    private static DataQualityCounts Quality(Frame frame, ImpliedJoin join, ScoredDateSet scored)
    {
        var count = frame.Count;
        var scoredWithImplied = 0;
        foreach (var t in scored.Dates)
        {
            scoredWithImplied += join.Values[t] is null ? 0 : 1;
        }

        return new DataQualityCounts(
            frame.Dates.Length,
            count,
            scored.WithTarget,
            count - scored.WithTarget,
            scored.ZeroRealized,
            join.Rows,
            join.MatchedInRange,
            count - join.MatchedInRange,
            join.RowsInRange - join.MatchedInRange,
            scored.WithTarget == 0 ? 0 : scored.MinimumWindow,
            scored.MaximumWindow,
            scored.Dates.Count,
            scoredWithImplied);
    }
}
