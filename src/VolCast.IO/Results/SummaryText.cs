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

        w.Write(string.Create(c, $"Forecast dates {r.Dates[0]:yyyy-MM-dd} to {r.Dates[^1]:yyyy-MM-dd} ({q.ForecastDates}), horizon {r.Settings.Horizon}{(r.Settings.Horizon.TenorCalendarDays is null ? " trading days" : string.Empty)}, HAC lag {r.HacLag}.\n"));
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

        w.Write("\nForecasters (vol in decimal; DM vs implied, negative = forecaster better)\n");
        w.Write(string.Create(c, $"  {"forecaster",-26} {"n",6} {"bias",9} {"rmse_vol",9} {"qlike",9} {"mz_b",7} {"mz_p",7} {"dm_qlike",9} {"p",7} {"mcs_p",7}\n"));
        foreach (var m in r.Metrics)
        {
            w.Write(string.Create(c,
                $"  {m.Spec,-26} {m.Losses?.Count ?? 0,6} {F(m.Losses?.Bias, "F4"),9} {F(m.Losses?.RmseVolatility, "F4"),9} {F(m.Losses?.Qlike, "F4"),9} {F(m.MincerZarnowitz?.Slope, "F3"),7} {F(m.MincerZarnowitz?.WaldPValue, "F3"),7} {F(m.VersusImplied?.Qlike?.Statistic, "F2"),9} {F(m.VersusImplied?.Qlike?.PValue, "F3"),7} {F(m.McsPValue, "F3"),7}{(m.InMcs == true ? " *" : string.Empty)}\n"));
        }

        var mcs = r.ModelConfidenceSet;
        w.Write(mcs.Result is null
            ? "  Model confidence set not computed: " + mcs.Note + "\n"
            : string.Create(c, $"  * in the {(1 - mcs.Result.Options.Alpha) * 100:F0}% model confidence set (QLIKE, {mcs.CommonDates} common dates, B = {mcs.Result.Options.BootstrapReplications}, block {mcs.Result.Options.BlockLength}).\n"));

        Odds(w, calibration);

        if (r.Adaptive.Length > 0)
        {
            w.Write("\nLookback sweep (IN-SAMPLE: the best row is chosen with hindsight) and the out-of-sample adaptive choice\n");
            foreach (var a in r.Adaptive)
            {
                var best = r.Sweep.FirstOrDefault(s => s.Family == a.Family && s.IsBestInSample);
                w.Write(string.Create(c,
                    $"  {a.Family,-16} in-sample best {best?.Spec ?? "-",-20} adaptive choice changed {a.ChangeCount} times over {a.DatesWithChoice} dates\n"));
            }
        }

        if (r.RuleTest is RuleTestResult rule)
        {
            w.Write(string.Create(c, $"\nRule test: IV - forecast > {rule.ThresholdVolatility:F4} => sell vol; forecast - IV > {rule.ThresholdVolatility:F4} => buy vol.\n"));
            w.Write("  " + RuleTestResult.Caution + "\n");
            foreach (var row in rule.Rows)
            {
                w.Write(string.Create(c,
                    $"  {row.Source,-22} {row.Signal,-15} n={row.Count,5} hit={F(row.HitRate, "F3")} IV-RV={F(row.MeanVolatilityGap, "F4")} (se {F(row.MeanVolatilityGapStandardError, "F4")})\n"));
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
        w.Write("\nDo the odds hold? Expected-move ranges: share of dates with |z| <= 1 (68.3% if calibrated) and |z| <= 2 (95.4%), Kupiec p on non-overlapping dates; details in coverage.csv and calibration.csv\n");
        w.Write(string.Create(c, $"  {"forecaster",-26} {"n",6} {"missing",7} {"|z|<=1",7} {"p",7} {"|z|<=2",7} {"p",7} {"max|z|",7}\n"));
        foreach (var odds in calibration.Forecasters)
        {
            var cov = odds.Coverage;
            var one = cov.Levels[0];
            var two = cov.Levels[1];
            w.Write(string.Create(c,
                $"  {cov.Spec,-26} {cov.Count,6} {cov.MissingCount,7} {F(one.ShareWithin, "0.0%"),7} {F(one.Kupiec?.PValue, "F3"),7} {F(two.ShareWithin, "0.0%"),7} {F(two.Kupiec?.PValue, "F3"),7} {F(cov.MaxAbsZ, "F2"),7}\n"));
            w.Write("    " + odds.Verdict + "\n");
        }

        w.Write("  Calibrated odds in the past do not make calibrated odds in the future.\n");
    }

    private static string Dm(double? first, double? second, DieboldMarianoResult? dm) =>
        string.Create(CultureInfo.InvariantCulture,
            $"candidate {F(first, "G6")} vs baseline {F(second, "G6")}, DM {F(dm?.Statistic, "F3")}, p = {F(dm?.PValue, "F4")}");

    private static string F(double? value, string format) =>
        value is double v && double.IsFinite(v) ? v.ToString(format, CultureInfo.InvariantCulture) : "-";
}
