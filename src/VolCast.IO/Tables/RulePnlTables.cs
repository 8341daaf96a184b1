using System.Collections.Immutable;
using VolCast.Core.Trading;

namespace VolCast.IO.Tables;

/// <summary>
/// The tables of the rule's trading backtest, defined once: trades.csv (<see cref="Trades"/>) and rule-pnl.csv
/// (<see cref="Paths"/>), with the names the files and metrics.json give the rules, sides and timings.
/// </summary>
/// <remarks>
/// Units: volatilities decimal; spot, strike, premium, hedge P&amp;L, payoff, costs and P&amp;L per unit of the underlying
/// in the units of the price, carried to expiry at the rate r; vega per volatility point; <c>_vol_points</c> columns are
/// divided by the entry vega per volatility point (a trade sized to one vol point of vega); <c>_pct_spot</c> columns in
/// percent of the entry spot. Daily paths are in vol points (each ladder trade sized 1/h, h the horizon in trading days).
/// </remarks>
public static class RulePnlTables
{
    /// <summary>Gets the name of the default timing: entry at the close of the firing date.</summary>
    public const string AtClose = "close";

    /// <summary>Gets the name of the later timing: entry one trading day after the firing date.</summary>
    public const string NextDay = "next-day";

    /// <summary>Gets the definition of trades.csv: one row per trade.</summary>
    public static TableDefinition<TradeRow> Trades { get; } = new(
    [
        new("timing", "close (entered at the firing date's close) or next-day", r => TableCell.Text(r.Timing)),
        new("rule", "always-sell, proposed, current, historical or walk-forward-threshold", r => TableCell.Text(RuleName(r.Rule.Rule))),
        new("forecaster", "the forecaster that drives the rule (empty for always-sell)", r => TableCell.Text(r.Rule.ForecastSpec ?? string.Empty)),
        new("side", "sell (short straddle) or buy (long straddle)", r => TableCell.Text(SideName(r.Trade.Side))),
        new("entry_date", "date of the entry close", r => TableCell.Text(Csv.CsvText.Date(r.Trade.EntryDate))),
        new("expiry_date", "date of the expiry close, where the straddle settles", r => TableCell.Text(Csv.CsvText.Date(r.Trade.ExpiryDate))),
        new("trading_days", "trading days held", r => TableCell.Count(r.Trade.TradingDays)),
        new("days", "calendar days held (the option's life, ACT/365)", r => TableCell.Count(r.Trade.CalendarDays)),
        new("spot", "entry close", r => TableCell.Number(r.Trade.Spot)),
        new("strike", "strike, equal to the entry close", r => TableCell.Number(r.Trade.Strike)),
        new("iv", "entry implied volatility, decimal", r => TableCell.Number(r.Trade.ImpliedVolatility)),
        new("hedge_vol", "volatility of the hedge deltas, decimal", r => TableCell.Number(r.Trade.HedgeVolatility)),
        new("forecast", "the rule's forecast on the firing date, decimal (empty for always-sell)", r => TableCell.Number(r.Trade.Forecast)),
        new("premium", "straddle price at entry, per unit of underlying", r => TableCell.Number(r.Trade.Premium)),
        new("vega", "straddle entry vega per volatility point, per unit of underlying", r => TableCell.Number(r.Trade.VegaPerVolPoint)),
        new("entry_delta", "the long straddle's delta at entry", r => TableCell.Number(r.Trade.EntryDelta)),
        new("hedge_pnl", "the long straddle's hedge P&L carried to expiry, per unit", r => TableCell.Number(r.Trade.HedgePnl)),
        new("payoff", "|S_T - K|, per unit", r => TableCell.Number(r.Trade.Payoff)),
        new("option_cost", "half-spread charge carried to expiry, per unit", r => TableCell.Number(r.Trade.OptionCost)),
        new("hedge_cost", "hedge trading charge carried to expiry, per unit", r => TableCell.Number(r.Trade.HedgeCost)),
        new("costs", "option_cost + hedge_cost, per unit", r => TableCell.Number(r.Trade.Costs)),
        new("pnl_zero_cost", "P&L before costs, per unit", r => TableCell.Number(r.Trade.GrossPnl)),
        new("pnl", "P&L after costs, per unit", r => TableCell.Number(r.Trade.Pnl)),
        new("pnl_vol_points_zero_cost", "P&L before costs / entry vega per vol point", r => TableCell.Number(r.Trade.GrossPnlVolPoints)),
        new("pnl_vol_points", "P&L after costs / entry vega per vol point", r => TableCell.Number(r.Trade.PnlVolPoints)),
        new("pnl_pct_spot_zero_cost", "P&L before costs, percent of the entry spot", r => TableCell.Number(r.Trade.GrossPnlPercentOfSpot)),
        new("pnl_pct_spot", "P&L after costs, percent of the entry spot", r => TableCell.Number(r.Trade.PnlPercentOfSpot)),
        new("stress_pnl_vol_points", "hedged position's P&L at entry after the stress shock, vol points", r => TableCell.Number(r.Trade.StressPnlVolPoints)),
        new("variance_gap", "s*(RV^2 - IV^2), total variance over the trade", r => TableCell.Number(r.Trade.VarianceGap)),
        new("variance_gap_vol_points", "s*(RV^2 - IV^2)/(2*IV), vol points", r => TableCell.Number(r.Trade.VarianceGapVolPoints)),
    ]);

