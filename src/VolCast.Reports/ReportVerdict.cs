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

    /// <summary>Builds the verdict; with the rule's option P&amp;L, its one answer leads and the forecast headline follows as the first point.</summary>
    public static Verdict Build(BacktestResult result, RulePnlReport? pnl)
    {
        var verdict = Build(result);
        return pnl is null ? verdict : new Verdict(ReportPnl.Headline(pnl), [verdict.Headline, .. verdict.Points]);
    }

    /// <summary>Builds the verdict.</summary>
    public static Verdict Build(BacktestResult result)
    {
        var ranked = ReportSeries.Ranked(result);
        var points = new List<string> { HeadToHead(result) };
        string headline;
        if (ranked.Count == 0)
        {
            headline = "No forecaster could be scored: no date had both a forecast and a positive realized target.";
        }
        else
        {
            var leader = ranked[0];
            headline = Headline(result, leader);
            if (leader.VersusImplied is { FirstLosses: not null, SecondLosses: not null } pair)
            {
                points.Add(Margin(pair));
            }

            if (ReportSeries.ImpliedLosses(result) is LossSummary implied && implied.Qlike < leader.Losses!.Qlike)
            {
                points.Add(string.Create(C,
                    $"Implied volatility itself scores a lower QLIKE ({implied.Qlike:0.0000} over {implied.Count} dates) than every forecaster."));
            }
        }

        if (ReportAnswers.CommonDates(result) is { } common)
        {
            points.Insert(0, common);
        }

        points.Add(Mcs(result.ModelConfidenceSet));
        foreach (var adaptive in result.Adaptive)
        {
            points.Add(ReportAnswers.Lookback(result, adaptive.Family) ?? Adaptive(adaptive));
        }

        if (result.HasImplied && ReportSeries.Premium(result).Values is { Count: > 0 } premium)
        {
            points.Add(string.Create(C,
                $"Implied was above the realized volatility that followed by {premium.Average() * 100:0.0} vol points on average ({premium.Count(v => v > 0) * 100.0 / premium.Count:0}% of {premium.Count} dates)."));
        }

        if (result.RuleTest is RuleTestResult rule)
        {
            points.Add(Rule(rule));
        }

        return new Verdict(headline, points);
    }

    private static string Headline(BacktestResult result, ForecasterMetrics leader)
    {
        var first = string.Create(C, $"{leader.Spec} ranks first on QLIKE among the forecasters ({leader.Losses!.Qlike:0.0000})");
        if (!result.HasImplied)
        {
            return first + "; no implied series was given, so the forecasters are ranked among themselves.";
        }

        if (leader.VersusImplied?.Qlike is not { Statistic: double t, PValue: double p } dm)
        {
            return first + "; its comparison with implied could not be computed.";
        }

        var test = string.Create(C, $"Diebold-Mariano {t:0.00}, p = {P(p)}");
        return dm.MeanDifferential < 0
            ? p < 0.05
                ? $"{first} and beats implied volatility significantly ({test})."
                : $"{first}; it scores below implied volatility, but not significantly ({test})."
            : p < 0.05
                ? $"{first}, but implied volatility does significantly better ({test})."
                : $"{first}; implied volatility scores a little lower, and the difference is not significant ({test}).";
    }

    private static string Margin(PairComparison pair)
    {
        var first = pair.FirstLosses!;
        var implied = pair.SecondLosses!;
        var qlike = first.Qlike - implied.Qlike;
        var rmse = (first.RmseVolatility - implied.RmseVolatility) * 100;
        return string.Create(C,
            $"Against implied on the {pair.Count} dates both have: QLIKE {first.Qlike:0.0000} vs {implied.Qlike:0.0000} ({Signed(qlike, "0.0000")}), RMSE {first.RmseVolatility * 100:0.00} vs {implied.RmseVolatility * 100:0.00} vol points ({Signed(rmse, "0.00")} points); negative favours {pair.First}.");
    }

    private static string HeadToHead(BacktestResult result)
    {
        var h = result.CandidateVersusBaseline;
        if (h.Qlike is not { Statistic: double t, PValue: double p } || h.FirstLosses is null || h.SecondLosses is null)
        {
            return $"Candidate {result.Candidate} against baseline {result.Baseline}: not enough common dates to compare.";
        }

        var better = h.FirstLosses.Qlike < h.SecondLosses.Qlike ? $"candidate {result.Candidate}" : $"baseline {result.Baseline}";
        var word = p < 0.05 ? "significantly" : "but not significantly";
        var mse = h.MseVariance is { Statistic: double mt, PValue: double mp }
            ? string.Create(C, $"; on MSE of variance DM {mt:0.00}, p = {P(mp)}")
            : string.Empty;
        return string.Create(C,
            $"Head to head, candidate {result.Candidate} against baseline {result.Baseline} ({h.Count} common dates): QLIKE {h.FirstLosses.Qlike:0.0000} vs {h.SecondLosses.Qlike:0.0000}, lower for the {better}, {word} (DM {t:0.00}, p = {P(p)}){mse}.");
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

    private static string Adaptive(AdaptiveSelection adaptive)
    {
        var counts = new Dictionary<string, int>(StringComparer.Ordinal);
        string? last = null;
        foreach (var choice in adaptive.Choices)
        {
            if (choice is not null)
            {
                counts[choice] = counts.GetValueOrDefault(choice) + 1;
                last = choice;
            }
        }

        if (last is null)
        {
            return $"{adaptive.Spec}: no out-of-sample choice was possible.";
        }

        var top = counts.OrderByDescending(p => p.Value).ThenBy(p => adaptive.Candidates.IndexOf(p.Key)).First();
        var spacing = adaptive.ChangeCount == 0 ? "never changed" : string.Create(C, $"changed {adaptive.ChangeCount} times, about once every {adaptive.DatesWithChoice / (double)adaptive.ChangeCount:0} dates");
        return string.Create(C,
            $"Adaptive {adaptive.Family} choice (out of sample): {top.Key} most often ({top.Value * 100.0 / adaptive.DatesWithChoice:0}% of {adaptive.DatesWithChoice} dates), {last} at the end; it {spacing}.");
    }

    private static string Rule(RuleTestResult rule)
    {
        var all = rule.Rows.FirstOrDefault(r => r.Source == rule.ForecastSpec && r.Signal == RuleSignal.AllDates);
        var sell = rule.Rows.FirstOrDefault(r => r.Source == rule.ForecastSpec && r.Signal == RuleSignal.SellVolatility);
        if (all?.MeanVolatilityGap is not double allGap || sell is null)
        {
            return "Rule test: no dates to test.";
        }

        var sellText = sell.MeanVolatilityGap is double gap
            ? string.Create(C, $"implied − realized averaged {gap * 100:0.0} vol points there (hit rate {sell.HitRate * 100:0}%)")
            : "so there is nothing to measure";
        return string.Create(C,
            $"Rule test (not a trading P&L): \"sell volatility when implied exceeds {rule.ForecastSpec} by more than {rule.ThresholdVolatility * 100:0.0} points\" fired on {sell.Count} of {all.Count} dates; {sellText}, against {allGap * 100:0.0} on all dates.");
    }

    internal static string P(double p) => p < 0.0001 ? "< 0.0001" : p.ToString("0.0000", C);

    private static string Signed(double value, string format) => (value >= 0 ? "+" : "−") + Math.Abs(value).ToString(format, C);
}
