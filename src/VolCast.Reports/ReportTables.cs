using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Scoring;
using VolCast.IO.Tables;
using VolCast.Reports.Model;

namespace VolCast.Reports;

/// <summary>Builds the report's metric tables from a backtest: every column with its unit, tests marked with stars.</summary>
internal static class ReportTables
{
    private static readonly MetricColumn Dates = new("Dates", "count");
    private static readonly MetricColumn Qlike = new("QLIKE", "unitless, lower is better");
    private static readonly MetricColumn Mse = new("MSE of variance", "×10⁻³, annualized variance²");
    private static readonly MetricColumn Rmse = new("RMSE", "vol points");
    private static readonly MetricColumn Bias = new("Bias", "vol points, forecast − realized");

    /// <summary>The tables, head-to-head first (it leads the results).</summary>
    public static IReadOnlyList<MetricTable> Build(BacktestResult result)
    {
        var tables = new List<MetricTable> { HeadToHead(result), Losses(result) };
        if (result.Adaptive.Length > 0)
        {
            tables.Add(Lookbacks(result));
        }

        if (result.RuleTest is RuleTestResult rule)
        {
            tables.Add(Rule(rule, result.HacLag, result.Settings.Trading.Sides == Core.Trading.RuleSides.Both));
        }

        return tables;
    }

    /// <summary>Stars for a two-sided p-value: * below 0.10, ** below 0.05, *** below 0.01.</summary>
    public static Significance Stars(double? p) => p switch
    {
        < 0.01 => Significance.OnePercent,
        < 0.05 => Significance.FivePercent,
        < 0.10 => Significance.TenPercent,
        _ => Significance.None,
    };

    private static MetricTable HeadToHead(BacktestResult result)
    {
        var h = result.CandidateVersusBaseline;
        var rows = new List<MetricRow>
        {
            LossRow("candidate " + result.Candidate, h.FirstLosses),
            LossRow("baseline " + result.Baseline, h.SecondLosses),
        };
        if (h.FirstLosses is LossSummary c && h.SecondLosses is LossSummary b)
        {
            rows.Add(new MetricRow("difference (candidate − baseline)",
            [
                new MetricCell(h.Count, "0"),
                new MetricCell(c.Qlike - b.Qlike, "0.0000", Stars(h.Qlike?.PValue)),
                new MetricCell((c.MseVariance - b.MseVariance) * 1e3, "0.000", Stars(h.MseVariance?.PValue)),
                new MetricCell((c.RmseVolatility - b.RmseVolatility) * 100, "0.00"),
                new MetricCell((c.Bias - b.Bias) * 100, "0.00"),
            ]));
        }

        var dates = ReportAnswers.HeadToHeadOnCommonDates(result) ? "common dates, those of the ranking" : "dates both forecast";
        var note = string.Create(CultureInfo.InvariantCulture,
            $"On the {h.Count} {dates}. Stars on the difference: Diebold-Mariano test (QLIKE: {Stat(h.Qlike)}; MSE: {Stat(h.MseVariance)}), HAC lag {result.HacLag}; a negative difference favours the candidate.");
        return new MetricTable($"Head to head: candidate {result.Candidate} against baseline {result.Baseline}", [Dates, Qlike, Mse, Rmse, Bias], rows, note);
    }

