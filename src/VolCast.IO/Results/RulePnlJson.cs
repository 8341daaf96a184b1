using System.Collections.Immutable;
using System.Text.Json;
using VolCast.Core.Trading;
using VolCast.Core.Trading.Snooping;
using VolCast.IO.Tables;

namespace VolCast.IO.Results;

/// <summary>Writes the <c>rule_pnl</c> section of metrics.json: the rule's trading backtest, its tests and its conventions.</summary>
/// <remarks>
/// Present when the trades were run; otherwise absent and <c>rule_pnl_absent</c> says why. P&amp;L in vol points of
/// entry vega; every number that cannot be computed is null, never NaN.
/// </remarks>
internal static class RulePnlJson
{
    public static void Write(Utf8JsonWriter json, RulePnlReport? report, string? absence)
    {
        if (report is null)
        {
            json.WriteString("rule_pnl_absent", absence ?? "The rule's trades were not run.");
            return;
        }

        json.WriteStartObject("rule_pnl");
        json.WriteString("answer", RulePnlAnswer.Sentence(report));
        json.WriteString("cautions", RulePnlAnswer.Cautions);
        Numbers.Write(json, "current_rule_note", report.CurrentRuleNote);
        Conventions(json, report.AtClose);
        json.WritePropertyName("at_close");
        Result(json, report.AtClose);
        json.WritePropertyName("next_day");
        Result(json, report.NextDay);
        json.WriteStartObject("snooping");
        json.WriteString("benchmark", "always-sell");
        json.WriteStartArray("rules");
        foreach (var row in report.AtClose.Sweep)
        {
            json.WriteStringValue(row.Label);
        }

        json.WriteEndArray();
        Snooping(json, "means", report.Means, [.. Enumerable.Range(0, report.Means.Rules)]);
        Snooping(json, "sharpe", report.Sharpe, report.SharpeSweepRows.IsDefaultOrEmpty ? [.. Enumerable.Range(0, report.Sharpe.Rules)] : report.SharpeSweepRows);
        json.WriteEndObject();
        json.WriteEndObject();
    }

    private static void Conventions(Utf8JsonWriter json, RuleBacktestResult r)
    {
        var s = r.Settings;
        json.WriteStartObject("conventions");
        json.WriteString("instrument", "at-the-money straddle (strike = entry close), Black-Scholes-Merton at the entry implied volatility, time = calendar days / 365");
        json.WriteString("sizing", "each trade sized to one vol point of entry vega; ladders weight each trade 1/h");
        json.WriteString("expiry", "the backtest's horizon: h trading days after entry, or the last trading date on or before entry + the tenor's calendar days; settles at |S_T - K|");
        json.WriteString("hedge", "delta-hedged at every close up to the one before expiry; cash flows carried to expiry at the rate");
        json.WriteString("hedge_volatility", s.HedgeVolatility == HedgeVolatility.Implied ? "implied" : "forecast");
        json.WriteString("entry_timing", "close of the firing date (at_close); one trading day later (next_day)");
        json.WriteString("entries", s.Entries == TradeEntries.EverySignal ? "every-signal" : "one-at-a-time");
        json.WriteString("daily_path", "every-signal ladder marked daily at the quoted constant-tenor implied (standing in for the option's own implied); beside it, marked at the entry implied");
        json.WriteString("rule_sides", RulePnlTables.SidesName(s.Sides));
        Numbers.Write(json, "threshold", s.Threshold);
        json.WriteStartArray("thresholds");
        foreach (var t in s.SweepThresholds)
        {
            json.WriteNumberValue(t);
        }

        json.WriteEndArray();
        Numbers.Write(json, "rate", s.Rate);
        Numbers.Write(json, "dividend_yield", s.DividendYield);
        Numbers.Write(json, "option_half_spread_vol_points", s.Costs.OptionHalfSpreadVolPoints);
        Numbers.Write(json, "hedge_cost_bps", s.Costs.HedgeCostBps);
        Numbers.Write(json, "annualization_days", s.AnnualizationDays);
        Numbers.Write(json, "stress_spot_move", s.StressSpotMove);
        Numbers.Write(json, "stress_vol_shift", s.StressVolatilityShift);
        Numbers.Write(json, "horizon_days", r.HorizonDays);
        json.WriteString("tests", "daily-path differences: Newey-West t, lag = horizon; mean trade P&L: Newey-West t, lag 2 trades; two-sided normal p-values");
        json.WriteEndObject();
    }

