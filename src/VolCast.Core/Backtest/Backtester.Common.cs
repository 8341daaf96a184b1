using System.Collections.Immutable;

namespace VolCast.Core.Backtest;

/// <content>The common-date step of <see cref="Run"/>: every member scored on the dates all members share.</content>
public static partial class Backtester
{
    /// <summary>The ranking on the common dates and the head-to-head on them (null when baseline or candidate was left out).</summary>
    private sealed record CommonOutcome(CommonDateRanking Ranking, PairComparison? HeadToHead);

    private static CommonOutcome CommonDates(
        Frame frame, ScoredDateSet scored, List<ScoredSeries> named, ImpliedJoin join, McsSummary mcs, string baseline, string candidate)
    {
        var members = named.Where(s => mcs.Members.Contains(s.Spec)).ToList();
        var common = new List<int>(scored.Dates.Count);
        foreach (var t in scored.Dates)
        {
            var all = members.Count > 0;
            foreach (var m in members)
            {
                all &= Preconditions.IsPositive(m.Values[t]);
            }

            if (all)
            {
                common.Add(t);
            }
        }

        // The tests that cannot be computed here were already warned about on each pair's own dates.
        var scorer = new Scorer(frame.Windows.Realized, common, scored.Lag, scored.MaximumWindow, []);
        var rows = new List<CommonDateRow>(members.Count);
        foreach (var m in members)
        {
            if (scorer.Losses(m.Spec, m.Values) is not { } losses)
            {
                continue;
            }

            var versus = join.HasImplied && m.Kind != ForecastKind.Implied && mcs.Members.Contains(ImpliedSpec)
                ? scorer.Compare(m.Spec, m.Values, ImpliedSpec, join.Values)
                : null;
            rows.Add(new CommonDateRow(m.Spec, m.Kind, losses, versus));
        }

        var ranked = rows.Select((r, i) => (r, i)).OrderBy(p => p.r.Losses.Qlike).ThenBy(p => p.i).Select(p => p.r).ToImmutableArray();
        var mask = new bool[frame.Count];
        foreach (var t in common)
        {
            mask[t - frame.First] = true;
        }

        PairComparison? headToHead = null;
        if (common.Count > 0 && mcs.Members.Contains(baseline) && mcs.Members.Contains(candidate))
        {
            headToHead = scorer.Compare(candidate, Lookup(named, candidate), baseline, Lookup(named, baseline));
        }

        return new CommonOutcome(new CommonDateRanking(common.Count, [.. mask], mcs.Excluded, ranked), headToHead);
    }
}
