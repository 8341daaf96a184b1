using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Scoring;
using VolCast.Core.Trading;
using VolCast.Core.Trading.Snooping;
using VolCast.IO.Results;
using VolCast.Reports.Charts;
using VolCast.Reports.Model;

namespace VolCast.Reports;

/// <summary>
/// Builds the "Would the rule have paid?" section from a <see cref="RulePnlReport"/>: the rules compared as
/// delta-hedged straddles (net and zero-cost), the tests that decide, the threshold sweep and its data-snooping tests,
/// the break-even half-spread, next-day entry, P&amp;L by year, the variance-swap view, the charts and the settings.
/// </summary>
/// <remarks>
/// Every figure is read from the Core record (the one rule-pnl.csv, trades.csv and metrics.json are written from);
/// nothing is recomputed here except the running sums and drawdowns the cumulative chart draws from the daily path.
/// Significance is judged at 5%.
/// </remarks>
internal static class ReportPnl
{
    private static readonly CultureInfo C = CultureInfo.InvariantCulture;

    /// <summary>Builds the section, or the line that says why it is absent.</summary>
    public static PnlSection Build(RulePnlReport? report, string? absence, BacktestHorizon horizon, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(horizon);
        if (report is null)
        {
            return PnlSection.Absent("The rule was not backtested as option trades: " + (absence ?? "no reason was recorded") + ".");
        }

        var close = report.AtClose;
        var tables = new List<TextTable>
        {
            Rules(close),
            StartOffsets(close),
            Tests(close),
            Sweep(close, report.Means),
            Snooping(close, report),
            NextDay(close, report.NextDay),
            Years(close),
            VarianceSwap(close),
        };
        cancellationToken.ThrowIfCancellationRequested();
        var charts = new List<ChartImage> { PnlCharts.Cumulative(close.Dates, close.Rules) };
        cancellationToken.ThrowIfCancellationRequested();
        charts.Add(PnlCharts.Marks(close.Dates, close.Rules));
        cancellationToken.ThrowIfCancellationRequested();
        charts.Add(PnlCharts.Trades(close.Rules));
        cancellationToken.ThrowIfCancellationRequested();
        charts.Add(PnlCharts.Years(close.Rules));
        return new PnlSection(null, Points(report), tables, charts, Settings(report, horizon), ReportText.PnlCautions);
    }

    /// <summary>The one answer the verdict leads with: the switch's gain per year, the drawdowns, data snooping, walk-forward and break-even (the words of summary.txt).</summary>
    public static string Headline(RulePnlReport report) => RulePnlAnswer.Sentence(report);

    private static List<string> Points(RulePnlReport report)
    {
        var close = report.AtClose;
        var points = new List<string> { Comparison(close.ProposedVersusCurrent) };
        foreach (var versus in close.VersusAlwaysSell)
        {
            points.Add(Comparison(versus));
        }

        points.Add(SnoopingWords(close, report.Means, "mean daily net P&L", close.Settings.AnnualizationDays, "vol points a year"));
        points.Add(SnoopingWords(close, report.Sharpe, "Sharpe ratio", Math.Sqrt(close.Settings.AnnualizationDays), "in annualized Sharpe ratio"));
        points.Add("Break-even: " + RulePnlAnswer.BreakEvenWords(close.BreakEven, close.Settings.Costs.OptionHalfSpreadVolPoints) + string.Create(C,
            $"; the proposed rule's own net P&L is zero at a half-spread of {(close.BreakEven.ProposedHalfSpreadVolPoints is double own ? own.ToString("0.00", C) + " vol points" : "no positive value")}."));
        var next = report.NextDay;
        points.Add(string.Create(C,
            $"Entering one trading day after the signal instead of at its close: proposed {next[TradingRule.Proposed].PathNet.PnlPerYear:0.00} vol points per year (against {close[TradingRule.Proposed].PathNet.PnlPerYear:0.00}), proposed against current {Signed(next.ProposedVersusCurrent.DifferencePerYear)} per year ({Test(next.ProposedVersusCurrent.Test)})."));
        return points;
    }

    internal static string Comparison(RuleComparison comparison)
    {
        var first = RuleNames.Name(comparison.First);
        var second = RuleNames.Name(comparison.Second);
        var more = comparison.DifferencePerYear >= 0 ? "more" : "less";
        var significant = comparison.Test.PValue is double p && p < 0.05 ? "significant at 5%" : "not significant at 5%";
        return string.Create(C,
            $"The {first} rule earned {Math.Abs(comparison.DifferencePerYear):0.00} vol points per year {more} than {second} after costs ({Test(comparison.Test)}, daily paths, Newey-West lag {comparison.Test.Lag}): {significant}.");
    }

