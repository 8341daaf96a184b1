using VolCast.Core.Forecasters;

namespace VolCast.Core.Tests.Backtest;

/// <summary>A session that returns precomputed forecasts (each computed from data up to its own date only).</summary>
internal sealed class ArraySession(double?[] values) : IForecastSession
{
    public ForecasterCounts Counts => ForecasterCounts.None;

    public double? Forecast(int t) => values[t];
}
