using System.Text.Json;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Scoring;
using VolCast.Core.Trading;
using VolCast.IO.Tables;

namespace VolCast.IO.Results;

/// <summary>
/// Writes metrics.json: every score and test of a backtest; invariant culture, round-trip doubles, null (never NaN)
/// where undefined. Each element of <c>forecasters</c> is a row of the forecaster table (<see cref="ForecasterTable"/>),
/// the same columns as metrics.csv.
/// </summary>
internal static class MetricsJson
{
    /// <summary>The long-run variance every Diebold-Mariano test of a backtest uses, in words.</summary>
    public const string DmVarianceEstimator = "rectangular: autocovariances to lag h-1 with equal weights (Diebold-Mariano 1995, as R forecast::dm.test varestimator = \"acf\"), with the Harvey-Leybourne-Newbold correction; Bartlett weights at the same lag where that estimate is not positive, marked \"bartlett (rectangular not positive)\" in the test's variance_estimator";

    public static void Write(TextWriter writer, BacktestResult result, BacktestCalibration calibration, RulePnlReport? rulePnl = null, string? rulePnlAbsence = null) =>
        writer.Write(JsonText.Build(json => Metrics(json, result, calibration, rulePnl, rulePnlAbsence)));

    private static void Metrics(Utf8JsonWriter json, BacktestResult r, BacktestCalibration calibration, RulePnlReport? rulePnl, string? rulePnlAbsence)
    {
        json.WriteStartObject();
        json.WriteString("sign_convention", "Diebold-Mariano d_t = L(first) - L(second); a negative statistic means the first named has the lower loss. dm_* in a forecaster row: first = the forecaster, second = implied.");
        json.WriteStartObject("baseline_vs_candidate");
        json.WriteString("baseline", r.Baseline);
        json.WriteString("candidate", r.Candidate);
        json.WritePropertyName("comparison");
        Pair(json, r.CandidateVersusBaseline);
        json.WriteEndObject();
        json.WriteNumber("hac_lag", r.HacLag);
        json.WriteString("dm_variance_estimator", DmVarianceEstimator);

        json.WriteStartArray("forecasters");
        foreach (var row in ForecasterTable.Rows(r))
        {
            ForecasterTable.Definition.WriteJson(json, row);
        }

        json.WriteEndArray();

        json.WriteStartArray("pairs");
        foreach (var p in r.Pairs)
        {
            Pair(json, p);
        }

        json.WriteEndArray();

        Mcs(json, r.ModelConfidenceSet);

        json.WriteStartObject("sweep");
        json.WriteBoolean("in_sample", true);
        json.WriteString("note", "In-sample: each row is scored over the whole sample, so picking the best row is look-ahead; the adaptive forecasters are the honest choice.");
        json.WriteStartArray("rows");
        foreach (var s in r.Sweep)
        {
            json.WriteStartObject();
            json.WriteString("family", s.Family);
            json.WriteString("forecaster", s.Spec);
            json.WriteNumber("n", s.Count);
            Numbers.Write(json, "qlike", s.Qlike);
            Numbers.Write(json, "mse_var", s.MseVariance);
            Numbers.Write(json, "rmse_vol", s.RmseVolatility);
            json.WriteBoolean("best_in_sample", s.IsBestInSample);
            json.WriteEndObject();
        }

        json.WriteEndArray();
        json.WriteEndObject();

        json.WriteStartArray("adaptive");
        foreach (var a in r.Adaptive)
        {
            json.WriteStartObject();
            json.WriteString("forecaster", a.Spec);
            json.WriteString("family", a.Family);
            json.WriteNumber("selection_window_days", r.Settings.SelectionWindowDays);
            json.WriteStartArray("candidates");
            foreach (var c in a.Candidates)
            {
                json.WriteStringValue(c);
            }

            json.WriteEndArray();
            json.WriteNumber("dates_with_choice", a.DatesWithChoice);
            json.WriteNumber("choice_changes", a.ChangeCount);
            json.WriteStartObject("days_chosen");
            foreach (var c in a.Candidates)
            {
                json.WriteNumber(c, a.Choices.Count(x => x == c));
            }

            json.WriteEndObject();
            json.WriteEndObject();
        }

        json.WriteEndArray();

        if (r.RuleTest is RuleTestResult rule)
        {
            json.WriteStartObject("rule_test");
            json.WriteString("caution", RuleTestResult.Caution);
            json.WriteNumber("threshold_vol", rule.ThresholdVolatility);
            json.WriteString("forecaster", rule.ForecastSpec);
            json.WriteString("historical", rule.HistoricalSpec);
            json.WriteStartArray("rows");
            foreach (var row in rule.Rows)
            {
                json.WriteStartObject();
                json.WriteString("source", row.Source);
                json.WriteString("signal", row.Signal switch { RuleSignal.SellVolatility => "sell", RuleSignal.BuyVolatility => "buy", _ => "all" });
                json.WriteNumber("n", row.Count);
                Numbers.Write(json, "hit_rate", row.HitRate);
                Numbers.Write(json, "hit_rate_se", row.HitRateStandardError);
                Numbers.Write(json, "mean_iv_minus_rv_vol", row.MeanVolatilityGap);
                Numbers.Write(json, "mean_iv_minus_rv_vol_se", row.MeanVolatilityGapStandardError);
                Numbers.Write(json, "mean_iv2_minus_rv2_var", row.MeanVarianceGap);
                Numbers.Write(json, "mean_iv2_minus_rv2_var_se", row.MeanVarianceGapStandardError);
                json.WriteEndObject();
            }

            json.WriteEndArray();
            json.WriteEndObject();
        }
        else
        {
            json.WriteNull("rule_test");
        }

        RulePnlJson.Write(json, rulePnl, rulePnlAbsence);
        CalibrationJson.Write(json, calibration);

        var q = r.DataQuality;
        json.WriteStartObject("data_quality");
        json.WriteNumber("price_rows", q.PriceRows);
        json.WriteNumber("forecast_dates", q.ForecastDates);
        json.WriteNumber("dates_with_target", q.DatesWithTarget);
        json.WriteNumber("dates_without_target", q.DatesWithoutTarget);
        json.WriteNumber("zero_realized_dates", q.ZeroRealizedDates);
        json.WriteNumber("implied_rows", q.ImpliedRows);
        json.WriteNumber("forecast_dates_with_implied", q.ForecastDatesWithImplied);
        json.WriteNumber("forecast_dates_without_implied", q.ForecastDatesWithoutImplied);
        json.WriteNumber("implied_dates_without_prices", q.ImpliedDatesWithoutPrices);
        json.WriteNumber("min_window_days", q.MinimumHorizonDays);
        json.WriteNumber("max_window_days", q.MaximumHorizonDays);
        json.WriteEndObject();

        json.WriteStartArray("warnings");
        foreach (var w in r.Warnings)
        {
            json.WriteStringValue(w);
        }

        json.WriteEndArray();
        json.WriteEndObject();
    }