    private static string SnoopingWords(RuleBacktestResult close, DataSnoopingResult test, string measure, double annualize, string unit)
    {
        var winners = test.StepM.Rejected.Length == 0
            ? "StepM names no rule that beats always-sell"
            : "StepM names " + Winners(close, test) + " as beating always-sell";
        return string.Create(C,
            $"Data snooping on the {measure} of {test.Rules} rules searched against always-sell: the best ({Label(close, test, test.BestRule)}) is {Math.Abs(test.Estimates[test.BestRule] * annualize).ToString("0.00", C)} {unit} {(test.Estimates[test.BestRule] >= 0 ? "ahead of" : "behind")} always-sell; Reality Check {PValueText.Clause(test.RealityCheckPValue)}, SPA {PValueText.Clause(test.Spa.Consistent)} ({(test.Spa.Consistent < 0.05 ? "the edge survives the search" : "the edge may be luck of the search")}); {winners} at a {test.StepM.Level:0%} familywise level.");
    }

    private static TextTable Rules(RuleBacktestResult close)
    {
        var headers = new List<string> { "Measure" };
        foreach (var rule in close.Rules)
        {
            headers.Add(RuleNames.Name(rule.Rule) + ", net");
            headers.Add(RuleNames.Name(rule.Rule) + ", zero cost");
        }

        var rows = new List<IReadOnlyList<string>>();
        void Row(string label, Func<RulePnl, bool, string> cell)
        {
            var row = new List<string> { label };
            foreach (var rule in close.Rules)
            {
                row.Add(cell(rule, true));
                row.Add(cell(rule, false));
            }

            rows.Add(row);
        }

        static TradeStatistics T(RulePnl r, bool net) => net ? r.TradeStatisticsNet : r.TradeStatisticsZeroCost;
        static PathStatistics Path(RulePnl r, bool net) => net ? r.PathNet : r.PathZeroCost;
        Row("Trades (one at a time)", (r, n) => T(r, n).Count.ToString(C));
        Row("Trades on every signal (ladder)", (r, _) => r.LadderTrades.ToString(C));
        Row("Share of days in the market", (r, _) => F(r.ShareOfDaysInMarket, "0.0%"));
        Row("Hit rate (trades above zero)", (r, n) => F(T(r, n).HitRate, "0.0%"));
        Row("Mean P&L per trade, vol points", (r, n) => F(T(r, n).MeanVolPoints, "0.00"));
        Row("Median P&L per trade, vol points", (r, n) => F(T(r, n).MedianVolPoints, "0.00"));
        Row("Mean P&L per trade, % of spot", (r, n) => F(T(r, n).MeanPercentOfSpot, "0.000"));
        Row("Median P&L per trade, % of spot", (r, n) => F(T(r, n).MedianPercentOfSpot, "0.000"));
        Row("Mean trade t (Newey-West, lag 2 trades)", (r, n) => F(T(r, n).MeanTest?.TStatistic, "0.00"));
        Row("Mean trade p", (r, n) => T(r, n).MeanTest?.PValue is double p ? P(p) : "—");
        Row("P&L per year, vol points (daily path, every signal)", (r, n) => F(Path(r, n).PnlPerYear, "0.00"));
        Row("Sharpe ratio (annualized, daily path)", (r, n) => F(Path(r, n).Sharpe, "0.00"));
        Row("Sortino ratio (annualized, daily path)", (r, n) => F(Path(r, n).Sortino, "0.00"));
        Row("Maximum drawdown, vol points", (r, n) => F(Path(r, n).MaxDrawdown, "0.00"));
        Row("Drawdown from peak to trough", (r, n) => Path(r, n) is { DrawdownPeak: DateOnly a, DrawdownTrough: DateOnly b } ? string.Create(C, $"{a:yyyy-MM-dd} to {b:yyyy-MM-dd}") : "—");
        Row("Worst trade, vol points", (r, n) => F(T(r, n).WorstVolPoints, "0.00"));
        Row("Worst trade's entry date", (r, n) => T(r, n).WorstEntryDate is DateOnly d ? d.ToString("yyyy-MM-dd", C) : "—");
        Row("Worst calendar month, vol points", (r, n) => F(Path(r, n).WorstMonthPnl, "0.00"));
        Row("Worst month", (r, n) => Path(r, n).WorstMonth.ToString("yyyy-MM", C));
        Row("Expected shortfall 5% of trades, vol points", (r, n) => F(T(r, n).ExpectedShortfall5VolPoints, "0.00"));
        Row("Skewness of trade P&L", (r, n) => F(T(r, n).Skewness, "0.00"));
        Row("Stress P&L per trade, vol points", (r, _) => F(r.MeanStressPnlVolPoints, "0.00"));
        Row("Mean P&L per unit of stress loss", (r, n) => F(T(r, n).PnlPerUnitStressLoss, "0.000"));
        var s = close.Settings;
        return new TextTable("The rules as delta-hedged straddles", headers, rows, string.Create(C,
            $"P&L in vol points: each trade sized to one vol point of entry vega. Per-trade figures use trades one at a time (no overlap, from the first firing date); per-year figures, Sharpe, Sortino, drawdown and worst month use the daily path of a trade on every signal, each sized 1/{close.HorizonDays}, marked daily at the quoted implied volatility, annualized with {s.AnnualizationDays:0.##} trading days. Zero cost leaves out the option half-spread and the hedge costs. Stress: spot {s.StressSpotMove:+0%;−0%} and implied {s.StressVolatilityShift * 100:+0;−0} vol points at entry, repriced with Black-Scholes-Merton; negative is a loss."));
    }

