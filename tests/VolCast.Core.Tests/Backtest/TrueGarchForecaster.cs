using VolCast.Core.Forecasters;
using VolCast.Core.Garch;

namespace VolCast.Core.Tests.Backtest;

/// <summary>
/// Test-only forecaster: GARCH(1,1) with known, fixed parameters (no fitting). The variance filter starts at the
/// long-run variance on the first return, as a practitioner must (the true starting variance is unobservable).
/// </summary>
internal sealed class TrueGarchForecaster(GarchParameters parameters) : IVolatilityForecaster
{
    public string Spec => "true-garch";

    public IForecastSession Start(ForecastInput input)
    {
        var close = input.Prices.Close;
        var n = close.Length;
        var values = new double?[n];
        var longRun = parameters.LongRunVariance!.Value;
        var next = longRun;
        for (var t = 1; t < n; t++)
        {
            // After the close of t the return r_t is known; next = σ²_{t+1}.
            var e = Math.Log(close[t] / close[t - 1]) - parameters.Mu;
            next = parameters.NextVariance(next, e);
            var average = GarchHorizon.AverageVariance(next, longRun, parameters.Persistence, input.HorizonDays);
            values[t] = GarchHorizon.AnnualizedVolatility(average, input.AnnualizationFactor);
        }

        return new ArraySession(values);
    }
}
