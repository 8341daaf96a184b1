using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Scoring;
using VolCast.Core.Trading;

namespace VolCast.IO.Results;

/// <summary>Writes summary.txt, a plain-text digest of the results (until the HTML report exists), leading with baseline vs candidate.</summary>
internal static class SummaryText
{
    /// <summary>The caution that closes summary.txt and opens the results workbook.</summary>
    public const string Caution = "Results describe the past on the data given; they are not advice. Models can fail out of sample; trading options carries risk of loss.";

    public static void Write(TextWriter w, BacktestResult r, BacktestRunInfo run, BacktestCalibration calibration, RulePnlReport? rulePnl = null, string? rulePnlAbsence = null)
    {
        var c = CultureInfo.InvariantCulture;
        var q = r.DataQuality;
        w.Write("VolCast backtest summary\n");
        if (rulePnl is not null)
        {
            w.Write("Would the rule have paid? " + RulePnlAnswer.Sentence(rulePnl) + "\n");
            w.Write("Caution: " + RulePnlAnswer.Cautions + "\n");
        }
        else if (rulePnlAbsence is not null)
        {
            w.Write("Would the rule have paid? Not computed: " + rulePnlAbsence + "\n");
        }

        w.Write(string.Create(c, $"Forecast dates {r.Dates[0]:yyyy-MM-dd} to {r.Dates[^1]:yyyy-MM-dd} ({q.ForecastDates}), horizon {Horizon(r)}; Newey-West lag {r.HacLag} (the nominal).\n"));
        w.Write(string.Create(c, $"Scored dates with a realized target: {q.DatesWithTarget}; last {q.DatesWithoutTarget} dates have forecasts but no target yet; {q.ZeroRealizedDates} with zero realized vol not scored.\n"));
        if (r.HasImplied)
        {
            w.Write(string.Create(c, $"Implied: {q.ForecastDatesWithImplied} forecast dates quoted, {q.ForecastDatesWithoutImplied} without a quote, {q.ImpliedDatesWithoutPrices} quotes on dates without prices (unit {run.ImpliedUnit}).\n"));
        }
        else
        {
            w.Write("No implied series: forecasters are ranked among themselves.\n");
        }

        foreach (var warning in run.InputWarnings)
        {
            w.Write("Input warning: " + warning + "\n");
        }

        w.Write("\nBaseline vs candidate (d = loss(candidate) - loss(baseline); negative favours the candidate)\n");
        var h = r.CandidateVersusBaseline;
        w.Write(string.Create(c, $"  candidate {r.Candidate} vs baseline {r.Baseline} on {h.Count} common dates\n"));
        w.Write("  QLIKE: " + Dm(h.FirstLosses?.Qlike, h.SecondLosses?.Qlike, h.Qlike) + "\n");
        w.Write("  MSE on variance: " + Dm(h.FirstLosses?.MseVariance, h.SecondLosses?.MseVariance, h.MseVariance) + "\n");

        w.Write("\nForecasters, each on its own scored dates (bias and RMSE in vol points; DM against implied on QLIKE, negative = forecaster better; MZ p tests unbiasedness)\n");
        w.Write(string.Create(c, $"  {"forecaster",-28} {"dates",6} {"bias",7} {"RMSE",7} {"QLIKE",8} {"MZ b",7} {"MZ p",7} {"DM",7} {"DM p",7} {"MCS p",7}\n"));
        foreach (var m in r.Metrics)
        {
            w.Write(string.Create(c,
                $"  {(m.InMcs == true ? m.Spec + " ✓" : m.Spec),-28} {m.Losses?.Count ?? 0,6} {F(m.Losses?.Bias * 100, "F2"),7} {F(m.Losses?.RmseVolatility * 100, "F2"),7} {F(m.Losses?.Qlike, "F4"),8} {F(m.MincerZarnowitz?.Slope, "F3"),7} {PValueText.Value(m.MincerZarnowitz?.WaldPValue),7} {F(m.VersusImplied?.Qlike?.Statistic, "F2"),7} {PValueText.Value(m.VersusImplied?.Qlike?.PValue),7} {PValueText.Value(m.McsPValue),7}\n"));
        }

        var mcs = r.ModelConfidenceSet;
        w.Write(mcs.Result is null
            ? "  Model confidence set not computed: " + mcs.Note + "\n"
            : string.Create(c, $"  ✓ = in the {(1 - mcs.Result.Options.Alpha) * 100:F0}% model confidence set (QLIKE, {mcs.CommonDates} common dates, {mcs.Result.Options.BootstrapReplications} bootstrap replications, block length {mcs.Result.Options.BlockLength}).\n"));

        Odds(w, calibration);

        if (r.Adaptive.Length > 0)
        {
            w.Write("\nLookback sweep (in sample: the best lookback is chosen with hindsight) and the out-of-sample adaptive choice\n");
            foreach (var a in r.Adaptive)
            {
                var best = r.Sweep.FirstOrDefault(s => s.Family == a.Family && s.IsBestInSample);
                w.Write(string.Create(c,
                    $"  {a.Family,-16} best in sample {best?.Spec ?? "-",-20} adaptive choice changed {a.ChangeCount} times over {a.DatesWithChoice} dates\n"));
            }
        }

        if (r.RuleTest is RuleTestResult rule)
        {
            w.Write(string.Create(c, $"\nRule test: sell volatility when implied exceeds the forecast by more than {rule.ThresholdVolatility * 100:0.0} vol points, buy when the forecast exceeds implied by as much.\n"));
            w.Write("  " + RuleTestResult.Caution + "\n");
            w.Write("  Implied minus realized in vol points; the test asks whether the signalled dates differ from all dates (Newey-West, lag " + r.HacLag.ToString(c) + ").\n");
            foreach (var row in rule.Rows)
            {
                var against = row.Signal == RuleSignal.AllDates ? null : SignalledAgainstAll.Compute(rule, row.Source != rule.ForecastSpec, row.Signal, r.HacLag);
                var test = against is null ? string.Empty
                    : string.Create(c, $"; signalled minus all dates {F(against.Difference * 100, "F2")}, {(against.PValue is double p ? PValueText.Clause(p) : "not testable")}");
                w.Write(string.Create(c,
                    $"  {row.Source,-22} {Signal(row.Signal),-13} dates {row.Count,5}, right side {F(row.HitRate * 100, "F1")}%, implied minus realized {F(row.MeanVolatilityGap * 100, "F2")} (standard error {F(row.MeanVolatilityGapStandardError * 100, "F2")}){test}\n"));
            }
        }

        if (r.Warnings.Length > 0)
        {
            w.Write("\nWarnings\n");
            foreach (var warning in r.Warnings)
            {
                w.Write("  " + warning + "\n");
            }
        }

        w.Write("\n" + Caution + "\n");
    }