    private static void Result(Utf8JsonWriter json, RuleBacktestResult r)
    {
        json.WriteStartObject();
        Numbers.Write(json, "firing_dates", r.FiringDates);
        Numbers.Write(json, "path_days", r.Dates.Length);
        json.WriteStartArray("rules");
        foreach (var rule in r.Rules)
        {
            Rule(json, rule);
        }

        json.WriteEndArray();
        json.WritePropertyName("proposed_vs_current");
        Comparison(json, r.ProposedVersusCurrent);
        json.WriteStartArray("versus_always_sell");
        foreach (var v in r.VersusAlwaysSell)
        {
            Comparison(json, v);
        }

        json.WriteEndArray();
        json.WriteStartArray("sweep");
        foreach (var row in r.Sweep)
        {
            json.WriteStartObject();
            json.WriteString("label", row.Label);
            json.WriteString("rule", RulePnlTables.RuleName(row.Rule));
            json.WriteString("forecaster", row.ForecastSpec);
            json.WriteString("sides", RulePnlTables.SidesName(row.Sides));
            Numbers.Write(json, "threshold", row.Threshold);
            Numbers.Write(json, "trades", row.Trades);
            Numbers.Write(json, "pnl_per_year", row.PnlPerYear);
            Numbers.Write(json, "pnl_per_year_zero_cost", row.PnlPerYearZeroCost);
            Numbers.Write(json, "sharpe", row.Sharpe);
            Numbers.Write(json, "sharpe_zero_cost", row.SharpeZeroCost);
            json.WriteEndObject();
        }

        json.WriteEndArray();
        json.WriteStartObject("break_even");
        Numbers.Write(json, "edge_per_year", r.BreakEven.EdgePerYear);
        Numbers.Write(json, "edge_change_per_vol_point", r.BreakEven.EdgeChangePerVolPoint);
        Numbers.Write(json, "edge_half_spread_vol_points", r.BreakEven.EdgeHalfSpreadVolPoints);
        Numbers.Write(json, "proposed_half_spread_vol_points", r.BreakEven.ProposedHalfSpreadVolPoints);
        json.WriteEndObject();
        json.WriteEndObject();
    }

    private static void Rule(Utf8JsonWriter json, RulePnl rule)
    {
        json.WriteStartObject();
        json.WriteString("rule", RulePnlTables.RuleName(rule.Rule));
        Numbers.Write(json, "forecaster", rule.ForecastSpec);
        Numbers.Write(json, "threshold", rule.Threshold);
        json.WriteString("sides", RulePnlTables.SidesName(rule.Sides));
        Numbers.Write(json, "ladder_trades", rule.LadderTrades);
        Numbers.Write(json, "share_of_days_in_market", rule.ShareOfDaysInMarket);
        Trades(json, "trades", rule.TradeStatisticsNet);
        Trades(json, "trades_zero_cost", rule.TradeStatisticsZeroCost);
        Path(json, "path", rule.PathNet);
        Path(json, "path_zero_cost", rule.PathZeroCost);
        Numbers.Write(json, "one_at_a_time_pnl_per_year_low", rule.OneAtATimeRangeNet.PnlPerYear.Low);
        Numbers.Write(json, "one_at_a_time_pnl_per_year_high", rule.OneAtATimeRangeNet.PnlPerYear.High);
        json.WriteStartObject("one_at_a_time_over_start_offsets");
        StartOffsets(json, "net", rule.OneAtATimeRangeNet);
        StartOffsets(json, "zero_cost", rule.OneAtATimeRangeZeroCost);
        json.WriteEndObject();
        Numbers.Write(json, "mean_stress_pnl_vol_points", rule.MeanStressPnlVolPoints);
        json.WriteStartObject("variance_swap_view");
        Numbers.Write(json, "total_variance_gap", rule.VarianceGapTotal);
        Numbers.Write(json, "vol_points", rule.VarianceGapVolPoints);
        json.WriteString("note", "ATM implied stands in for the variance strike and understates it when the smile has skew");
        json.WriteEndObject();
        json.WriteEndObject();
    }

    private static void StartOffsets(Utf8JsonWriter json, string name, StartOffsetRange r)
    {
        json.WriteStartObject(name);
        Numbers.Write(json, "starts", r.Starts);
        Range(json, "trades", r.Trades);
        Range(json, "pnl_per_year", r.PnlPerYear);
        Range(json, "hit_rate", r.HitRate);
        Range(json, "mean_vol_points", r.MeanVolPoints);
        Range(json, "median_vol_points", r.MedianVolPoints);
        Range(json, "mean_pct_spot", r.MeanPercentOfSpot);
        Range(json, "median_pct_spot", r.MedianPercentOfSpot);
        Range(json, "mean_t", r.MeanTStatistic);
        Range(json, "worst_vol_points", r.WorstVolPoints);
        Range(json, "expected_shortfall_5_vol_points", r.ExpectedShortfall5VolPoints);
        Range(json, "skewness", r.Skewness);
        Range(json, "pnl_per_unit_stress_loss", r.PnlPerUnitStressLoss);
        json.WriteEndObject();
    }

    private static void Range(Utf8JsonWriter json, string name, FigureRange? range)
    {
        if (range is null)
        {
            json.WriteNull(name);
            return;
        }

        json.WriteStartObject(name);
        Numbers.Write(json, "low", range.Low);
        Numbers.Write(json, "high", range.High);
        json.WriteEndObject();
    }

