namespace VolCast.Core.Backtest;

/// <summary>
/// The question the rule test asks: was implied minus the realized volatility that followed different on the dates the
/// rule signalled from what it was on all dates? The difference is mean(signalled) − mean(all); its test is the
/// Newey-West t of b in IV − RV = a + b·1{signalled} + e over all dates (b = mean(signalled) − mean(not signalled),
/// which is zero exactly when the signalled mean equals the mean of all dates).
/// </summary>
/// <param name="Source">Spec of the forecast that made the signal.</param>
/// <param name="Signal">The signalled side: sell or buy.</param>
/// <param name="SignalledCount">Dates on which the rule signalled that side.</param>
/// <param name="AllCount">All dates of the rule test.</param>
/// <param name="Difference">Mean IV − RV on the signalled dates minus the mean on all dates (decimal volatility points); null without signalled dates.</param>
/// <param name="TStatistic">The Newey-West t statistic of b; null when it cannot be computed (no signalled date, every date signalled, or too few dates).</param>
/// <param name="PValue">Its two-sided p-value (Student's t, T − 2 degrees of freedom); null with <paramref name="TStatistic"/>.</param>
public sealed record SignalledAgainstAll(
    string Source, RuleSignal Signal, int SignalledCount, int AllCount, double? Difference, double? TStatistic, double? PValue)
{
    /// <summary>Tests the signalled dates of one source and side against all dates of the rule test.</summary>
    /// <param name="rule">The rule test.</param>
    /// <param name="historical">True for the plain historical estimate's signals, false for the rule forecast's.</param>
    /// <param name="signal">Sell or buy.</param>
    /// <param name="lag">The Newey-West lag (the horizon's, as the rule test's rows use).</param>
    /// <returns>The difference and its test.</returns>
    /// <exception cref="ArgumentNullException"><paramref name="rule"/> is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="signal"/> is not a side, or the lag is negative.</exception>
    public static SignalledAgainstAll Compute(RuleTestResult rule, bool historical, RuleSignal signal, int lag)
    {
        ArgumentNullException.ThrowIfNull(rule);
        if (signal == RuleSignal.AllDates)
        {
            throw new ArgumentOutOfRangeException(nameof(signal), signal, "Expected a side: SellVolatility or BuyVolatility.");
        }

        ArgumentOutOfRangeException.ThrowIfNegative(lag);
        var n = rule.Dates.Length;
        var source = historical ? rule.HistoricalSpec : rule.ForecastSpec;
        var gaps = new double[n];
        var design = new double[2 * n];
        int signalled = 0;
        double sumAll = 0, sumSignalled = 0;
        for (var i = 0; i < n; i++)
        {
            var forecast = historical ? rule.Historical[i] : rule.Forecast[i];
            var on = RuleTest.SignalOf(rule.Implied[i], forecast, rule.ThresholdVolatility) == signal;
            gaps[i] = rule.Implied[i] - rule.Realized[i];
            design[2 * i] = 1;
            design[(2 * i) + 1] = on ? 1 : 0;
            sumAll += gaps[i];
            if (on)
            {
                signalled++;
                sumSignalled += gaps[i];
            }
        }

        if (signalled == 0)
        {
            return new SignalledAgainstAll(source, signal, 0, n, null, null, null);
        }

        var difference = (sumSignalled / signalled) - (sumAll / n);
        if (signalled == n || n < 3)
        {
            return new SignalledAgainstAll(source, signal, signalled, n, difference, null, null);
        }

        try
        {
            var fit = Scoring.HacRegression.Fit(gaps, design, 2, Math.Min(lag, n - 1));
            var t = fit.TStatistic(1);
            return double.IsFinite(t)
                ? new SignalledAgainstAll(source, signal, signalled, n, difference, t, fit.TPValue(1))
                : new SignalledAgainstAll(source, signal, signalled, n, difference, null, null);
        }
        catch (ArgumentException)
        {
            // A constant gap or an exact fit leaves nothing to test.
            return new SignalledAgainstAll(source, signal, signalled, n, difference, null, null);
        }
    }
}
