using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Data;
using VolCast.Core.Scoring;
using VolCast.Reports.Model;

namespace VolCast.Reports;

/// <summary>
/// Pulls the series each chart draws out of a <see cref="BacktestResult"/>: plain arrays on the dates where every
/// value the chart needs exists, so the charts never see a missing value and tests can check the data, not pixels.
/// </summary>
internal static class ReportSeries
{
    /// <summary>How many forecasters the time-series charts draw, so 20 years of daily lines stay readable.</summary>
    public const int LeadingCount = 3;

    /// <summary>
    /// The forecasters (implied excluded) with a QLIKE score, best (lowest) first; ties keep configuration order. With
    /// common dates, the members come first, ranked on those dates and carrying their common-date losses and tests against
    /// implied, then the forecasters left out of the common set (too few dates), on their own dates.
    /// </summary>
    public static IReadOnlyList<ForecasterMetrics> Ranked(BacktestResult result)
    {
        if (result.Common is { Count: > 0, Rows.Length: > 0 } common)
        {
            var members = common.Rows.Where(r => r.Kind != ForecastKind.Implied)
                .Select(r => result.Metrics.First(m => m.Spec == r.Spec) with { Losses = r.Losses, VersusImplied = r.VersusImplied });
            var late = OwnDates(result).Where(m => !common.Rows.Any(r => r.Spec == m.Spec));
            return [.. members, .. late];
        }

        return OwnDates(result);
    }

    /// <summary>Implied's losses on the dates the ranking uses: the common dates when there are any, else its own.</summary>
    public static LossSummary? ImpliedLosses(BacktestResult result) =>
        result.Common?.Rows.FirstOrDefault(r => r.Kind == ForecastKind.Implied)?.Losses
        ?? result.Metrics.FirstOrDefault(m => m.Kind == ForecastKind.Implied)?.Losses;

    private static List<ForecasterMetrics> OwnDates(BacktestResult result)
    {
        var rows = new List<ForecasterMetrics>();
        foreach (var m in result.Metrics)
        {
            if (m.Kind != ForecastKind.Implied && m.Losses is not null && double.IsFinite(m.Losses.Qlike))
            {
                rows.Add(m);
            }
        }

        // A stable sort: equal QLIKE keeps the order of the configuration.
        return [.. rows.Select((m, i) => (m, i)).OrderBy(p => p.m.Losses!.Qlike).ThenBy(p => p.i).Select(p => p.m)];
    }

    /// <summary>The specs of the leading forecasters on QLIKE, at most <see cref="LeadingCount"/>.</summary>
    public static IReadOnlyList<string> Leading(BacktestResult result) => [.. Ranked(result).Take(LeadingCount).Select(m => m.Spec)];

    /// <summary>The realized target on the dates it exists.</summary>
    public static TimeSeries Realized(BacktestResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        return Collect(result, "realized (the volatility that followed)", i => result.Realized[i]);
    }

    /// <summary>Implied volatility on the dates it was quoted.</summary>
    public static TimeSeries Implied(BacktestResult result) => Collect(result, ImpliedSeries.Name, i => result.Implied[i]);

    /// <summary>A forecaster's series on the dates it had a forecast.</summary>
    public static TimeSeries Forecast(BacktestResult result, string spec)
    {
        var series = Find(result, spec);
        return Collect(result, spec, i => series.Values[i]);
    }

    /// <summary>Implied minus realized volatility on the dates with both; with common dates, on those only, so the page has one premium figure.</summary>
    public static TimeSeries Premium(BacktestResult result) =>
        Collect(result, "implied − realized", i =>
            result.Implied[i] is double iv && result.Realized[i] is double rv && (result.Common is not { Count: > 0 } c || c.OnCommonDates[i]) ? iv - rv : null);

    /// <summary>QLIKE(forecaster) − QLIKE(implied) on the dates where the forecaster, implied and a positive realized target exist.</summary>
    public static TimeSeries QlikeDifferential(BacktestResult result, string spec)
    {
        var series = Find(result, spec);
        return Collect(result, spec, i =>
            series.Values[i] is double f && f > 0 && result.Implied[i] is double iv && iv > 0 && result.Realized[i] is double rv && rv > 0
                ? Losses.Qlike(rv, f) - Losses.Qlike(rv, iv)
                : null);
    }

