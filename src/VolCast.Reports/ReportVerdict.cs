using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Scoring;
using VolCast.Core.Trading;
using VolCast.Reports.Model;

namespace VolCast.Reports;

/// <summary>Writes the verdict of a backtest in plain words: the headline, then the points behind it.</summary>
/// <remarks>
/// Significance is judged at 5% on the Diebold-Mariano p-value (HAC, Harvey-Leybourne-Newbold corrected). Margins are
/// measured on the dates both sides share, so the numbers in a sentence are comparable with each other.
/// </remarks>
internal static class ReportVerdict
{
    private static readonly CultureInfo C = CultureInfo.InvariantCulture;

    /// <summary>Builds the verdict; with the rule's option P&amp;L, its answer closes the rule's point.</summary>
    public static Verdict Build(BacktestResult result, RulePnlReport? pnl)
    {
        var verdict = Build(result);
        if (pnl is null)
        {
            return verdict;
        }

        var points = verdict.Points.ToList();
        var rule = points.FindIndex(p => p.StartsWith(RulePrefix, StringComparison.Ordinal));
        var headline = ReportPnl.Headline(pnl);
        var answer = "In option trades: " + (headline.Length > 0 ? char.ToLowerInvariant(headline[0]) + headline[1..] : headline);
        if (rule < 0)
        {
            points.Add(answer);
        }
        else
        {
            points[rule] += " " + answer;
        }

        return new Verdict(verdict.Headline, points);
    }

    /// <summary>
    /// Builds the verdict: the answer about implied, then, in this order, the head-to-head of candidate against baseline
    /// (the winner named on each loss), the model confidence set, the premium and the rule. The adaptive lookback choices
    /// are in the lookback table, not here.
    /// </summary>
    public static Verdict Build(BacktestResult result)
    {
        var ranked = ReportSeries.Ranked(result);
        var headline = ranked.Count == 0
            ? "No forecaster could be scored: no date had both a forecast and a positive realized target."
            : Headline(result, ranked[0]);
        if (ReportAnswers.CommonDates(result) is { } common)
        {
            // Which dates the ranking, the answer about implied, the head-to-head and the premium rest on.
            headline += " " + common;
        }

        var points = new List<string> { HeadToHead(result), Mcs(result.ModelConfidenceSet) };
        if (result.HasImplied && ReportSeries.Premium(result).Values is { Count: > 0 } premium)
        {
            // The loss table scores implied on its own dates; say so when they are not the premium's, so two figures do not seem to disagree.
            var own = result.Metrics.FirstOrDefault(m => m.Kind == ForecastKind.Implied)?.Losses;
            var table = own is null || own.Count == premium.Count
                ? "implied's bias in the loss table, on the same dates"
                : string.Create(C, $"the loss table's bias of implied, {own.Bias * 100:0.00}, is on its own {own.Count} dates");
            points.Add(string.Create(C,
                $"Implied was above the realized volatility that followed by {premium.Average() * 100:0.00} vol points on average, on {premium.Count(v => v > 0) * 100.0 / premium.Count:0}% of the {premium.Count} dates with both ({table})."));
        }

        if (result.RuleTest is RuleTestResult rule)
        {
            points.Add(Rule(rule, result.HacLag));
        }

        return new Verdict(headline, points);
    }

    private const string RulePrefix = "Rule test";

    /// <summary>
    /// How much lower one loss is than another, in words that grow with the relative gap (common practice, no source:
    /// under 3% "slightly", 3% to 10% plain, above 10% "much"); never "much" when the test does not find the gap
    /// significant, so the words do not claim more than the test.
    /// </summary>
    internal static string Lower(double lower, double higher, bool significant = true)
    {
        var gap = higher > 0 ? (higher - lower) / higher : 0;
        var word = gap < 0.03 ? "slightly lower" : gap < 0.10 || !significant ? "lower" : "much lower";
        return string.Create(C, $"{word} ({gap * 100:0}% below)");
    }