    private static void Trades(Utf8JsonWriter json, string name, TradeStatistics t)
    {
        json.WriteStartObject(name);
        Numbers.Write(json, "count", t.Count);
        Numbers.Write(json, "hit_rate", t.HitRate);
        Numbers.Write(json, "mean_vol_points", t.MeanVolPoints);
        Numbers.Write(json, "median_vol_points", t.MedianVolPoints);
        Numbers.Write(json, "mean_pct_spot", t.MeanPercentOfSpot);
        Numbers.Write(json, "median_pct_spot", t.MedianPercentOfSpot);
        Numbers.Write(json, "worst_vol_points", t.WorstVolPoints);
        Numbers.Write(json, "worst_entry_date", t.WorstEntryDate is DateOnly d ? Csv.CsvText.Date(d) : null);
        Numbers.Write(json, "expected_shortfall_5_vol_points", t.ExpectedShortfall5VolPoints);
        Numbers.Write(json, "skewness", t.Skewness);
        Numbers.Write(json, "pnl_per_unit_stress_loss", t.PnlPerUnitStressLoss);
        Test(json, "mean_test", t.MeanTest);
        json.WriteEndObject();
    }

    private static void Path(Utf8JsonWriter json, string name, PathStatistics p)
    {
        json.WriteStartObject(name);
        Numbers.Write(json, "days", p.Days);
        Numbers.Write(json, "total", p.Total);
        Numbers.Write(json, "pnl_per_year", p.PnlPerYear);
        Numbers.Write(json, "sharpe", p.Sharpe);
        Numbers.Write(json, "sortino", p.Sortino);
        Numbers.Write(json, "max_drawdown", p.MaxDrawdown);
        Numbers.Write(json, "drawdown_peak", p.DrawdownPeak is DateOnly a ? Csv.CsvText.Date(a) : null);
        Numbers.Write(json, "drawdown_trough", p.DrawdownTrough is DateOnly b ? Csv.CsvText.Date(b) : null);
        Numbers.Write(json, "worst_month", Csv.CsvText.Date(p.WorstMonth)[..7]);
        Numbers.Write(json, "worst_month_pnl", p.WorstMonthPnl);
        json.WriteStartArray("by_year");
        foreach (var y in p.ByYear)
        {
            json.WriteStartObject();
            Numbers.Write(json, "year", y.Year);
            Numbers.Write(json, "pnl", y.Pnl);
            json.WriteEndObject();
        }

        json.WriteEndArray();
        json.WriteEndObject();
    }

    private static void Comparison(Utf8JsonWriter json, RuleComparison c)
    {
        json.WriteStartObject();
        json.WriteString("first", RulePnlTables.RuleName(c.First));
        json.WriteString("second", RulePnlTables.RuleName(c.Second));
        Numbers.Write(json, "difference_per_year", c.DifferencePerYear);
        Test(json, "test", c.Test);
        json.WriteEndObject();
    }

    private static void Test(Utf8JsonWriter json, string name, NeweyWestMeanTest? t)
    {
        if (t is null)
        {
            json.WriteNull(name);
            return;
        }

        json.WriteStartObject(name);
        Numbers.Write(json, "n", t.Count);
        Numbers.Write(json, "lag", t.Lag);
        Numbers.Write(json, "mean", t.Mean);
        Numbers.Write(json, "se", t.StandardError);
        Numbers.Write(json, "t", t.TStatistic);
        Numbers.Write(json, "p", t.PValue);
        json.WriteEndObject();
    }

    private static void Snooping(Utf8JsonWriter json, string name, DataSnoopingResult s, ImmutableArray<int> sweepRows)
    {
        json.WriteStartObject(name);
        json.WriteString("measure", s.Measure == SnoopingMeasure.MeanDifference ? "mean daily net P&L minus always-sell" : "daily Sharpe ratio minus always-sell's");
        Numbers.Write(json, "days", s.Days);
        Numbers.Write(json, "replications", s.Replications);
        Numbers.Write(json, "mean_block_length", s.MeanBlockLength);
        Numbers.Write(json, "seed", s.Seed);
        json.WriteStartArray("sweep_rows");
        foreach (var k in sweepRows)
        {
            json.WriteNumberValue(k);
        }

        json.WriteEndArray();
        json.WriteStartArray("estimates");
        foreach (var e in s.Estimates)
        {
            Numbers.WriteValue(json, e);
        }

        json.WriteEndArray();
        Numbers.Write(json, "best_sweep_row", sweepRows[s.BestRule]);
        Numbers.Write(json, "reality_check_p", s.RealityCheckPValue);
        Numbers.Write(json, "studentized_reality_check_p", s.StudentizedRealityCheckPValue);
        Numbers.Write(json, "spa_statistic", s.Spa.Statistic);
        Numbers.Write(json, "spa_p_lower", s.Spa.Lower);
        Numbers.Write(json, "spa_p_consistent", s.Spa.Consistent);
        Numbers.Write(json, "spa_p_upper", s.Spa.Upper);
        Numbers.Write(json, "stepm_level", s.StepM.Level);
        json.WriteStartArray("stepm_rejected_sweep_rows");
        foreach (var k in s.StepM.Rejected)
        {
            json.WriteNumberValue(sweepRows[k]);
        }

        json.WriteEndArray();
        json.WriteEndObject();
    }
}