    private static void Odds(TextWriter w, BacktestCalibration calibration)
    {
        var c = CultureInfo.InvariantCulture;
        w.Write("\nDo the odds hold? Forecast move bands (±1σ, ±2σ): share of dates with |z| ≤ 1 (68.3% if calibrated) and |z| ≤ 2 (95.4%), Kupiec p on non-overlapping dates; details in coverage.csv and calibration.csv\n");
        w.Write(string.Create(c, $"  {"forecaster",-26} {"dates",6} {"missing",7} {"|z|≤1",7} {"p",7} {"|z|≤2",7} {"p",7} {"max |z|",7}\n"));
        foreach (var odds in calibration.Forecasters)
        {
            var cov = odds.Coverage;
            var one = cov.Levels[0];
            var two = cov.Levels[1];
            w.Write(string.Create(c,
                $"  {cov.Spec,-26} {cov.Count,6} {cov.MissingCount,7} {F(one.ShareWithin, "0.0%"),7} {PValueText.Value(one.Kupiec?.PValue),7} {F(two.ShareWithin, "0.0%"),7} {PValueText.Value(two.Kupiec?.PValue),7} {F(cov.MaxAbsZ, "F2"),7}\n"));
            w.Write("    " + odds.Verdict + "\n");
        }

        w.Write("  Calibrated odds in the past do not make calibrated odds in the future.\n");
    }

    private static string Signal(RuleSignal signal) => signal switch
    {
        RuleSignal.SellVolatility => "sell signals",
        RuleSignal.BuyVolatility => "buy signals",
        _ => "all dates",
    };

    /// <summary>The horizon as the report states it: "30-calendar-day tenor = 20–22 trading days, 21 nominal" or "21 trading days".</summary>
    private static string Horizon(BacktestResult r)
    {
        var h = r.Settings.Horizon;
        if (h.TradingDays is int days)
        {
            return string.Create(CultureInfo.InvariantCulture, $"{days} trading days");
        }

        int? shortest = null, longest = null;
        foreach (var window in r.WindowDays)
        {
            if (window is int d)
            {
                shortest = Math.Min(shortest ?? d, d);
                longest = Math.Max(longest ?? d, d);
            }
        }

        var span = shortest is int s && longest is int l && s != l ? string.Create(CultureInfo.InvariantCulture, $"{s}–{l}") : (longest ?? h.NominalDays).ToString(CultureInfo.InvariantCulture);
        return string.Create(CultureInfo.InvariantCulture, $"{h.TenorCalendarDays}-calendar-day tenor = {span} trading days, {h.NominalDays} nominal");
    }

    private static string Dm(double? first, double? second, DieboldMarianoResult? dm) =>
        string.Create(CultureInfo.InvariantCulture,
            $"candidate {F(first, "G6")} vs baseline {F(second, "G6")}, DM {F(dm?.Statistic, "F3")}, {(dm?.PValue is double p ? PValueText.Clause(p) : "p -")}");

    private static string F(double? value, string format) =>
        value is double v && double.IsFinite(v) ? v.ToString(format, CultureInfo.InvariantCulture) : "-";
}
