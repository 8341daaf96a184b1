using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Scoring;
using VolCast.Reports.Model;

namespace VolCast.Reports;

/// <summary>
/// The answers a practitioner acts on, as sentences and tables: the one date set of the ranking, which lookback per
/// family (with its ties), and the results by calendar year, by the volatility level known at the forecast date and with or without event windows.
/// </summary>
internal static class ReportAnswers
{
    private static readonly CultureInfo C = CultureInfo.InvariantCulture;

    /// <summary>The caution printed beside the event results whenever dates were added after the fact.</summary>
    public const string AddedAfterTheFact =
        "Dates added after the fact (marked as not scheduled) were chosen knowing what happened on them: results without them drop the worst days by hindsight, which no one could have traded.";

    /// <summary>The title of the by-year table, under which the report draws the by-year chart.</summary>
    public const string YearTitle = "By calendar year";

    /// <summary>Says which dates the ranking uses and who was left out of them; null without common dates.</summary>
    public static string? CommonDates(BacktestResult result)
    {
        if (result.Common is not { Count: > 0 } common)
        {
            return null;
        }

        var (first, last) = Span(result, common);
        var who = result.HasImplied ? "every compared forecaster and implied" : "every compared forecaster";
        var text = string.Create(C, $"The ranking, the verdict, the head-to-head and the premium use the {common.Count} dates that {who} share ({first:yyyy-MM-dd} to {last:yyyy-MM-dd})");
        return common.LeftOut.IsEmpty
            ? text + "; no forecaster was left out."
            : text + $"; left out because they start late (forecasts on fewer than half of the scored dates): {string.Join(", ", common.LeftOut)}, whose own-date figures stay in the tables.";
    }

    /// <summary>Whether the head-to-head of candidate and baseline is on the common dates (both are members of the common set).</summary>
    public static bool HeadToHeadOnCommonDates(BacktestResult result) =>
        result.Common is { Count: > 0 } common
        && common.Rows.Any(r => r.Spec == result.Candidate)
        && common.Rows.Any(r => r.Spec == result.Baseline)
        && result.CandidateVersusBaseline.Count == common.Count;

    /// <summary>The one-sentence lookback answer of a family; null when the run has none for it.</summary>
    public static string? Lookback(BacktestResult result, string family)
    {
        var a = result.Lookbacks.FirstOrDefault(x => x.Family == family);
        if (a is null)
        {
            return null;
        }

        var best = a.InSampleBest is null ? "no lookback could be scored in-sample" : $"{a.InSampleBest} has the lowest loss in-sample";
        var last = a.LastChoice is null ? "there was no walk-forward choice" : $"the walk-forward choice on the last date is {a.LastChoice}";
        var ties = TieText(a);
        var stable = a.MostChosen is null
            ? string.Empty
            : string.Create(C, $"; out of sample it chose {a.MostChosen} on {a.MostChosenShare * 100:0}% of {a.DatesWithChoice} dates and changed {a.ChangeCount} times");
        return $"Which {family} lookback: {best}, {last}; {ties}{stable}.";
    }

