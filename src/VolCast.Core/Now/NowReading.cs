using System.Collections.Immutable;
using VolCast.Core.Backtest;
using VolCast.Core.Data;
using VolCast.Core.Forecasters;
using VolCast.Core.Trading;

namespace VolCast.Core.Now;

/// <summary>
/// Today's reading of the data: on the last forecast date, each forecaster's forecast, implied, the realized volatility
/// of the window just closed, implied minus each forecast with its percentile among earlier dates, where current
/// realized volatility stands in the cone at the horizon, and what each rule says. A reading, not a recommendation.
/// </summary>
/// <remarks>
/// Every number uses data up to and including the last date only: forecasts and implied are ex-ante, the realized
/// window and the cone use closes up to that date, and each percentile is taken over earlier dates. So a run on a
/// history cut at a date gives, for that date, the same reading bit for bit as a run on the whole history ending
/// there (docs/methods.md#todays-reading).
/// </remarks>
/// <param name="Date">The last forecast date.</param>
/// <param name="HorizonDays">h, the trading days of the realized window and of the cone row (the nominal days of a tenor).</param>
/// <param name="Implied">Implied volatility quoted on the last date (decimal), or null.</param>
/// <param name="RealizedLastWindow">Zero-mean close-to-close realized volatility over the h returns ending on the last date (decimal), or null with fewer than h returns.</param>
/// <param name="ConePercentile">The percentile (0 to 100) of <paramref name="RealizedLastWindow"/> among every h-day window ending on or before the last date (mid-rank), or null.</param>
/// <param name="ConeWindows">The number of h-day windows the cone percentile is taken over.</param>
/// <param name="ThresholdVolPoints">The rule threshold, in vol points.</param>
/// <param name="Forecasts">One row per configured and adaptive forecaster, in the result's order.</param>
/// <param name="Rules">What each rule says, or empty without implied.</param>
public sealed record NowReading(
    DateOnly Date,
    int HorizonDays,
    double? Implied,
    double? RealizedLastWindow,
    double? ConePercentile,
    int ConeWindows,
    double ThresholdVolPoints,
    ImmutableArray<NowForecast> Forecasts,
    ImmutableArray<NowRule> Rules)
{
    /// <summary>Reads the last date of a backtest.</summary>
    /// <param name="result">The backtest result.</param>
    /// <param name="prices">The price history the backtest ran on (closes up to the last forecast date are read).</param>
    /// <param name="rulePnl">The rule's trades, for the walk-forward threshold's choice on the last date, or null when they were not run.</param>
    /// <returns>The reading.</returns>
    /// <exception cref="ArgumentException">The last forecast date is not a date of <paramref name="prices"/>.</exception>
    public static NowReading From(BacktestResult result, PriceHistory prices, RulePnlReport? rulePnl = null)
    {
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(prices);
        var last = result.Dates.Length - 1;
        var date = result.Dates[last];
        var priceIndex = prices.Dates.BinarySearch(date);
        if (priceIndex < 0)
        {
            throw new ArgumentException(FormattableString.Invariant($"The last forecast date {date:yyyy-MM-dd} is not a date of the price history."), nameof(prices));
        }

        var settings = result.Settings;
        var h = settings.Horizon.NominalDays;
        var implied = result.Implied[last];
        var (realized, cone, windows) = Cone(prices.Close[..(priceIndex + 1)], h, settings.AnnualizationFactor);

        var forecasts = ImmutableArray.CreateBuilder<NowForecast>();
        foreach (var f in result.Forecasts)
        {
            var (percentile, earlier) = GapPercentile(result.Implied, f.Values, last);
            var today = f.Values[last];
            forecasts.Add(new NowForecast(f.Spec, today, Gap(implied, today), percentile, earlier));
        }

        var rules = result.HasImplied ? RulesToday(result, prices, priceIndex, implied, rulePnl) : [];
        return new NowReading(date, h, implied, realized, cone, windows, settings.RuleThreshold * 100, forecasts.ToImmutable(), rules);
    }

    /// <summary>Mid-rank percentile of today's implied minus forecast among earlier dates with both.</summary>
    internal static (double? Percentile, int Earlier) GapPercentile(ImmutableArray<double?> implied, ImmutableArray<double?> forecast, int last)
    {
        var today = Gap(implied[last], forecast[last]);
        var below = 0;
        var equal = 0;
        var count = 0;
        for (var s = 0; s < last; s++)
        {
            if (Gap(implied[s], forecast[s]) is not double g)
            {
                continue;
            }

            count++;
            if (today is double t)
            {
                below += g < t ? 1 : 0;
                equal += g == t ? 1 : 0;
            }
        }

        return (today is null || count == 0 ? null : 100.0 * (below + (0.5 * equal)) / count, count);
    }

    private static double? Gap(double? implied, double? forecast) =>
        implied is double iv && forecast is double f ? iv - f : null;

    /// <summary>The realized volatility of the last h-day window and its mid-rank percentile among every h-day window up to it.</summary>
    private static (double? Realized, double? Percentile, int Windows) Cone(ReadOnlySpan<double> close, int h, double annualization)
    {
        var returns = close.Length - 1;
        if (returns < h)
        {
            return (null, null, 0);
        }

        // Sums over prefix sums of squared returns: O(n); each window's sum is the difference of two prefix sums.
        var prefix = new double[close.Length];
        for (var j = 1; j < close.Length; j++)
        {
            var r = Math.Log(close[j] / close[j - 1]);
            prefix[j] = prefix[j - 1] + (r * r);
        }

        var windows = returns - h + 1;
        var vols = new double[windows];
        for (var w = 0; w < windows; w++)
        {
            var end = h + w;
            vols[w] = Math.Sqrt(annualization / h * Math.Max(0, prefix[end] - prefix[end - h]));
        }

        var current = vols[^1];
        var below = 0;
        var equal = 0;
        foreach (var v in vols)
        {
            below += v < current ? 1 : 0;
            equal += v == current ? 1 : 0;
        }

        return (current, 100.0 * (below + (0.5 * equal)) / windows, windows);
    }

    private static ImmutableArray<NowRule> RulesToday(BacktestResult result, PriceHistory prices, int priceIndex, double? implied, RulePnlReport? rulePnl)
    {
        var settings = result.Settings;
        var last = result.Dates.Length - 1;
        var threshold = settings.RuleThreshold;
        var rules = ImmutableArray.CreateBuilder<NowRule>();
        rules.Add(new NowRule("always-sell", null, null, null, implied is null ? "none" : "sell", null, implied is null ? "no implied quote on the last date" : null));
        var proposed = settings.RuleForecaster ?? result.Candidate;
        var historical = settings.RuleHistorical ?? FormattableString.Invariant($"close-to-close:{Math.Max(2, settings.Horizon.NominalDays)}");
        foreach (var (rule, spec) in new[] { ("proposed", proposed), ("current", result.Baseline), ("historical", historical) })
        {
            var forecast = spec == ImpliedSeries.Name ? implied : ForecastAt(result, prices, priceIndex, last, spec);
            rules.Add(Say(rule, spec, implied, forecast, threshold, settings.Trading.Sides) with { ThresholdVolPoints = threshold * 100 });
        }

        rules.Add(WalkForwardToday(result, prices, priceIndex, last, implied, proposed, rulePnl));
        return rules.ToImmutable();
    }

    /// <summary>The walk-forward threshold rule today: the proposed forecaster against the threshold chosen from the trades closed by the last date.</summary>
    private static NowRule WalkForwardToday(BacktestResult result, PriceHistory prices, int priceIndex, int last, double? implied, string proposed, RulePnlReport? rulePnl)
    {
        const string Name = "walk-forward threshold";
        if (rulePnl?.AtClose.WalkForwardToday is not WalkForwardChoice choice)
        {
            return new NowRule(Name, proposed, null, null, "none", null, "the rule's trades were not run, so no threshold was chosen");
        }

        var forecast = proposed == ImpliedSeries.Name ? implied : ForecastAt(result, prices, priceIndex, last, proposed);
        var said = Say(Name, proposed, implied, forecast, choice.Threshold, result.Settings.Trading.Sides);
        var how = choice.TradesClosed == 0
            ? "no trade had closed by the last date, so it uses the sweep threshold nearest the configured one"
            : choice.Fallback
                ? FormattableString.Invariant($"chosen from the {choice.TradesClosed} trades closed by the last date; no sweep threshold earned more than the one nearest the configured threshold")
                : FormattableString.Invariant($"the sweep threshold that earned the most on the {choice.TradesClosed} dates whose trades had closed by the last date");
        return said with { ThresholdVolPoints = choice.Threshold * 100, Note = said.Note is null ? how : said.Note + "; " + how };
    }

    private static double? ForecastAt(BacktestResult result, PriceHistory prices, int priceIndex, int last, string spec)
    {
        foreach (var f in result.Forecasts)
        {
            if (f.Spec == spec)
            {
                return f.Values[last];
            }
        }

        // The rule's historical estimate is not always among the scored forecasters: run it up to the last date.
        var session = ForecasterSpec.Parse(spec).Start(new ForecastInput(prices.Take(priceIndex + 1), null, result.Settings.Horizon.NominalDays, result.Settings.AnnualizationFactor));
        return session.Forecast(priceIndex);
    }

    private static NowRule Say(string rule, string spec, double? implied, double? forecast, double threshold, RuleSides sides)
    {
        if (implied is not double iv || forecast is not double f)
        {
            return new NowRule(rule, spec, forecast, null, "none", null, implied is null ? "no implied quote on the last date" : "no forecast on the last date");
        }

        var gap = iv - f;
        var margin = (Math.Abs(gap) - threshold) * 100;
        var signal = RuleTest.SignalOf(iv, f, threshold);
        return signal switch
        {
            RuleSignal.SellVolatility => new NowRule(rule, spec, f, gap, "sell", margin, null),
            RuleSignal.BuyVolatility when sides == RuleSides.Both => new NowRule(rule, spec, f, gap, "buy", margin, null),
            RuleSignal.BuyVolatility => new NowRule(rule, spec, f, gap, "none", margin, "the gap is on the buy side, and the rule only sells (ruleSides sell-only)"),
            _ => new NowRule(rule, spec, f, gap, "none", margin, null),
        };
    }
}
