using System.Collections.Immutable;
using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Data;

namespace VolCast.Core.Trading;

/// <summary>
/// Backtests the volatility rule as delta-hedged at-the-money straddles (<see cref="StraddleTrader"/>): always-sell,
/// the proposed rule, the current rule, a plain historical rule and a walk-forward threshold, with costs, daily paths,
/// a threshold sweep, Newey-West tests and the break-even half-spread.
/// </summary>
/// <remarks>
/// <para>Signals: on a firing date f a forecast rule sells a straddle when implied_f − forecast_f is above the
/// threshold and, with both sides, buys one when forecast_f − implied_f is above it. The trade is entered at the close
/// of f, or one trading day later (<see cref="EntryTiming"/>), priced at that entry date's implied volatility.</para>
/// <para>Expiry: with a horizon of h trading days, the close h trading days after entry; with a tenor of D calendar
/// days, the last trading date on or before entry + D (the same mapping as the realized target, and only once a later
/// date shows that window has closed). A trade needs at least two trading days.</para>
/// <para>Firing dates: every date with implied, all three forecasts, an entry quote and a closed trade window; all
/// rules use the same dates, so always-sell trades on every one of them. The walk-forward threshold on date f is the
/// sweep threshold whose every-signal trades (proposed forecaster, configured sides) that had expired by f earned the
/// most in total net P&amp;L; before any has expired, and on ties, the sweep threshold nearest the configured one.</para>
/// <para>Hedging at the forecast (<see cref="HedgeVolatility.Forecast"/>) uses each rule's own forecaster; always-sell
/// and the walk-forward threshold use the proposed rule's, and a date with a forecast of zero cannot fire.</para>
/// <para>Units: P&amp;L in vol points of entry vega (a trade sized to one vol point of vega); ladders weight each trade
/// 1/h with h the horizon's nominal trading days; annualized with <see cref="TradingSettings.AnnualizationDays"/>.
/// Daily-path tests use a Newey-West lag of h, the test of mean trade P&amp;L a lag of 2 trades.</para>
/// </remarks>
internal static class RuleBacktest
{
    /// <summary>Runs the trading backtest.</summary>
    /// <param name="prices">The price history (closes are traded).</param>
    /// <param name="implied">Implied volatility (decimal) at each close, null where there was no quote; one per close.</param>
    /// <param name="horizon">The backtest's horizon or tenor: the option's life.</param>
    /// <param name="proposed">The rule forecaster's series (the proposed rule).</param>
    /// <param name="current">The baseline forecaster's series (the current rule).</param>
    /// <param name="historical">The plain historical estimate's series.</param>
    /// <param name="settings">The settings.</param>
    /// <param name="lastDate">The last forecast date, for the walk-forward threshold's choice on it (<see cref="RuleBacktestResult.WalkForwardToday"/>), or null.</param>
    /// <param name="shared">
    /// Trades already evaluated by another run on the same prices, implied series, horizon and trade settings (another
    /// entry timing), from <see cref="SharedTrades"/>; used when the hedge is at the entry implied. Null evaluates afresh.
    /// </param>
    /// <returns>The result.</returns>
    /// <exception cref="ArgumentException">A series is misaligned or holds an invalid volatility, a setting is out of range,
    /// the horizon is below two trading days, no date can fire, or the proposed rule never fires.</exception>
    public static RuleBacktestResult Run(
        PriceHistory prices, IReadOnlyList<double?> implied, BacktestHorizon horizon, RuleForecast proposed, RuleForecast current, RuleForecast historical, TradingSettings settings, DateOnly? lastDate = null, EntryTrades? shared = null)
    {
        ArgumentNullException.ThrowIfNull(prices);
        ArgumentNullException.ThrowIfNull(implied);
        ArgumentNullException.ThrowIfNull(horizon);
        ArgumentNullException.ThrowIfNull(proposed);
        ArgumentNullException.ThrowIfNull(current);
        ArgumentNullException.ThrowIfNull(historical);
        ArgumentNullException.ThrowIfNull(settings);
        settings.Validate();
        var n = prices.Count;
        var iv = Checked(implied, n, nameof(implied), TradingGuard.Volatility);
        RuleForecast[] forecasts = [proposed, current, historical];
        var series = CheckedForecasts(forecasts, n);
        RequireTwoTradingDays(horizon);

        var h = horizon.NominalDays;
        var windows = RealizedWindows.Compute(prices, horizon, RealizedTarget.SquaredReturns, settings.AnnualizationDays);
        var lag = settings.EntryTiming == EntryTiming.NextClose ? 1 : 0;
        var firing = FiringDates(iv, series, windows, lag, settings);
        var (entry, expiry) = TradeWindows(firing, windows, lag);
        var m = firing.Count;
        var start = entry[0];
        var end = expiry.Max();
        var length = end - start + 1;
        var dates = prices.Dates.Slice(start, length).ToArray();
        var weight = 1.0 / h;
        var books = BuildBooks(prices, iv, series, firing, entry, expiry, settings, shared, windows);

        var context = new Context(prices, iv, firing, books, start, length, dates, weight, h, settings);
        var sell = new sbyte[m];
        Array.Fill(sell, (sbyte)-1);
        var always = context.Rule(TradingRule.AlwaysSell, null, 0, null, null, RuleSides.SellOnly, sell, null);

        var proposedSides = Signals(iv, series[0], firing, settings.Threshold, settings.Sides);
        RequireProposedFires(proposedSides, proposed, prices, firing, settings);
        var proposedRule = context.Rule(TradingRule.Proposed, proposed.Spec, 0, series[0], settings.Threshold, settings.Sides, proposedSides, null);
        var currentRule = context.Rule(TradingRule.Current, current.Spec, 1, series[1], settings.Threshold, settings.Sides, Signals(iv, series[1], firing, settings.Threshold, settings.Sides), null);
        var historicalRule = context.Rule(TradingRule.Historical, historical.Spec, 2, series[2], settings.Threshold, settings.Sides, Signals(iv, series[2], firing, settings.Threshold, settings.Sides), null);

        var thresholds = settings.SweepThresholds.Sort();
        var sweep = Sweep(context, forecasts, series, thresholds, always.Ladder.Net);
        var walkForward = WalkForward(context, books[0], thresholds, sweep.ProposedSides, settings.Threshold, proposed.Spec, series[0], settings.Sides);
        ImmutableArray<RulePnl> rules = [always.Result, proposedRule.Result, currentRule.Result, historicalRule.Result, walkForward];

        var versus = ImmutableArray.CreateBuilder<RuleComparison>();
        for (var r = 1; r < rules.Length; r++)
        {
            versus.Add(Compare(rules[r], rules[0], h, settings.AnnualizationDays));
        }

        var breakEven = BreakEven(always, proposedRule, length, settings);
        return new RuleBacktestResult(
            settings, h, m, [.. dates], rules, Compare(rules[1], rules[2], h, settings.AnnualizationDays), versus.ToImmutable(), sweep.Rows, breakEven, sweep.Differences)
        {
            WalkForwardToday = lastDate is DateOnly last ? WalkForwardOn(context, books[0], horizon, thresholds, sweep.ProposedSides, settings.Threshold, last) : null,
        };
    }