    /// <summary>The tables of the answers section: common-date ranking, lookbacks, and the groups.</summary>
    public static IReadOnlyList<TextTable> Tables(BacktestResult result, GroupedResults groups)
    {
        var tables = new List<TextTable>();
        if (result.Common is { Count: > 0 } common)
        {
            tables.Add(new TextTable(
                string.Create(C, $"Ranking on the {common.Count} common dates"),
                ["Forecaster", "QLIKE", "RMSE (vol points)", "DM vs implied (common dates)", "p"],
                [.. common.Rows.Select(r => (IReadOnlyList<string>)[
                    r.Spec, F(r.Losses.Qlike, "0.0000"), F(r.Losses.RmseVolatility * 100, "0.00"), F(r.VersusImplied?.Qlike?.Statistic, "0.00"), Pv(r.VersusImplied?.Qlike?.PValue)])],
                CommonDates(result) + " DM vs implied here is on the common dates, the figure the verdict quotes; the loss table under Metrics scores each forecaster on its own dates, so its DM figures differ a little."));
        }

        if (!result.Lookbacks.IsEmpty)
        {
            tables.Add(new TextTable(
                "Which lookback",
                ["Family", "Best in-sample", "Walk-forward choice (last date)", "Tied with the best", "Most chosen out of sample", "Changes", "Dates every lookback scored"],
                [.. result.Lookbacks.Select(a => (IReadOnlyList<string>)[
                    a.Family,
                    (a.InSampleBest ?? "—") + " (in-sample)",
                    a.LastChoice ?? "—",
                    a.TieSet.IsEmpty ? "not computed" : string.Join(", ", a.TieSet),
                    a.MostChosen is null ? "—" : string.Create(C, $"{a.MostChosen} ({a.MostChosenShare * 100:0}%)"),
                    a.ChangeCount.ToString(C),
                    a.CommonDates.ToString(C)])],
                string.Create(C, $"Tied: the {(result.Lookbacks[0].Level * 100):0}% model confidence set over the family's lookbacks on QLIKE (moving-block bootstrap, blocks at least the horizon). The in-sample best was picked after seeing every date; only the walk-forward choice could have been used at the time. The dates are those on which every lookback of the family has a forecast and a known target, the dates the in-sample best and the ties are judged on; the walk-forward choice exists on slightly different dates (its own table under Metrics counts them).")));
        }

        var years = groups.Rows.Where(r => r.Grouping == "year").Select(r => r.Group).Distinct().Count();
        AddGroup(tables, groups, "year", YearTitle, years == 1 ? "A result carried by one year shows here. " + Charts.GroupCharts.OneYear : "A result carried by one year shows here.");
        AddGroup(tables, groups, "regime", "By volatility level known at the forecast date",
            string.Create(C, $"Level known at the forecast date: the trailing {GroupedScores.RegimeWindowDays}-day realized volatility on that date against its terciles on that date and every earlier one (no later data); calm is the lowest third, stressed the highest. From {GroupedScores.RegimeHistoryDays} days of history on; {groups.DatesWithoutRegime} earlier dates have no level. These are not the thirds of the odds section, which sort each window by the realized volatility that followed, in hindsight."));
        if (!groups.Events.IsEmpty)
        {
            var note = "Windows are the forecast's realized windows; a window with an event is scored in its event group, all others under \"without events\".";
            if (groups.Events.Any(e => !e.Scheduled))
            {
                note += " " + AddedAfterTheFact;
            }

            AddGroup(tables, groups, "events", "With and without event windows", note);
        }

        return tables;
    }

    /// <summary>The lines of the data section that list the events given.</summary>
    public static IReadOnlyList<string> EventLines(GroupedResults groups)
    {
        if (groups.Events.IsEmpty)
        {
            return [];
        }

        var lines = new List<string>
        {
            string.Create(C, $"Events: {groups.Events.Length} dates ({groups.Events.Count(e => e.Scheduled)} scheduled, {groups.Events.Count(e => !e.Scheduled)} added after the fact), {groups.EventsInWindows} inside a scored window."),
        };
        lines.AddRange(groups.Events.Select(e => string.Create(C, $"{e.Date:yyyy-MM-dd} {e.Kind ?? "(no kind)"}, {(e.Scheduled ? "scheduled" : "added after the fact")}")));
        return lines;
    }

    private static void AddGroup(List<TextTable> tables, GroupedResults groups, string grouping, string title, string note)
    {
        var rows = groups.Rows.Where(r => r.Grouping == grouping).ToList();
        if (rows.Count == 0)
        {
            return;
        }

        tables.Add(new TextTable(
            title,
            ["Group", "Forecaster", "Dates", "QLIKE", "Implied QLIKE", "DM vs implied", "p"],
            [.. rows.Select(r => (IReadOnlyList<string>)[r.Group, r.Spec, r.Count.ToString(C), F(r.Qlike, "0.0000"), F(r.ImpliedQlike, "0.0000"), F(r.Dm?.Statistic, "0.00"), Pv(r.Dm?.PValue)])],
            note + " The test of a group uses the full-length series d·1{date in group}, so overlapping windows across its edges are counted; negative DM favours the forecaster."));
    }

    private static string TieText(LookbackAnswer a)
    {
        var level = string.Create(C, $"{a.Level * 100:0}% model confidence set");
        if (a.TieSet.IsEmpty)
        {
            return $"the tie set was not computed ({a.Note})";
        }

        if (a.TieSet.Length == 1)
        {
            return $"only {a.TieSet[0]} is in the {level}, so it is clearly best on this history";
        }

        var days = a.TieSet.Select(ReportSeries.Lookback).ToList();
        var range = days.TrueForAll(d => d is not null) && a.TieSet.Length == a.Candidates.Length
            ? "every lookback tried is"
            : days.TrueForAll(d => d is not null)
                ? string.Create(C, $"{days.Min()} to {days.Max()} days ({string.Join(", ", a.TieSet)}) are all")
                : $"{string.Join(", ", a.TieSet)} are all";
        return $"{range} statistically tied with the best ({level}), so the data do not single one out";
    }

    private static (DateOnly First, DateOnly Last) Span(BacktestResult result, CommonDateRanking common)
    {
        var first = common.OnCommonDates.IndexOf(true);
        var last = common.OnCommonDates.LastIndexOf(true);
        return (result.Dates[first], result.Dates[last]);
    }

    private static string F(double? value, string format) => value is double v ? v.ToString(format, C) : "—";

    private static string Pv(double? p) => p is double ? PValueText.Value(p) : "—";
}