    private static TextTable StartOffsets(RuleBacktestResult close)
    {
        var headers = new List<string> { "Measure, lowest to highest" };
        foreach (var rule in close.Rules)
        {
            headers.Add(RuleNames.Name(rule.Rule) + ", net");
            headers.Add(RuleNames.Name(rule.Rule) + ", zero cost");
        }

        var rows = new List<IReadOnlyList<string>>();
        void Row(string label, Func<StartOffsetRange, FigureRange?> figure, string format)
        {
            var row = new List<string> { label };
            foreach (var rule in close.Rules)
            {
                row.Add(Range(figure(rule.OneAtATimeRangeNet), format));
                row.Add(Range(figure(rule.OneAtATimeRangeZeroCost), format));
            }

            rows.Add(row);
        }

        Row("Trades", r => r.Trades, "0");
        Row("P&L per year, vol points (sum of trades one at a time)", r => r.PnlPerYear, "0.00");
        Row("Hit rate (trades above zero)", r => r.HitRate, "0.0%");
        Row("Mean P&L per trade, vol points", r => r.MeanVolPoints, "0.00");
        Row("Median P&L per trade, vol points", r => r.MedianVolPoints, "0.00");
        Row("Mean P&L per trade, % of spot", r => r.MeanPercentOfSpot, "0.000");
        Row("Median P&L per trade, % of spot", r => r.MedianPercentOfSpot, "0.000");
        Row("Mean trade t (Newey-West, lag 2 trades)", r => r.MeanTStatistic, "0.00");
        Row("Worst trade, vol points", r => r.WorstVolPoints, "0.00");
        Row("Expected shortfall 5% of trades, vol points", r => r.ExpectedShortfall5VolPoints, "0.00");
        Row("Skewness of trade P&L", r => r.Skewness, "0.00");
        Row("Mean P&L per unit of stress loss", r => r.PnlPerUnitStressLoss, "0.000");
        return new TextTable("One at a time: how much the first trade's date matters", headers, rows, string.Create(C,
            $"Trades one at a time depend on the date of the first one. Each cell is the lowest and the highest value of the figure over the {close.HorizonDays} possible first entries (one per trading day of the horizon); the table above is the first entry's. The daily-path figures (Sharpe, Sortino, drawdown, worst month) use every signal and do not depend on it. The two P&L per year differ because they hold different positions: the daily path is a ladder of a trade on every signal, each sized 1/{close.HorizonDays} and marked daily, so it holds as much as the rule fired over the last {close.HorizonDays} days; one at a time holds one full-size trade from each entry to its expiry, whether or not the rule still fires."));
    }

    private static string Range(FigureRange? range, string format) =>
        range is null ? "—" : range.Low.ToString(format, C) + " to " + range.High.ToString(format, C);