    /// <summary>
    /// The walk-forward threshold's choice on <paramref name="last"/>, from the trades whose window had closed by then:
    /// with a horizon in trading days, an expiry on or before that date; with a tenor, an entry date plus the tenor on or
    /// before it (only then is the window's last trading date known from dates up to it). Trades are summed in firing
    /// order, so a run on the history cut at that date chooses the same threshold from the same sums, bit for bit.
    /// </summary>
    private static WalkForwardChoice WalkForwardOn(Context context, TradeBook book, BacktestHorizon horizon, ImmutableArray<double> thresholds, sbyte[][] sweepSides, double configured, DateOnly last)
    {
        var dates = context.Prices.Dates;
        var at = dates.BinarySearch(last);
        var lastIndex = at >= 0 ? at : ~at - 1;
        var k = thresholds.Length;
        var nearest = Nearest(thresholds, configured);

        var closed = new double[k];
        var count = 0;
        for (var p = 0; p < context.Firing.Count; p++)
        {
            var done = horizon.TenorCalendarDays is int days
                ? dates[book.Entry[p]].AddDays(days) <= last
                : book.Expiry[p] <= lastIndex;
            if (!done)
            {
                continue;
            }

            count++;
            AddClosed(closed, sweepSides, book, p);
        }

        var best = BestSoFar(closed, nearest);
        return new WalkForwardChoice(last, thresholds[best], count, best == nearest);
    }

    private static double?[][] CheckedForecasts(RuleForecast[] forecasts, int n)
    {
        var series = new double?[forecasts.Length][];
        for (var k = 0; k < forecasts.Length; k++)
        {
            series[k] = Checked(forecasts[k].Values, n, forecasts[k].Spec, TradingGuard.Forecast);
        }

        return series;
    }

