using VolCast.Core.Data;

namespace VolCast.Core.Forecasters;

/// <summary>The implied volatility quoted at the close of day t, used as a forecast so it can be scored like any other; no forecast on days without a quote.</summary>
internal sealed class ImpliedForecaster : IVolatilityForecaster
{
    /// <inheritdoc/>
    public string Spec => ImpliedSeries.Name;

    /// <inheritdoc/>
    public IForecastSession Start(ForecastInput input)
    {
        ArgumentNullException.ThrowIfNull(input);
        if (input.Implied is null)
        {
            throw new ArgumentException("The 'implied' forecaster needs an implied-volatility series; none was given.", nameof(input));
        }

        return new Session(input);
    }

    private sealed class Session(ForecastInput input) : DailySession(input.Prices.Count)
    {
        private int _next;
        private double? _today;

        protected override void Step(int day)
        {
            var implied = input.Implied!;
            var date = input.Prices.Dates[day];
            while (_next < implied.Count && implied.Dates[_next] < date)
            {
                _next++;
            }

            _today = _next < implied.Count && implied.Dates[_next] == date ? implied.Volatility[_next] : null;
        }

        protected override double? Current(int day) => _today;
    }
}
