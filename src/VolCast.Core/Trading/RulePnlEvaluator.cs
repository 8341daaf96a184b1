using System.Collections.Immutable;
using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Data;
using VolCast.Core.Trading.Snooping;

namespace VolCast.Core.Trading;

/// <summary>
/// Runs the rule's trading backtest (<see cref="RuleBacktest"/>) on a finished backtest: the series the backtest made
/// (implied, the rule forecaster's, the baseline's and the plain historical estimate's) mapped onto the price history's
/// dates, traded at the firing close and one trading day later, then the data-snooping tests of the threshold search.
/// </summary>
/// <remarks>
/// <para>The proposed rule is driven by the rule test's forecast (the configuration's rule forecaster, the candidate by
/// default), the plain historical rule by the rule test's historical estimate, and the current rule by the baseline.
/// When the baseline is implied itself, "implied − implied" never fires, so the current rule is then the plain
/// historical rule (the rule a desk without a forecast model would run); the result says so through
/// <see cref="RulePnl.ForecastSpec"/>.</para>
/// <para>The threshold is the configuration's rule threshold and the trading days per year its annualization factor.
/// The data-snooping tests use the stationary bootstrap with the configured replications (1,000 by default), mean
/// block length (the horizon's trading days by default) and seed; the mean test covers every sweep row and the Sharpe
/// test the sweep rows whose daily path varies (a rule that never trades has no Sharpe ratio).</para>
/// </remarks>
public static class RulePnlEvaluator
{
    /// <summary>Runs the trades and the tests.</summary>
    /// <param name="result">The finished backtest.</param>
    /// <param name="prices">The price history it ran on.</param>
    /// <param name="cancellationToken">Checked between the steps.</param>
    /// <returns>The report, or null with the reason in plain words when the rule cannot be traded.</returns>
    /// <exception cref="OperationCanceledException">The token was cancelled.</exception>
    public static (RulePnlReport? Report, string? Absence) Evaluate(BacktestResult result, PriceHistory prices, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(prices);
        if (!result.HasImplied)
        {
            return (null, "No implied-volatility series was given, so there is no price at which the options could have been traded; give --implied to see whether the rule would have paid.");
        }

        if (result.RuleTest is not RuleTestResult rule)
        {
            return (null, "The rule test had no date with implied volatility and both rule forecasts, so no trade could be placed.");
        }

        var settings = result.Settings;
        if (settings.AnnualizationFactor > 366)
        {
            return (null, string.Create(CultureInfo.InvariantCulture,
                $"The rule's trades are daily closes; an annualization factor of {settings.AnnualizationFactor} bars a year is not a daily history (at most 366)."));
        }

        if (settings.RuleThreshold > 1)
        {
            return (null, string.Create(CultureInfo.InvariantCulture,
                $"The rule threshold {settings.RuleThreshold} is above 1 (100 vol points) and can never fire; write it as a decimal (0.02 = two vol points)."));
        }

        var n = prices.Count;
        var index = new Dictionary<DateOnly, int>(n);
        var dates = prices.Dates;
        for (var i = 0; i < n; i++)
        {
            index[dates[i]] = i;
        }

        var implied = Map(result.Dates, result.Implied, index, n);
        var proposed = Series(result, rule, rule.ForecastSpec, index, n);
        var historical = Series(result, rule, rule.HistoricalSpec, index, n);
        var current = Series(result, rule, result.Baseline, index, n);
        if (proposed is null || historical is null)
        {
            return (null, "The rule forecaster is implied itself, so implied minus the forecast is always zero and the rule never fires; set ruleForecaster to a forecaster.");
        }

        var replaced = current is null ? result.Baseline : null;
        current ??= historical;
        var trading = settings.Trading with { Threshold = settings.RuleThreshold, AnnualizationDays = settings.AnnualizationFactor };
        try
        {
            // Both entry timings enter mostly on the same closes: each trade is evaluated once for both.
            var shared = trading.HedgeVolatility == HedgeVolatility.Implied ? RuleBacktest.SharedTrades(prices, implied, settings.Horizon, trading) : null;
            var atClose = RuleBacktest.Run(prices, implied, settings.Horizon, proposed, current, historical, trading, result.Dates[^1], shared);
            cancellationToken.ThrowIfCancellationRequested();
            var nextDay = RuleBacktest.Run(prices, implied, settings.Horizon, proposed, current, historical, trading with { EntryTiming = EntryTiming.NextClose }, shared: shared);
            cancellationToken.ThrowIfCancellationRequested();

            var options = new DataSnoopingOptions(settings.SnoopingBlockLength ?? AutomaticBlockLength.Of(atClose.SnoopingDifferences, atClose.HorizonDays), settings.SnoopingSeed, settings.SnoopingReplications);
            var days = atClose.Dates.Length;
            var draws = DataSnooping.Draw(days, options);
            var means = DataSnooping.TestMeans(atClose.SnoopingDifferences, draws, options.Level);
            cancellationToken.ThrowIfCancellationRequested();

            var always = atClose.Rules[0].DailyPnl;
            var paths = new List<double[]>();
            var rows = ImmutableArray.CreateBuilder<int>();
            for (var k = 0; k < atClose.SnoopingDifferences.Length; k++)
            {
                var d = atClose.SnoopingDifferences[k];
                var path = new double[days];
                for (var t = 0; t < days; t++)
                {
                    path[t] = d[t] + always[t];
                }

                if (Varies(path))
                {
                    paths.Add(path);
                    rows.Add(k);
                }
            }

            if (paths.Count == 0 || !Varies([.. always]))
            {
                return (null, "No rule of the threshold sweep traded often enough to have a Sharpe ratio, so the data-snooping tests cannot be run; give a longer history or lower thresholds.");
            }

            var sharpe = DataSnooping.TestSharpeRatios([.. paths], [.. always], draws, options.Level);
            return (new RulePnlReport(atClose, nextDay, means, sharpe) { SharpeSweepRows = rows.ToImmutable(), CurrentRuleBaselineReplaced = replaced }, null);
        }
        catch (ArgumentException ex)
        {
            // The rule cannot be traded on this data (a horizon under two trading days, no firing date, a rule that
            // never fires, a setting the trades refuse): the backtest stands, and the reason is kept.
            return (null, ex.Message);
        }
    }

