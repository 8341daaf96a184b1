using System.Globalization;
using VolCast.Core.Data;

namespace VolCast.Core.Forecasters;

/// <summary>
/// EWMA of squared returns, zero mean, λ = 0.94 by default (J.P. Morgan/Reuters 1996; docs/methods.md#ewma):
/// σ²(t+1|t) = λ σ²(t|t−1) + (1 − λ) r²ₜ, zero mean. The forecast is flat over the horizon.
/// </summary>
/// <remarks>
/// Seeding: the filter starts as σ²(1|0) = (1/k) Σ r²ᵢ over the first k returns (zero-mean sample variance,
/// k = 22 by default) and then runs through those same returns; there is no forecast before k returns exist.
/// </remarks>
internal sealed class EwmaForecaster : IVolatilityForecaster
{
    /// <summary>The default decay for daily data, 0.94 (J.P. Morgan/Reuters 1996).</summary>
    public const double DailyLambda = 0.94;

    /// <summary>The default number of returns in the seed variance.</summary>
    public const int DefaultSeedReturns = 22;

    private readonly double _lambda;
    private readonly int _seedReturns;

    /// <summary>Creates an EWMA forecaster.</summary>
    /// <param name="lambda">The decay λ, strictly between 0 and 1.</param>
    /// <param name="seedReturns">k, the returns averaged into the seed variance, at least 1.</param>
    /// <exception cref="ArgumentOutOfRangeException">λ is not in (0, 1) or k is below 1.</exception>
    public EwmaForecaster(double lambda = DailyLambda, int seedReturns = DefaultSeedReturns)
    {
        Preconditions.Fraction(lambda);

        Preconditions.AtLeast(seedReturns, 1, "returns");
        _lambda = lambda;
        _seedReturns = seedReturns;
    }

    /// <inheritdoc/>
    public string Spec => string.Create(CultureInfo.InvariantCulture, $"ewma:{_lambda}");

    /// <summary>Returns σ²(t+1|t) = λ σ²(t|t−1) + (1 − λ) r²ₜ.</summary>
    public static double NextVariance(double variance, double logReturn, double lambda) =>
        (lambda * variance) + ((1 - lambda) * logReturn * logReturn);

    /// <inheritdoc/>
    public IForecastSession Start(ForecastInput input)
    {
        ArgumentNullException.ThrowIfNull(input);
        return new Session(this, input);
    }

    private sealed class Session(EwmaForecaster owner, ForecastInput input) : DailySession(input.Prices.Count)
    {
        private readonly double[] _returns = Returns.LogReturns(input.Prices.Close);
        private double _variance;

        protected override void Step(int day)
        {
            if (day < owner._seedReturns)
            {
                return;
            }

            if (day == owner._seedReturns)
            {
                double sum = 0;
                for (var i = 0; i < day; i++)
                {
                    sum += _returns[i] * _returns[i];
                }

                _variance = sum / day;
                for (var i = 0; i < day; i++)
                {
                    _variance = NextVariance(_variance, _returns[i], owner._lambda);
                }

                return;
            }

            _variance = NextVariance(_variance, _returns[day - 1], owner._lambda);
        }

        protected override double? Current(int day) =>
            day < owner._seedReturns ? null : Math.Sqrt(input.AnnualizationFactor * _variance);
    }
}
