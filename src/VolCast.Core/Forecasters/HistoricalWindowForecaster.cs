using System.Globalization;
using VolCast.Core.Estimators;

namespace VolCast.Core.Forecasters;

/// <summary>
/// Historical-window forecaster <c>ESTIMATOR:WINDOW</c>: the forecast at t is flat at today's rolling estimate over
/// bars t − N + 1 .. t, whatever the horizon (the usual "historical volatility" a desk quotes).
/// </summary>
/// <remarks>
/// The whole rolling series is read once per session from the input's shared <see cref="EstimatorTerms"/>, whose window sums at t are
/// differences of prefix sums up to t, so the value at t uses data up to t only by construction. Conventions are
/// those of <see cref="EstimatorTerms"/> (close-to-close: sample variance, mean removed, divisor N − 1).
/// </remarks>
internal sealed class HistoricalWindowForecaster : IVolatilityForecaster
{
    public HistoricalWindowForecaster(Estimator estimator, int window)
    {
        // Validates the estimator and the window (at least 2).
        _ = RollingVolatility.BarsNeeded(estimator, window);
        Estimator = estimator;
        Window = window;
    }

    public Estimator Estimator { get; }

    public int Window { get; }

    public string Spec => string.Create(CultureInfo.InvariantCulture, $"{EstimatorNames.Name(Estimator)}:{Window}");

    public IForecastSession Start(ForecastInput input)
    {
        ArgumentNullException.ThrowIfNull(input);
        if (EstimatorNames.NeedsRange(Estimator) && !input.Prices.HasRange)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"The '{Spec}' forecaster needs open, high and low prices; the price history has closes only (use close-to-close:{Window})."), nameof(input));
        }

        var terms = input.Terms;
        var first = EstimatorTerms.FirstIndex(Estimator, Window);
        var values = new double[terms.ValueCount(Estimator, Window)];
        if (values.Length > 0)
        {
            terms.RollingAnnualizedVolatility(Estimator, Window, values, input.AnnualizationFactor);
        }

        return new Session(input.Prices.Count, first, values);
    }

    public override string ToString() => Spec;

    private sealed class Session(int dayCount, int first, double[] values) : DailySession(dayCount)
    {
        protected override void Step(int day)
        {
        }

        protected override double? Current(int day) => day < first ? null : values[day - first];
    }
}