    private static TextTable Tests(RuleBacktestResult close)
    {
        var rows = new List<IReadOnlyList<string>>();
        foreach (var c in new[] { close.ProposedVersusCurrent }.Concat(close.VersusAlwaysSell))
        {
            rows.Add(
            [
                $"{RuleNames.Name(c.First)} − {RuleNames.Name(c.Second)}",
                F(c.DifferencePerYear, "0.00"),
                F(c.Test.TStatistic, "0.00"),
                c.Test.PValue is double p ? P(p) : "—",
                c.Test.PValue is double q && q < 0.05 ? (c.DifferencePerYear > 0 ? $"{RuleNames.Name(c.First)} earned significantly more" : $"{RuleNames.Name(c.First)} earned significantly less") : "no significant difference",
            ]);
        }

        return new TextTable("The tests that decide: differences of daily net P&L",
            ["Rules compared", "Difference, vol points per year", "t", "p", "In words (5%)"], rows,
            string.Create(C, $"Mean difference of the two rules' daily net paths (every signal, marked at quoted implied) with a Newey-West standard error, lag {close.HorizonDays} (the horizon), and a two-sided normal p-value. Rules are not compared trade by trade: their trades fall on different dates."));
    }

    private static TextTable Sweep(RuleBacktestResult close, DataSnoopingResult means)
    {
        var winners = means.StepM.Rejected.Select(i => SweepIndex(close, means, i)).ToHashSet();
        var rows = new List<IReadOnlyList<string>>();
        for (var k = 0; k < close.Sweep.Length; k++)
        {
            var row = close.Sweep[k];
            rows.Add(
            [
                row.ForecastSpec,
                RuleNames.Name(row.Rule),
                row.Sides == RuleSides.Both ? "sell and buy" : "sell only",
                F(row.Threshold * 100, "0.0"),
                row.Trades.ToString(C),
                F(row.PnlPerYear, "0.00"),
                F(row.PnlPerYearZeroCost, "0.00"),
                F(row.Sharpe, "0.00"),
                F(row.SharpeZeroCost, "0.00"),
                winners.Contains(k) ? "yes" : "no",
            ]);
        }

        return new TextTable("Threshold sweep",
            ["Forecaster", "Rule", "Sides", "Threshold, vol points", "Trades (every signal)", "P&L per year, net", "P&L per year, zero cost", "Sharpe, net", "Sharpe, zero cost", "Beats always-sell (StepM, mean)"], rows,
            "Each row trades on every signal, each trade sized 1/h, h the horizon in trading days; P&L in vol points per year. Picking the best row in hindsight is data snooping: the next table tests whether any row beats always-sell once the search is accounted for.");
    }

    private static TextTable Snooping(RuleBacktestResult close, RulePnlReport report)
    {
        var rows = new List<IReadOnlyList<string>>();
        foreach (var (name, test, scale) in new[] { ("mean daily net P&L", report.Means, close.Settings.AnnualizationDays), ("Sharpe ratio", report.Sharpe, Math.Sqrt(close.Settings.AnnualizationDays)) })
        {
            rows.Add(
            [
                name,
                Label(close, test, test.BestRule),
                F(test.Estimates[test.BestRule] * scale, "0.00"),
                P(test.RealityCheckPValue),
                P(test.Spa.Consistent),
                P(test.Spa.Lower),
                P(test.Spa.Upper),
                test.StepM.Rejected.Length == 0 ? "none" : Winners(close, test),
            ]);
        }

        var m = report.Means;
        return new TextTable("Does the best rule survive the search?",
            ["Measure", "Best rule searched", "Its edge over always-sell, per year", "Reality Check p", "SPA p (consistent)", "SPA p (lower)", "SPA p (upper)", "StepM: rules that beat always-sell"], rows,
            string.Create(C,
                $"Null hypothesis: no rule of the {m.Rules} searched (thresholds × forecasters × sides) beats always-sell. White's (2000) Reality Check and Hansen's (2005) SPA test, on mean daily net P&L and on Sharpe ratios (Sullivan, Timmermann and White 1999); Romano and Wolf's (2005) StepM names the rules that beat always-sell with the familywise error held at {m.StepM.Level:0%}. Stationary bootstrap (Politis and Romano 1994), {m.Replications} replications, mean block length {m.MeanBlockLength:0.#} days, seed {m.Seed}; a low p-value means the edge survives the search. The edge on Sharpe is the difference of annualized Sharpe ratios."));
    }

