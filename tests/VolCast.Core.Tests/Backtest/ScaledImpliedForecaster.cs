using System.Globalization;
using VolCast.Core.Forecasters;

namespace VolCast.Core.Tests.Backtest;

/// <summary>Test-only forecaster: the implied quote of the same date times a fixed factor.</summary>
internal sealed class ScaledImpliedForecaster(double factor) : IVolatilityForecaster
{
    public string Spec => string.Create(CultureInfo.InvariantCulture, $"implied*{factor}");

    public IForecastSession Start(ForecastInput input)
    {
        var prices = input.Prices;
        var implied = input.Implied!;
        var values = new double?[prices.Count];
        var k = 0;
        for (var t = 0; t < prices.Count; t++)
        {
            while (k < implied.Count && implied.Dates[k] < prices.Dates[t])
            {
                k++;
            }

            if (k < implied.Count && implied.Dates[k] == prices.Dates[t])
            {
                values[t] = factor * implied.Volatility[k];
            }
        }

        return new ArraySession(values);
    }
}