    private static string Headline(BacktestResult result, ForecasterMetrics leader)
    {
        var first = $"{leader.Spec} ranks first on QLIKE among the forecasters";
        if (!result.HasImplied)
        {
            return string.Create(C,
                $"{first} ({leader.Losses!.Qlike:0.0000} on {leader.Losses.Count} dates); no implied series was given, so the forecasters are ranked among themselves.");
        }

        if (leader.VersusImplied is not { FirstLosses: LossSummary own, SecondLosses: LossSummary implied } pair
            || pair.Qlike is not { Statistic: double t, PValue: double p })
        {
            return first + "; its comparison with implied could not be computed (too few dates with both).";
        }

        var test = string.Create(C, $"DM {t:0.00}, {PValueText.Clause(p)}");
        var dates = result.Common is { Count: > 0 } common && common.Rows.Any(r => r.Spec == leader.Spec) ? "common dates" : "dates both have";
        var significance = p < 0.05 ? "significant at 5%" : "not significant at 5%";
        return implied.Qlike <= own.Qlike
            ? string.Create(C,
                $"{first}, but implied volatility scores {Lower(implied.Qlike, own.Qlike, p < 0.05)} on the {pair.Count} {dates} (QLIKE {implied.Qlike:0.0000} against {own.Qlike:0.0000}); {significance} ({test}).")
            : string.Create(C,
                $"{first} and scores {Lower(own.Qlike, implied.Qlike, p < 0.05)} than implied volatility on the {pair.Count} {dates} (QLIKE {own.Qlike:0.0000} against {implied.Qlike:0.0000}); {significance} ({test}).");
    }

    private static string HeadToHead(BacktestResult result)
    {
        var h = result.CandidateVersusBaseline;
        if (h.FirstLosses is null || h.SecondLosses is null)
        {
            return $"Candidate {result.Candidate} against baseline {result.Baseline}: not enough common dates to compare.";
        }

        var candidate = $"the candidate {result.Candidate}";
        var baseline = $"the baseline {result.Baseline}";
        var qlike = Loss("QLIKE", h.FirstLosses.Qlike, h.SecondLosses.Qlike, "0.0000", 1, h.Qlike, candidate, baseline);
        var mse = Loss("MSE of variance", h.FirstLosses.MseVariance, h.SecondLosses.MseVariance, "0.000", 1e3, h.MseVariance, candidate, baseline);
        var dates = ReportAnswers.HeadToHeadOnCommonDates(result) ? "common dates" : "dates both forecast";
        return string.Create(C, $"Head to head on {h.Count} {dates}: {qlike}; {mse}.");
    }

    private static string Loss(string loss, double candidate, double baseline, string format, double scale, DieboldMarianoResult? dm, string candidateName, string baselineName)
    {
        var (winner, low, high) = candidate <= baseline ? (candidateName, candidate, baseline) : (baselineName, baseline, candidate);
        var unit = scale == 1 ? string.Empty : " ×10⁻³";
        var values = string.Create(C, $"{(low * scale).ToString(format, C)} against {(high * scale).ToString(format, C)}{unit}");
        if (dm is not { Statistic: double t, PValue: double p })
        {
            return $"on {loss} {winner} scores lower ({values}), with no test";
        }

        var test = string.Create(C, $"DM {t:0.00}, {PValueText.Clause(p)}");
        return p < 0.05
            ? $"on {loss} {winner} is significantly better ({values}; {test})"
            : $"on {loss} {winner} scores lower ({values}), not significantly ({test})";
    }

    private static string Mcs(McsSummary mcs)
    {
        if (mcs.Result is not ModelConfidenceSetResult set)
        {
            return "Model confidence set: not computed (" + (mcs.Note ?? "too few members or dates") + ").";
        }

        var members = new List<string>();
        for (var i = 0; i < mcs.Members.Length; i++)
        {
            if (set.InSet[i])
            {
                members.Add(mcs.Members[i]);
            }
        }

        return string.Create(C,
            $"{(1 - set.Options.Alpha) * 100:0}% model confidence set on QLIKE ({mcs.CommonDates} common dates, {mcs.Members.Length} candidates): {string.Join(", ", members)}.");
    }

    private static string Rule(RuleTestResult rule, int lag)
    {
        var all = rule.Rows.FirstOrDefault(r => r.Source == rule.ForecastSpec && r.Signal == RuleSignal.AllDates);
        var sell = rule.Rows.FirstOrDefault(r => r.Source == rule.ForecastSpec && r.Signal == RuleSignal.SellVolatility);
        if (all?.MeanVolatilityGap is not double allGap || sell is null)
        {
            return RulePrefix + ": no dates to test.";
        }

        var fired = string.Create(C,
            $"{RulePrefix} (not a trading P&L): \"sell volatility when implied exceeds {rule.ForecastSpec} by more than {rule.ThresholdVolatility * 100:0.0} points\" fired on {sell.Count} of {all.Count} dates");
        if (sell.MeanVolatilityGap is not double gap)
        {
            return fired + ", so there is nothing to measure.";
        }

        var against = SignalledAgainstAll.Compute(rule, historical: false, RuleSignal.SellVolatility, lag);
        var test = against.PValue is double p
            ? (p < 0.05 ? "different at 5%" : "no different at 5%") + string.Create(C, $" ({PValueText.Clause(p)})")
            : "not testable";
        return fired + string.Create(C,
            $"; implied − realized averaged {gap * 100:0.00} vol points on them against {allGap * 100:0.00} on all {all.Count} dates: {test}.");
    }
}