    /// <summary>
    /// Gets the definition of rule-pnl.csv: one row per rule and date of the daily paths of the trades entered at the
    /// firing close. The entry-vol path before costs is not written: it is pnl_entry_vol + pnl_zero_cost − pnl, since
    /// both paths carry the same costs on the same days.
    /// </summary>
    public static TableDefinition<RulePathRow> Paths { get; } = new(
    [
        new("rule", "always-sell, proposed, current, historical or walk-forward-threshold", r => TableCell.Text(RuleName(r.Rule.Rule))),
        new("date", "the date", r => TableCell.Text(Csv.CsvText.Date(r.Date))),
        new("pnl", "net P&L of the day, marked at the quoted implied, vol points", r => TableCell.Number(r.Rule.DailyPnl[r.Day])),
        new("pnl_zero_cost", "the same before costs", r => TableCell.Number(r.Rule.DailyPnlZeroCost[r.Day])),
        new("pnl_entry_vol", "net P&L of the day, marked at each trade's entry implied, vol points", r => TableCell.Number(r.Rule.DailyPnlEntryVol[r.Day])),
        new("threshold", "walk-forward threshold in force (decimal; empty for the other rules)", r => TableCell.Number(r.Rule.ChosenThresholds.IsDefaultOrEmpty ? null : r.Rule.ChosenThresholds[r.Day])),
    ]);

    /// <summary>
    /// Gets the definition of rule-pnl-next-day.csv: the net daily path of each rule with entry one trading day after the
    /// firing date, the only path the report draws from that timing (its P&amp;L per year, Sharpe ratio and drawdown).
    /// </summary>
    public static TableDefinition<RulePathRow> PathsNextDay { get; } = new(
    [
        new("rule", "always-sell, proposed, current, historical or walk-forward-threshold", r => TableCell.Text(RuleName(r.Rule.Rule))),
        new("date", "the date", r => TableCell.Text(Csv.CsvText.Date(r.Date))),
        new("pnl", "net P&L of the day, marked at the quoted implied, vol points", r => TableCell.Number(r.Rule.DailyPnl[r.Day])),
    ]);

    /// <summary>The name of a rule in the files.</summary>
    /// <param name="rule">The rule.</param>
    /// <returns>always-sell, proposed, current, historical or walk-forward-threshold.</returns>
    public static string RuleName(TradingRule rule) => rule switch
    {
        TradingRule.AlwaysSell => "always-sell",
        TradingRule.Proposed => "proposed",
        TradingRule.Current => "current",
        TradingRule.Historical => "historical",
        _ => "walk-forward-threshold",
    };

    /// <summary>The name of a side in the files.</summary>
    /// <param name="side">+1 long, −1 short.</param>
    /// <returns>buy or sell.</returns>
    public static string SideName(int side) => side > 0 ? "buy" : "sell";

    /// <summary>The name of the sides a rule trades.</summary>
    /// <param name="sides">The sides.</param>
    /// <returns>sell-only or both.</returns>
    public static string SidesName(RuleSides sides) => sides == RuleSides.Both ? "both" : "sell-only";

    /// <summary>Every trade of a report: the trades at the close, then those entered a day later.</summary>
    /// <param name="report">The report.</param>
    /// <returns>The rows.</returns>
    public static IEnumerable<TradeRow> TradeRows(RulePnlReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        foreach (var (timing, result) in Timings(report))
        {
            foreach (var rule in result.Rules)
            {
                foreach (var trade in rule.Trades)
                {
                    yield return new TradeRow(timing, rule, trade);
                }
            }
        }
    }

    /// <summary>Every daily path of one entry timing, rule by rule.</summary>
    /// <param name="report">The report.</param>
    /// <param name="nextDay">True for the trades entered one trading day later, false for those at the firing close.</param>
    /// <returns>The rows.</returns>
    public static IEnumerable<RulePathRow> PathRows(RulePnlReport report, bool nextDay)
    {
        ArgumentNullException.ThrowIfNull(report);
        var (timing, result) = Timings(report)[nextDay ? 1 : 0];
        foreach (var rule in result.Rules)
        {
            for (var t = 0; t < result.Dates.Length; t++)
            {
                yield return new RulePathRow(timing, rule, result.Dates[t], t);
            }
        }
    }

    private static ImmutableArray<(string Timing, RuleBacktestResult Result)> Timings(RulePnlReport report) =>
        [(AtClose, report.AtClose), (NextDay, report.NextDay)];
}