    /// <summary>Forecast and realized annualized variance on the dates where both are positive (the Mincer-Zarnowitz sample).</summary>
    public static (double[] Forecast, double[] Realized) Variances(BacktestResult result, string spec)
    {
        var series = Find(result, spec);
        var forecast = new List<double>();
        var realized = new List<double>();
        for (var i = 0; i < result.Dates.Length; i++)
        {
            if (series.Values[i] is double f && f > 0 && result.Realized[i] is double rv && rv > 0)
            {
                forecast.Add(f * f);
                realized.Add(rv * rv);
            }
        }

        return ([.. forecast], [.. realized]);
    }

    /// <summary>
    /// The in-sample loss curve of each swept window family, with the lookbacks its adaptive forecaster chose out of
    /// sample (one entry per date with a choice). EWMA decays are not lookbacks in days, so EWMA is left out here.
    /// </summary>
    public static IReadOnlyList<LookbackCurve> LookbackCurves(BacktestResult result)
    {
        var curves = new List<LookbackCurve>();
        foreach (var adaptive in result.Adaptive)
        {
            var lookbacks = new List<int>();
            var losses = new List<double>();
            foreach (var row in result.Sweep)
            {
                if (row.Family == adaptive.Family && row.Qlike is double q && Lookback(row.Spec) is int days)
                {
                    lookbacks.Add(days);
                    losses.Add(q);
                }
            }

            if (lookbacks.Count == 0)
            {
                continue;
            }

            var chosen = new List<int>();
            foreach (var choice in adaptive.Choices)
            {
                if (choice is not null && Lookback(choice) is int days)
                {
                    chosen.Add(days);
                }
            }

            curves.Add(new LookbackCurve(adaptive.Family, lookbacks, losses, chosen));
        }

        return curves;
    }

    /// <summary>IV − RV on every date the rule test counts, and on the dates its forecast signalled "sell volatility".</summary>
    public static (double[] All, double[] Sell) RuleGaps(BacktestResult result)
    {
        var rule = result.RuleTest ?? throw new ArgumentException("the result has no rule test (no implied series).", nameof(result));
        return ([.. rule.VolatilityGaps(RuleSignal.AllDates)], [.. rule.VolatilityGaps(RuleSignal.SellVolatility)]);
    }

    /// <summary>The last forecast of a series and the date it was made, or null when it never forecast.</summary>
    public static (DateOnly Date, double Value)? Latest(BacktestResult result, string spec)
    {
        var values = spec == ImpliedSeries.Name ? result.Implied : Find(result, spec).Values;
        for (var i = values.Length - 1; i >= 0; i--)
        {
            if (values[i] is double v)
            {
                return (result.Dates[i], v);
            }
        }

        return null;
    }

    /// <summary>The lookback in days of a window spec such as <c>yang-zhang:21</c>, or null for other specs.</summary>
    public static int? Lookback(string spec)
    {
        var colon = spec.LastIndexOf(':');
        return colon > 0 && int.TryParse(spec.AsSpan(colon + 1), NumberStyles.None, CultureInfo.InvariantCulture, out var days) ? days : null;
    }

    private static ForecastSeries Find(BacktestResult result, string spec)
    {
        foreach (var series in result.Forecasts)
        {
            if (series.Spec == spec)
            {
                return series;
            }
        }

        throw new ArgumentException($"the result has no forecaster '{spec}'.", nameof(spec));
    }

    private static TimeSeries Collect(BacktestResult result, string name, Func<int, double?> value)
    {
        var dates = new List<DateOnly>(result.Dates.Length);
        var values = new List<double>(result.Dates.Length);
        for (var i = 0; i < result.Dates.Length; i++)
        {
            if (value(i) is double v && double.IsFinite(v))
            {
                dates.Add(result.Dates[i]);
                values.Add(v);
            }
        }

        return new TimeSeries(name, dates, values);
    }
}