    private static MetricTable Losses(BacktestResult result)
    {
        var ordered = result.Metrics
            .Select((m, i) => (m, i))
            .OrderBy(p => p.m.Losses?.Qlike ?? double.PositiveInfinity)
            .ThenBy(p => p.i)
            .Select(p => p.m);
        var rows = new List<MetricRow>();
        foreach (var m in ordered)
        {
            // The values come from the forecaster table's columns (the columns of metrics.csv and metrics.json), scaled for display.
            var row = new ForecasterRow(m, result.Forecasts.FirstOrDefault(f => f.Spec == m.Spec));
            double? V(string column) => ForecasterTable.Definition[column].Value(row).NumberValue;
            var label = (m.InMcs == true ? m.Spec + " ✓" : m.Spec) + (LeavesOutOvernight(m.Spec) ? " †" : string.Empty);
            rows.Add(new MetricRow(label,
            [
                new MetricCell(m.Losses is null ? null : V("n"), "0"),
                new MetricCell(V("qlike"), "0.0000"),
                new MetricCell(V("mse_var") * 1e3, "0.000"),
                new MetricCell(V("rmse_vol") * 100, "0.00"),
                new MetricCell(V("bias") * 100, "0.00"),
                new MetricCell(V("dm_qlike_stat"), "0.00", Stars(V("dm_qlike_p"))),
                new MetricCell(V("mz_b"), "0.000"),
                new MetricCell(V("mz_wald_p"), MetricCell.PValue),
                new MetricCell(V("mz_r2"), "0.000"),
                new MetricCell(V("enc_forecast_c"), "0.000"),
                new MetricCell(V("enc_forecast_c_p"), MetricCell.PValue),
                new MetricCell(V("mcs_p"), MetricCell.PValue),
            ]));
        }

        var alpha = result.ModelConfidenceSet.Result?.Options.Alpha ?? result.Settings.McsAlpha;
        var note = string.Create(CultureInfo.InvariantCulture,
            $"Each forecaster on its own scored dates (the count is in the first column). DM vs implied (own dates): Diebold-Mariano on QLIKE(forecaster) − QLIKE(implied) on the dates the two share, negative = forecaster better; stars = better or worse than implied.{OwnAgainstCommon(result)} MZ slope b of RV² = a + b F²; its Wald p tests unbiasedness (a = 0, b = 1), a low p rejects it. Encompassing c: weight on the forecast in RV² = a + b IV² + c F²; a low p says the forecast adds information beyond implied. ✓ = in the model confidence set (MCS p ≥ {alpha:0.00}). The regressions use Newey-West errors with lag {result.HacLag} (the nominal horizon in trading days); Diebold-Mariano uses the rectangular long-run variance (autocovariances to lag {result.HacLag}, equal weights, Harvey-Leybourne-Newbold correction), Bartlett weights where that is not positive.");
        if (result.Metrics.Any(m => LeavesOutOvernight(m.Spec)))
        {
            note += " " + OvernightNote;
        }

        return new MetricTable("Forecast losses, ranked on QLIKE",
            [Dates, Qlike, Mse, Rmse, Bias, new("DM vs implied (own dates)", "t-statistic"), new("MZ slope b", "1 = unbiased"), new("MZ Wald p", "a = 0, b = 1"), new("MZ R²", "0 to 1"), new("Encompassing c", "weight on forecast"), new("Encompassing p", "c = 0"), new("MCS p", "probability")],
            rows, note);
    }

    /// <summary>Says that the common-dates figure, the one the verdict quotes, is elsewhere; empty without common dates.</summary>
    private static string OwnAgainstCommon(BacktestResult result) => result.Common is { Count: > 0 } common
        ? string.Create(CultureInfo.InvariantCulture, $" The verdict uses the {common.Count} common dates instead: its DM figures against implied are those of the ranking on common dates, and differ a little from these.")
        : string.Empty;

    /// <summary>The explanation beside the range estimators' rows (Parkinson 1980; Garman and Klass 1980; Rogers and Satchell 1991: each measures the day from its open to its close).</summary>
    internal const string OvernightNote =
        "† Parkinson, Garman-Klass and Rogers-Satchell measure only the day's own range (open, high, low, close); the overnight move from the previous close to the open is left out, so on a market with overnight gaps they run low against a close-to-close target. Yang-Zhang adds the overnight part back.";

    /// <summary>Whether a forecaster is built on a range estimator that leaves out the overnight gap.</summary>
    internal static bool LeavesOutOvernight(string spec)
    {
        var family = spec.StartsWith("adaptive:", StringComparison.Ordinal) ? spec["adaptive:".Length..] : spec;
        return family.StartsWith("parkinson", StringComparison.Ordinal)
            || family.StartsWith("garman-klass", StringComparison.Ordinal)
            || family.StartsWith("rogers-satchell", StringComparison.Ordinal);
    }

