using System.Globalization;
using VolCast.Core.Now;
using VolCast.Reports.Model;

namespace VolCast.Reports;

/// <summary>Builds the report's "Now" section from today's reading (<see cref="NowReading"/>, the numbers of now.json).</summary>
internal static class ReportNow
{
    /// <summary>The sentence at the head of the section.</summary>
    public const string Caution = "A reading of the data on the last date, not a recommendation. It places today's numbers against this run's own history; whether implied is rich today is only known once the next window has passed.";

    private static readonly CultureInfo C = CultureInfo.InvariantCulture;

    /// <summary>Builds the section.</summary>
    /// <param name="now">The reading.</param>
    /// <returns>The section.</returns>
    public static NowSection Build(NowReading now)
    {
        ArgumentNullException.ThrowIfNull(now);
        var points = new List<string>
        {
            string.Create(C, $"Last date {now.Date:yyyy-MM-dd}; horizon {now.HorizonDays} trading days."),
            now.Implied is double iv
                ? string.Create(C, $"Implied volatility today: {Pct(iv)}.")
                : "No implied quote on the last date: no gap and no rule signal today.",
        };
        if (now.RealizedLastWindow is double rv)
        {
            points.Add(string.Create(C, $"Realized volatility over the last {now.HorizonDays} trading days: {Pct(rv)}, at the {now.ConePercentile:0}th percentile of the {now.ConeWindows} windows of that length ending on or before the last date (a plain rank of those windows). The cone chart is drawn from the same closes, up to the last date and none after; its bands are adjusted for overlapping windows (Hodges-Tompkins), so they can place today slightly differently."));
        }

        var forecasters = new TextTable(
            "Each forecast today",
            ["forecaster", "forecast (%)", "implied − forecast (vol pts)", "percentile among earlier dates", "earlier dates"],
            [.. now.Forecasts.Select(f => (IReadOnlyList<string>)[f.Spec, Pct(f.Forecast), Pts(f.ImpliedMinusForecast), Num(f.Percentile, "0"), f.EarlierDates.ToString(C)])],
            "The percentile places today's implied − forecast among the same ex-ante gap on every earlier forecast date (50 = a usual day); it says nothing yet of the realized volatility that will follow.");
        var tables = new List<TextTable> { forecasters };
        if (now.Rules.Length > 0)
        {
            tables.Add(new TextTable(
                "What each rule says today",
                ["rule", "forecaster", "implied − forecast (vol pts)", "threshold (vol pts)", "signal", "margin (vol pts)", "note"],
                [.. now.Rules.Select(r => (IReadOnlyList<string>)[r.Rule, r.Forecaster ?? "—", Pts(r.ImpliedMinusForecast), Num(r.ThresholdVolPoints, "0.00"), r.Signal, Num(r.MarginVolPoints, "+0.00;-0.00;0.00"), r.Note ?? string.Empty])],
                string.Create(C, $"A rule sells volatility when implied exceeds its forecast by more than its threshold (configured: {now.ThresholdVolPoints:0.00} vol points) and buys for the mirror gap when buying is on; the margin is |implied − forecast| − threshold, positive when the rule fires. The walk-forward threshold rule uses the proposed forecaster with the sweep threshold that had earned the most on the trades closed by the last date, so its choice uses no later data.")));
        }

        return new NowSection(Caution, points, tables);
    }

    private static string Pct(double? value) => value is double v ? (v * 100).ToString("0.00", C) : "—";

    private static string Pct(double value) => (value * 100).ToString("0.00", C) + "%";

    private static string Pts(double? value) => value is double v ? (v * 100).ToString("+0.00;-0.00;0.00", C) : "—";

    private static string Num(double? value, string format) => value is double v ? v.ToString(format, C) : "—";
}