    private static bool Varies(double[] path)
    {
        for (var t = 1; t < path.Length; t++)
        {
            if (path[t] != path[0])
            {
                return true;
            }
        }

        return false;
    }

    private static RuleForecast? Series(BacktestResult result, RuleTestResult rule, string spec, Dictionary<DateOnly, int> index, int n)
    {
        foreach (var series in result.Forecasts)
        {
            if (string.Equals(series.Spec, spec, StringComparison.OrdinalIgnoreCase))
            {
                return series.Kind == ForecastKind.Implied ? null : new RuleForecast(series.Spec, Map(result.Dates, series.Values, index, n));
            }
        }

        if (string.Equals(spec, rule.ForecastSpec, StringComparison.OrdinalIgnoreCase) || string.Equals(spec, rule.HistoricalSpec, StringComparison.OrdinalIgnoreCase))
        {
            var values = string.Equals(spec, rule.ForecastSpec, StringComparison.OrdinalIgnoreCase) ? rule.Forecast : rule.Historical;
            var mapped = new double?[n];
            for (var i = 0; i < rule.Dates.Length; i++)
            {
                if (index.TryGetValue(rule.Dates[i], out var j))
                {
                    mapped[j] = values[i];
                }
            }

            return new RuleForecast(spec, mapped);
        }

        // Implied (the baseline when an implied series is given) or a spec the backtest did not run.
        return null;
    }

    private static double?[] Map(ImmutableArray<DateOnly> from, ImmutableArray<double?> values, Dictionary<DateOnly, int> index, int n)
    {
        var mapped = new double?[n];
        for (var i = 0; i < from.Length; i++)
        {
            if (index.TryGetValue(from[i], out var j))
            {
                mapped[j] = values[i];
            }
        }

        return mapped;
    }
}