    private static TextTable NextDay(RuleBacktestResult close, RuleBacktestResult next)
    {
        var rows = new List<IReadOnlyList<string>>();
        foreach (var rule in close.Rules)
        {
            var later = next[rule.Rule];
            rows.Add(
            [
                RuleNames.Name(rule.Rule),
                F(rule.PathNet.PnlPerYear, "0.00"),
                F(later.PathNet.PnlPerYear, "0.00"),
                F(rule.PathNet.Sharpe, "0.00"),
                F(later.PathNet.Sharpe, "0.00"),
                F(rule.PathNet.MaxDrawdown, "0.00"),
                F(later.PathNet.MaxDrawdown, "0.00"),
                F(rule.TradeStatisticsNet.MeanVolPoints, "0.00"),
                F(later.TradeStatisticsNet.MeanVolPoints, "0.00"),
            ]);
        }

        return new TextTable("Entry at the signal's close against one trading day later (net of costs)",
            ["Rule", "P&L per year, at close", "P&L per year, next day", "Sharpe, at close", "Sharpe, next day", "Maximum drawdown, at close", "Maximum drawdown, next day", "Mean per trade, at close", "Mean per trade, next day"], rows,
            "Entering at the close of the firing date assumes the forecast exists before that close; the next-day columns enter one trading day later at that day's close and implied volatility. Vol points.");
    }

    private static TextTable Years(RuleBacktestResult close)
    {
        var years = close.Rules.SelectMany(r => r.PathNet.ByYear.Select(y => y.Year)).Distinct().Order().ToArray();
        var rows = new List<IReadOnlyList<string>>();
        foreach (var year in years)
        {
            var row = new List<string> { year.ToString(C) };
            foreach (var rule in close.Rules)
            {
                var found = rule.PathNet.ByYear.FirstOrDefault(y => y.Year == year);
                row.Add(found is null ? "—" : F(found.Pnl, "0.00"));
            }

            rows.Add(row);
        }

        return new TextTable("Net P&L by calendar year, vol points",
            ["Year", .. close.Rules.Select(r => RuleNames.Name(r.Rule))], rows,
            "The daily net path (every signal, marked at quoted implied) summed over each calendar year; the first and last years may be partial.");
    }

    private static TextTable VarianceSwap(RuleBacktestResult close)
    {
        var rows = new List<IReadOnlyList<string>>();
        foreach (var rule in close.Rules)
        {
            var n = rule.Trades.Length;
            rows.Add(
            [
                RuleNames.Name(rule.Rule),
                n.ToString(C),
                F(rule.VarianceGapTotal, "0.0000"),
                F(rule.VarianceGapVolPoints, "0.00"),
                n == 0 ? "—" : F(rule.VarianceGapVolPoints / n, "0.00"),
            ]);
        }

        return new TextTable("The same bet as a variance swap",
            ["Rule", "Trades", "Σ s·(RV² − IV²), total variance", "Σ s·(RV² − IV²)/(2·IV), RV² annualized as Σr²·365/days, vol points", "Per trade, vol points"], rows,
            "A model-free payoff of the same bet on the one-at-a-time trades: s = +1 bought, −1 sold; RV² = Σ r² over the trade and IV² × days / 365, both total variance. At-the-money implied stands in for the variance strike and understates it when the smile has skew.");
    }

