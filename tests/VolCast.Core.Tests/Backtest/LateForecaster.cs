using VolCast.Core.Forecasters;

namespace VolCast.Core.Tests.Backtest;

/// <summary>Test-only forecaster: another forecaster's values, but none before a given share of the history (a late starter).</summary>
internal sealed class LateForecaster(IVolatilityForecaster inner, double startShare, string spec) : IVolatilityForecaster
{
    public string Spec => spec;

    public IForecastSession Start(ForecastInput input)
    {
        var session = inner.Start(input);
        var n = input.Prices.Close.Length;
        var values = new double?[n];
        var start = (int)(startShare * n);
        for (var t = 0; t < n; t++)
        {
            var v = session.Forecast(t);
            values[t] = t >= start ? v : null;
        }

        return new ArraySession(values);
    }
}