    private static MetricTable Lookbacks(BacktestResult result)
    {
        var rows = new List<MetricRow>();
        foreach (var adaptive in result.Adaptive)
        {
            var best = result.Sweep.FirstOrDefault(s => s.Family == adaptive.Family && s.IsBestInSample);
            var metrics = result.Metrics.FirstOrDefault(m => m.Spec == adaptive.Spec);
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

            (string? Key, int Value) top = counts.Count == 0 ? (null, 0) : counts.OrderByDescending(p => p.Value).ThenBy(p => adaptive.Candidates.IndexOf(p.Key)).Select(p => ((string?)p.Key, p.Value)).First();
            rows.Add(new MetricRow(adaptive.Spec,
            [
                new MetricCell(Parameter(best?.Spec), "0.##"),
                new MetricCell(best?.Qlike, "0.0000"),
                new MetricCell(Parameter(top.Key), "0.##"),
                new MetricCell(adaptive.DatesWithChoice == 0 ? null : top.Value * 100.0 / adaptive.DatesWithChoice, "0"),
                new MetricCell(Parameter(last), "0.##"),
                new MetricCell(adaptive.DatesWithChoice, "0"),
                new MetricCell(adaptive.ChangeCount, "0"),
                new MetricCell(metrics?.Losses?.Qlike, "0.0000"),
            ]));
        }

        return new MetricTable("Lookback: in-sample best against the out-of-sample adaptive choice",
            [new("Best in sample", "days, or EWMA decay"), new("Its QLIKE", "in-sample, hindsight"), new("Chosen most often", "days, or EWMA decay"), new("Share of dates", "%"), new("Chosen at the end", "days, or EWMA decay"), new("Dates with a choice", "count"), new("Changes", "count"), new("Adaptive QLIKE", "out of sample")],
            rows,
            string.Create(CultureInfo.InvariantCulture,
                $"The in-sample best is picked with hindsight over the whole sample (look-ahead, for reference only); the adaptive forecaster picks, each date, the lookback with the lowest QLIKE over the previous {result.Settings.SelectionWindowDays} trading days whose targets were known."));
    }

    private static MetricTable Rule(RuleTestResult rule, int lag, bool buys)
    {
        var rows = new List<MetricRow>();
        foreach (var row in rule.Rows)
        {
            if (row.Signal == RuleSignal.BuyVolatility && !buys)
            {
                // The traded rules sell only (ruleSides sell-only): buy signals are not part of the rule being judged.
                continue;
            }

            var against = row.Signal == RuleSignal.AllDates ? null : SignalledAgainstAll.Compute(rule, row.Source != rule.ForecastSpec, row.Signal, lag);
            var signal = row.Signal switch
            {
                RuleSignal.SellVolatility => "sell signals",
                RuleSignal.BuyVolatility => "buy signals",
                _ => "all dates",
            };
            rows.Add(new MetricRow($"{row.Source}: {signal}",
            [
                new MetricCell(row.Count, "0"),
                new MetricCell(row.HitRate * 100, "0.0"),
                new MetricCell(row.MeanVolatilityGap * 100, "0.00"),
                new MetricCell(row.MeanVolatilityGapStandardError * 100, "0.00"),
                new MetricCell(against?.Difference * 100, "0.00"),
                new MetricCell(against?.PValue, MetricCell.PValue),
            ]));
        }

        return new MetricTable(
            string.Create(CultureInfo.InvariantCulture, $"Rule test: sell volatility when implied exceeds the forecast by more than {rule.ThresholdVolatility * 100:0.0} points{(buys ? " (buy for the mirror)" : string.Empty)}"),
            [Dates, new("Hit rate", "% of dates the side was right"), new("Mean IV − RV", "vol points"), new("Standard error", "vol points, HAC"), new("Signalled − all dates", "vol points"), new("p", "signalled against all dates")],
            rows,
            string.Create(CultureInfo.InvariantCulture,
                $"{RuleTestResult.Caution} The test is the question the rule asks: was implied − realized different on the signalled dates from all dates? p is the Newey-West t-test (lag {lag}, the nominal horizon in trading days) of b in IV − RV = a + b·signalled over all dates.{(buys ? string.Empty : " The rule sells only (ruleSides: sell-only), so buy signals are not shown here; metrics.json and summary.txt keep them.")}"));
    }

    private static double? Parameter(string? spec)
    {
        if (spec is null)
        {
            return null;
        }

        var colon = spec.LastIndexOf(':');
        return colon > 0 && double.TryParse(spec.AsSpan(colon + 1), NumberStyles.Float, CultureInfo.InvariantCulture, out var value) ? value : null;
    }

    private static MetricRow LossRow(string label, LossSummary? l) => new(label,
    [
        new MetricCell(l?.Count, "0"),
        new MetricCell(l?.Qlike, "0.0000"),
        new MetricCell(l?.MseVariance * 1e3, "0.000"),
        new MetricCell(l?.RmseVolatility * 100, "0.00"),
        new MetricCell(l?.Bias * 100, "0.00"),
    ]);

    private static string Stat(DieboldMarianoResult? dm) => dm is { Statistic: double t, PValue: double p }
        ? string.Create(CultureInfo.InvariantCulture, $"{t:0.00}, {PValueText.Clause(p)}")
        : "not computable";
}