    private static void RequireTwoTradingDays(BacktestHorizon horizon)
    {
        if (horizon.TradingDays is < 2 || horizon.NominalDays < 2)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"A delta-hedged trade needs a horizon of at least two trading days (one rebalance before expiry), was {horizon} ({horizon.NominalDays} trading day); use --horizon 2 or more, or a tenor of at least 3 calendar days."), nameof(horizon));
        }
    }

    /// <summary>Every date with implied, all three forecasts, an entry quote and a closed window of two or more trading days.</summary>
    private static List<int> FiringDates(double?[] implied, double?[][] series, RealizedWindows windows, int lag, TradingSettings settings)
    {
        var n = implied.Length;
        var firing = new List<int>();
        for (var f = 0; f + lag < n; f++)
        {
            var e = f + lag;
            var hedgeable = settings.HedgeVolatility == HedgeVolatility.Implied || (series[0][f] > 0 && series[1][f] > 0 && series[2][f] > 0);
            if (implied[f] is not null && implied[e] is not null && series[0][f] is not null && series[1][f] is not null && series[2][f] is not null
                && windows.WindowDays[e] >= 2 && hedgeable)
            {
                firing.Add(f);
            }
        }

        if (firing.Count == 0)
        {
            throw new ArgumentException(
                "No date can fire a trade: none has implied volatility, all three forecasts and a full trade window after it (with an implied quote on the entry date). Give a longer history or an implied series that overlaps the forecasts.",
                nameof(implied));
        }

        return firing;
    }

    private static (int[] Entry, int[] Expiry) TradeWindows(List<int> firing, RealizedWindows windows, int lag)
    {
        var m = firing.Count;
        var entry = new int[m];
        var expiry = new int[m];
        for (var i = 0; i < m; i++)
        {
            entry[i] = firing[i] + lag;
            expiry[i] = entry[i] + windows.WindowDays[entry[i]];
        }

        return (entry, expiry);
    }

    /// <summary>
    /// The store of trades hedged at the entry implied that the runs of both entry timings on the same inputs can share
    /// (<see cref="EntryTrades"/>): pass it to each <see cref="Run"/>. A hedge at the forecast does not use it.
    /// </summary>
    public static EntryTrades SharedTrades(PriceHistory prices, IReadOnlyList<double?> implied, BacktestHorizon horizon, TradingSettings settings)
    {
        ArgumentNullException.ThrowIfNull(prices);
        ArgumentNullException.ThrowIfNull(implied);
        ArgumentNullException.ThrowIfNull(horizon);
        ArgumentNullException.ThrowIfNull(settings);
        var windows = RealizedWindows.Compute(prices, horizon, RealizedTarget.SquaredReturns, settings.AnnualizationDays);
        return new EntryTrades(prices, Checked(implied, prices.Count, nameof(implied), TradingGuard.Volatility), windows.WindowDays, settings);
    }

    /// <summary>One book per hedge volatility series: the entry implied (one book, from the shared store or a new one), or each forecaster's.</summary>
    private static TradeBook[] BuildBooks(
        PriceHistory prices, double?[] iv, double?[][] series, List<int> firing, int[] entry, int[] expiry, TradingSettings settings, EntryTrades? shared, RealizedWindows windows)
    {
        var m = firing.Count;
        var books = new TradeBook[3];
        if (settings.HedgeVolatility == HedgeVolatility.Implied)
        {
            books[0] = books[1] = books[2] = TradeBook.FromEntries(shared ?? new EntryTrades(prices, iv, windows.WindowDays, settings), entry, expiry);
            return books;
        }

        for (var k = 0; k < 3; k++)
        {
            var hedge = new double[m];
            for (var i = 0; i < m; i++)
            {
                hedge[i] = series[k][firing[i]]!.Value;
            }

            books[k] = TradeBook.Build(prices.Dates, prices.Close, entry, expiry, hedge, iv, settings);
        }

        return books;
    }

    private static void RequireProposedFires(sbyte[] proposedSides, RuleForecast proposed, PriceHistory prices, List<int> firing, TradingSettings settings)
    {
        if (Array.TrueForAll(proposedSides, s => s == 0))
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"The proposed rule never fired: implied minus the {proposed.Spec} forecast was never above the threshold {settings.Threshold} on the {firing.Count} firing dates from {prices.Dates[firing[0]]:yyyy-MM-dd} to {prices.Dates[firing[^1]]:yyyy-MM-dd}; lower the rule threshold or check the implied series' unit (decimal: 0.20 = 20%)."),
                nameof(settings));
        }
    }

    /// <summary>The sweep: every forecaster × side shown × threshold, with each row's daily net P&amp;L less always-sell's.</summary>
    private static SweepResult Sweep(Context context, RuleForecast[] forecasts, double?[][] series, ImmutableArray<double> thresholds, double[] alwaysNet)
    {
        var settings = context.Settings;
        var length = context.Length;
        RuleSides[] sidesShown = settings.Sides == RuleSides.Both ? [RuleSides.SellOnly, RuleSides.Both] : [RuleSides.SellOnly];
        var sweep = ImmutableArray.CreateBuilder<ThresholdSweepRow>();
        var differences = new List<double[]>();
        sbyte[][]? proposedSweepSides = null;
        TradingRule[] roles = [TradingRule.Proposed, TradingRule.Current, TradingRule.Historical];
        for (var k = 0; k < 3; k++)
        {
            foreach (var sides in sidesShown)
            {
                var perThreshold = new sbyte[thresholds.Length][];
                for (var j = 0; j < thresholds.Length; j++)
                {
                    perThreshold[j] = Signals(context.Implied, series[k], context.Firing, thresholds[j], sides);
                    var ladder = context.Books[k].Ladder(perThreshold[j], context.Weight, context.Start, length, false);
                    var net = PnlStatisticsCalculator.Summary(ladder.Net, settings.AnnualizationDays);
                    var gross = PnlStatisticsCalculator.Summary(ladder.Gross, settings.AnnualizationDays);
                    var label = string.Create(CultureInfo.InvariantCulture, $"{forecasts[k].Spec}|{SidesName(sides)}|{thresholds[j]}");
                    sweep.Add(new ThresholdSweepRow(label, roles[k], forecasts[k].Spec, sides, thresholds[j], ladder.Trades, net.PerYear, gross.PerYear, net.Sharpe, gross.Sharpe));
                    var d = new double[length];
                    for (var t = 0; t < length; t++)
                    {
                        d[t] = ladder.Net[t] - alwaysNet[t];
                    }

                    differences.Add(d);
                }

                if (k == 0 && sides == settings.Sides)
                {
                    proposedSweepSides = perThreshold;
                }
            }
        }

        return new SweepResult(sweep.ToImmutable(), [.. differences], proposedSweepSides!);
    }

    /// <summary>The half-spread at which the proposed rule's edge over always-sell, and its own P&amp;L, reach zero.</summary>
    private static BreakEvenSpread BreakEven((RulePnl Result, Ladder Ladder) always, (RulePnl Result, Ladder Ladder) proposedRule, int length, TradingSettings settings)
    {
        var years = length / settings.AnnualizationDays;
        var edge = (proposedRule.Result.PathNet.Total - always.Result.PathNet.Total) / years;
        var slope = (proposedRule.Ladder.WeightedCarry - always.Ladder.WeightedCarry) / years;
        var c0 = settings.Costs.OptionHalfSpreadVolPoints;
        double? edgeSpread = slope != 0 && c0 + (edge / slope) >= 0 ? c0 + (edge / slope) : null;
        var ownSlope = proposedRule.Ladder.WeightedCarry / years;
        var ownPerYear = proposedRule.Result.PathNet.Total / years;
        double? ownSpread = ownSlope > 0 && c0 + (ownPerYear / ownSlope) >= 0 ? c0 + (ownPerYear / ownSlope) : null;
        return new BreakEvenSpread(edge, -slope, edgeSpread, ownSpread);
    }

    /// <summary>The side of each firing position: −1 sell when implied − forecast &gt; threshold, +1 buy on the mirror with both sides, else 0.</summary>
    internal static sbyte[] Signals(double?[] implied, double?[] forecast, List<int> firing, double threshold, RuleSides sides)
    {
        var result = new sbyte[firing.Count];
        for (var i = 0; i < firing.Count; i++)
        {
            var f = firing[i];
            var gap = implied[f]!.Value - forecast[f]!.Value;
            result[i] = gap > threshold ? (sbyte)-1 : (sides == RuleSides.Both && -gap > threshold ? (sbyte)1 : (sbyte)0);
        }

        return result;
    }

    private static RuleComparison Compare(RulePnl first, RulePnl second, int h, double annualizationDays)
    {
        var a = first.DailyPnl;
        var b = second.DailyPnl;
        var d = new double[a.Length];
        for (var t = 0; t < d.Length; t++)
        {
            d[t] = a[t] - b[t];
        }

        var test = PnlStatisticsCalculator.MeanTest(d, h);
        return new RuleComparison(first.Rule, second.Rule, test.Mean * annualizationDays, test);
    }

    private static RulePnl WalkForward(Context context, TradeBook book, ImmutableArray<double> thresholds, sbyte[][] sweepSides, double configured, string spec, double?[] forecast, RuleSides sides)
    {
        var firing = context.Firing;
        var m = firing.Count;
        var k = thresholds.Length;
        var nearest = Nearest(thresholds, configured);

        // Trades in expiry order, so the closed P&L of each threshold can be accumulated as the firing date advances.
        var order = new int[m];
        for (var i = 0; i < m; i++)
        {
            order[i] = i;
        }

        Array.Sort((int[])book.Expiry.Clone(), order);
        var closed = new double[k];
        var next = 0;
        var chosen = new sbyte[m];
        var chosenThreshold = new double?[context.Length];
        for (var i = 0; i < m; i++)
        {
            var f = firing[i];
            while (next < m && book.Expiry[order[next]] <= f)
            {
                AddClosed(closed, sweepSides, book, order[next++]);
            }

            var best = BestSoFar(closed, nearest);

            chosen[i] = sweepSides[best][i];
            var day = book.Entry[i] - context.Start;
            chosenThreshold[day] = thresholds[best];
        }

        return context.Rule(TradingRule.WalkForwardThreshold, spec, 0, forecast, null, sides, chosen, [.. chosenThreshold]).Result;
    }

    private static List<int> EverySignal(sbyte[] signal)
    {
        var result = new List<int>();
        for (var i = 0; i < signal.Length; i++)
        {
            if (signal[i] != 0)
            {
                result.Add(i);
            }
        }

        return result;
    }

    private static string SidesName(RuleSides sides) => sides == RuleSides.Both ? "both" : "sell-only";

    private static double?[] Checked(IReadOnlyList<double?> values, int n, string name, Action<double?, string, int> check)
    {
        if (values.Count != n)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"The {name} series must hold one value (or null) per close, {n}, was {values.Count}."), nameof(values));
        }

        var result = new double?[n];
        for (var i = 0; i < n; i++)
        {
            check(values[i], name, i);
            result[i] = values[i];
        }

        return result;
    }

    /// <summary>The sweep's rows, each row's daily difference from always-sell, and the proposed forecaster's signals per threshold at the configured sides.</summary>
    private sealed record SweepResult(ImmutableArray<ThresholdSweepRow> Rows, double[][] Differences, sbyte[][] ProposedSides);

    /// <summary>What every rule shares: the prices, the firing dates, the books and the path window.</summary>
    private sealed record Context(
        PriceHistory Prices, double?[] Implied, List<int> Firing, TradeBook[] Books, int Start, int Length, DateOnly[] Dates, double Weight, int H, TradingSettings Settings)
    {
        public (RulePnl Result, Ladder Ladder) Rule(
            TradingRule rule, string? spec, int bookIndex, double?[]? forecast, double? threshold, RuleSides sides, sbyte[] signal, ImmutableArray<double?>? chosen)
        {
            var book = Books[bookIndex];
            var ladder = book.Ladder(signal, Weight, Start, Length, true);
            var annual = Settings.AnnualizationDays;
            var years = Length / annual;

            // One at a time, from each of the h start offsets; the trade table is the first start's, and every trade
            // figure is also given as its range over the offsets.
            var dates = Prices.Dates;
            var close = Prices.Close;
            List<int> first = [];
            var byStartNet = new List<(TradeStatistics, double)>(H);
            var byStartGross = new List<(TradeStatistics, double)>(H);
            for (var o = 0; o < H; o++)
            {
                var taken = book.OneAtATime(signal, Start + o);
                if (o == 0)
                {
                    first = Settings.Entries == TradeEntries.EverySignal ? EverySignal(signal) : taken;
                }

                var (statsNet, statsGross, totalNet, totalGross) = Statistics(book, signal, taken, dates, close);
                byStartNet.Add((statsNet, totalNet / years));
                byStartGross.Add((statsGross, totalGross / years));
            }

            var trades = ImmutableArray.CreateBuilder<StraddleTrade>(first.Count);
            var net = new double[first.Count];
            var gross = new double[first.Count];
            var netPercent = new double[first.Count];
            var grossPercent = new double[first.Count];
            var entryDates = new DateOnly[first.Count];
            double stress = 0, varianceGap = 0, varianceGapPoints = 0;
            for (var j = 0; j < first.Count; j++)
            {
                var i = first[j];
                var trade = StraddleTrader.ToTrade(book.Trades[i], signal[i], dates, close, forecast?[Firing[i]]);
                trades.Add(trade);
                net[j] = trade.PnlVolPoints;
                gross[j] = trade.GrossPnlVolPoints;
                netPercent[j] = trade.PnlPercentOfSpot;
                grossPercent[j] = trade.GrossPnlPercentOfSpot;
                entryDates[j] = trade.EntryDate;
                stress += trade.StressPnlVolPoints;
                varianceGap += trade.VarianceGap;
                varianceGapPoints += trade.VarianceGapVolPoints;
            }

            var meanStress = first.Count > 0 ? stress / first.Count : 0;
            var result = new RulePnl(
                rule,
                spec,
                threshold,
                sides,
                trades.MoveToImmutable(),
                PnlStatisticsCalculator.Trades(net, netPercent, entryDates, -meanStress),
                PnlStatisticsCalculator.Trades(gross, grossPercent, entryDates, -meanStress),
                ladder.Trades,
                (double)ladder.DaysInMarket / Length,
                PnlStatisticsCalculator.Path(ladder.Net, Dates, annual),
                PnlStatisticsCalculator.Path(ladder.Gross, Dates, annual),
                [.. ladder.Net],
                [.. ladder.Gross],
                [.. ladder.EntryVolNet],
                [.. ladder.EntryVolGross],
                StartOffsetRange.Over(byStartNet),
                StartOffsetRange.Over(byStartGross),
                first.Count > 0 ? meanStress : null,
                varianceGap,
                varianceGapPoints,
                chosen ?? []);
            return (result, ladder);
        }

        /// <summary>Net and zero-cost trade statistics and total vol-point P&amp;L of the trades at <paramref name="taken"/>.</summary>
        private static (TradeStatistics Net, TradeStatistics Gross, double TotalNet, double TotalGross) Statistics(
            TradeBook book, sbyte[] signal, List<int> taken, ReadOnlySpan<DateOnly> dates, ReadOnlySpan<double> close)
        {
            var n = taken.Count;
            var net = new double[n];
            var gross = new double[n];
            var netPercent = new double[n];
            var grossPercent = new double[n];
            var entryDates = new DateOnly[n];
            double stress = 0, totalNet = 0, totalGross = 0;
            for (var j = 0; j < n; j++)
            {
                var i = taken[j];
                var trade = StraddleTrader.ToTrade(book.Trades[i], signal[i], dates, close, null);
                net[j] = trade.PnlVolPoints;
                gross[j] = trade.GrossPnlVolPoints;
                netPercent[j] = trade.PnlPercentOfSpot;
                grossPercent[j] = trade.GrossPnlPercentOfSpot;
                entryDates[j] = trade.EntryDate;
                stress += trade.StressPnlVolPoints;
                totalNet += net[j];
                totalGross += gross[j];
            }

            var meanStress = n > 0 ? stress / n : 0;
            return (PnlStatisticsCalculator.Trades(net, netPercent, entryDates, -meanStress),
                PnlStatisticsCalculator.Trades(gross, grossPercent, entryDates, -meanStress), totalNet, totalGross);
        }
    }

    // The swept threshold nearest the configured one (the first of two equally near).
    private static int Nearest(ImmutableArray<double> thresholds, double configured)
    {
        var nearest = 0;
        for (var j = 1; j < thresholds.Length; j++)
        {
            nearest = Math.Abs(thresholds[j] - configured) < Math.Abs(thresholds[nearest] - configured) ? j : nearest;
        }

        return nearest;
    }

    // Adds the net P&L of the trade entered at position p to each swept threshold's running total of closed trades.
    private static void AddClosed(double[] closed, sbyte[][] sweepSides, TradeBook book, int p)
    {
        for (var j = 0; j < closed.Length; j++)
        {
            if (sweepSides[j][p] != 0)
            {
                closed[j] += book.NetVolPoints(p, sweepSides[j][p]);
            }
        }
    }

    // The swept threshold with the most closed P&L so far; the one nearest the configured threshold unless another earned strictly more.
    private static int BestSoFar(double[] closed, int nearest)
    {
        var best = nearest;
        for (var j = 0; j < closed.Length; j++)
        {
            best = closed[j] > closed[best] ? j : best;
        }

        return best;
    }
}