    private static void Pair(Utf8JsonWriter json, PairComparison p)
    {
        json.WriteStartObject();
        json.WriteString("first", p.First);
        json.WriteString("second", p.Second);
        json.WriteNumber("n", p.Count);
        Numbers.Write(json, "first_qlike", p.FirstLosses?.Qlike);
        Numbers.Write(json, "second_qlike", p.SecondLosses?.Qlike);
        Numbers.Write(json, "first_mse_var", p.FirstLosses?.MseVariance);
        Numbers.Write(json, "second_mse_var", p.SecondLosses?.MseVariance);
        Dm(json, "dm_qlike", p.Qlike);
        Dm(json, "dm_mse", p.MseVariance);
        json.WriteEndObject();
    }

    private static void Dm(Utf8JsonWriter json, string name, DieboldMarianoResult? dm)
    {
        if (dm is null)
        {
            json.WriteNull(name);
            return;
        }

        json.WriteStartObject(name);
        json.WriteNumber("n", dm.Count);
        json.WriteNumber("lag", dm.Lag);
        json.WriteString("variance_estimator", dm.VarianceEstimator);
        Numbers.Write(json, "mean_differential", dm.MeanDifferential);
        Numbers.Write(json, "statistic", dm.Statistic);
        Numbers.Write(json, "p_value", dm.PValue);
        json.WriteEndObject();
    }

    private static void Mcs(Utf8JsonWriter json, McsSummary mcs)
    {
        json.WriteStartObject("mcs");
        json.WriteString("loss", "qlike");
        json.WriteNumber("common_dates", mcs.CommonDates);
        if (mcs.Result is ModelConfidenceSetResult result)
        {
            json.WriteNumber("alpha", result.Options.Alpha);
            json.WriteNumber("replications", result.Options.BootstrapReplications);
            json.WriteNumber("block_length", result.Options.BlockLength);
            json.WriteNumber("seed", result.Options.Seed);
            json.WriteString("bootstrap", "moving-block");
            json.WriteString("statistic", result.Options.Statistic.ToString());
        }

        json.WriteStartArray("members");
        for (var i = 0; i < mcs.Members.Length; i++)
        {
            json.WriteStartObject();
            json.WriteString("forecaster", mcs.Members[i]);
            Numbers.Write(json, "mcs_p", mcs.Result?.PValues[i]);
            Numbers.Write(json, "in_mcs", mcs.Result?.InSet[i]);
            json.WriteEndObject();
        }

        json.WriteEndArray();
        json.WriteStartArray("excluded");
        foreach (var e in mcs.Excluded)
        {
            json.WriteStringValue(e);
        }

        json.WriteEndArray();
        if (mcs.Note is null)
        {
            json.WriteNull("note");
        }
        else
        {
            json.WriteString("note", mcs.Note);
        }

        json.WriteEndObject();
    }
}