    private static List<Setting> Settings(RulePnlReport report, BacktestHorizon horizon)
    {
        var close = report.AtClose;
        var s = close.Settings;
        var proposed = close[TradingRule.Proposed];
        var current = close[TradingRule.Current];
        var historical = close[TradingRule.Historical];
        // The run's horizon names a tenor when there is one; the trades' own nominal days decide when the two differ.
        var expiry = horizon.TenorCalendarDays is int tenor && horizon.NominalDays == close.HorizonDays
            ? string.Create(C, $"the last trading date on or before entry + {tenor} calendar days; held to expiry and settled at that close, payoff |S_T − K|")
            : string.Create(C, $"the close {close.HorizonDays} trading days after entry; held to expiry and settled at that close, payoff |S_T − K|");
        var m = report.Means;
        return
        [
            new("Instrument", "an at-the-money straddle (one call and one put, strike = the entry close), priced with Black-Scholes-Merton at the entry date's implied volatility; time in years = calendar days / 365"),
            new("Size", "each trade sized to an entry vega of one vol point, so a P&L of 1 is one vol point earned"),
            new("Expiry", expiry),
            new("Hedge", (s.HedgeVolatility == HedgeVolatility.Implied ? "at the entry implied volatility" : "at the forecaster's volatility on the firing date") + ": the straddle's Black-Scholes-Merton delta held from each close to the next, up to the close before expiry"),
            new("Costs", string.Create(C, $"option half-spread {s.Costs.OptionHalfSpreadVolPoints:0.00} vol points × entry vega, once at entry; hedge trades {s.Costs.HedgeCostBps:0.##} basis point{(s.Costs.HedgeCostBps == 1 ? string.Empty : "s")} of their notional; every cash flow carried to expiry at r")),
            new("Entries", string.Create(C, $"trade table: one at a time (no overlap) from the first firing date; daily paths, tests and sweep: a trade on every signal, each sized 1/{close.HorizonDays}")),
            new("Entry timing", s.EntryTiming == EntryTiming.FiringClose ? "at the close of the firing date (next-day figures beside)" : "one trading day after the firing date"),
            new("Daily marking", "each open trade marked at that day's quoted implied volatility (the constant-tenor series stands in for the option's own, shorter-dated implied)"),
            new("Rate and dividend", string.Create(C, $"r = {s.Rate:0.####}, q = {s.DividendYield:0.####} (continuous, decimal per year)")),
            new("Stress shock", string.Create(C, $"spot {s.StressSpotMove:+0%;−0%} and implied {s.StressVolatilityShift * 100:+0.#;−0.#} vol points at entry, repriced with Black-Scholes-Merton")),
            new("Rules", string.Create(C, $"sell when implied − forecast > {s.Threshold * 100:0.0} vol points{(s.Sides == RuleSides.Both ? ", buy when forecast − implied > the same" : string.Empty)}; proposed {proposed.ForecastSpec}, current {current.ForecastSpec}, plain historical {historical.ForecastSpec}; walk-forward threshold chosen among {string.Join(", ", s.SweepThresholds.Select(t => (t * 100).ToString("0.0", C)))} vol points on the trades closed by each date")),
            new("Current rule", report.CurrentRuleNote is string note ? char.ToUpperInvariant(note[0]) + note[1..] : string.Create(C, $"the rule on the baseline forecaster, {current.ForecastSpec}")),
            new("Firing dates", string.Create(C, $"{close.FiringDates} dates with implied, all three forecasts and a full trade window; paths {close.Dates[0]:yyyy-MM-dd} to {close.Dates[^1]:yyyy-MM-dd}")),
            new("Annualization", string.Create(C, $"{s.AnnualizationDays:0.##} trading days a year")),
            new("Data-snooping bootstrap", string.Create(C, $"stationary bootstrap, {m.Replications} replications, mean block length {m.MeanBlockLength:0.#} days, seed {m.Seed}, StepM level {m.StepM.Level:0%}")),
        ];
    }

    /// <summary>
    /// The sweep row a data-snooping test's rule index stands for. A test over every sweep row uses the sweep's order;
    /// a test with fewer rules (the Sharpe test must leave out rows that never traded, whose Sharpe ratio is undefined)
    /// counts only the rows that traded, in the sweep's order. -1 when neither fits.
    /// </summary>
    internal static int SweepIndex(RuleBacktestResult close, DataSnoopingResult test, int rule)
    {
        if (test.Rules == close.Sweep.Length)
        {
            return rule;
        }

        var traded = 0;
        for (var k = 0; k < close.Sweep.Length; k++)
        {
            if (close.Sweep[k].Trades > 0 && traded++ == rule)
            {
                return k;
            }
        }

        return -1;
    }

    private static string Label(RuleBacktestResult close, DataSnoopingResult test, int rule) =>
        SweepIndex(close, test, rule) is var k and >= 0 ? RulePnlAnswer.Readable(close.Sweep[k]) : string.Create(C, $"rule {rule + 1} of {test.Rules}");

    private static string Winners(RuleBacktestResult close, DataSnoopingResult test) =>
        string.Join(", ", test.StepM.Rejected.Select(i => Label(close, test, i)));

    private static string Test(NeweyWestMeanTest test) =>
        test is { TStatistic: double t, PValue: double p } ? string.Create(C, $"t = {t:0.00}, {PValueText.Clause(p)}") : "no test: too few days or no variation";

    private static string F(double? value, string format) => value is double v ? v.ToString(format, C) : "—";

    private static string P(double p) => PValueText.Value(p);

    private static string Signed(double value) => (value >= 0 ? "+" : "−") + Math.Abs(value).ToString("0.00", C);
}
