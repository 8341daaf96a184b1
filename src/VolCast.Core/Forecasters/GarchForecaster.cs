using System.Globalization;
using VolCast.Core.Data;
using VolCast.Core.Garch;

namespace VolCast.Core.Forecasters;

/// <summary>
/// Walk-forward GARCH(1,1) or GJR-GARCH(1,1): refit every R days on a rolling (or expanding) window of returns,
/// warm-started from the last good fit (compared with a cold fit when the warm one ends on a constraint; a GJR fit on
/// γ = 0 or α = 0 is refitted on those faces, see <see cref="GarchFitter"/>), with the variance filter updated every
/// day between refits; the forecast is
/// the annualized average of the expected daily variances over the horizon (<see cref="GarchHorizon.AverageVariance"/>).
/// </summary>
/// <remarks>
/// Defaults: refit every 5 days; rolling window of 2,520 returns once that many exist, expanding before; first fit
/// once 250 returns exist (no forecast before); the variance recursion started by backcasting as in a single fit
/// (<see cref="VarianceStart.Backcast"/>), the optimizer stopped at a gradient of 1e-6. A fit that throws, does not converge or is not stationary is
/// counted and the previous good parameters are kept (with none yet, there is still no forecast).
/// </remarks>
internal sealed class GarchForecaster : IVolatilityForecaster
{
    /// <summary>The default number of returns before the first fit.</summary>
    public const int DefaultMinimumReturns = 250;

    /// <summary>
    /// The gradient test of a walk-forward refit: looser than a single fit's (1e-8), since a forecast needs far fewer
    /// digits of the parameters than a benchmark comparison, and a refit runs every few days.
    /// </summary>
    public const double RefitGradientTolerance = 1e-6;

    private readonly GarchFitOptions _options;
    private readonly int _refitEveryDays;
    private readonly int? _rollingWindowDays;
    private readonly int _minimumReturns;

    /// <summary>Creates a walk-forward GARCH forecaster.</summary>
    /// <param name="variant">GARCH or GJR-GARCH.</param>
    /// <param name="includeMean">Whether a constant mean is estimated (true) or fixed at zero.</param>
    /// <param name="refitEveryDays">R, days between refits, at least 1.</param>
    /// <param name="rollingWindowDays">The rolling window in returns, or null for an expanding window; at least the minimum.</param>
    /// <param name="minimumReturns">Returns needed before the first fit, at least <see cref="GarchFitter.MinimumReturns"/>.</param>
    /// <exception cref="ArgumentOutOfRangeException">A count is below its minimum.</exception>
    public GarchForecaster(
        GarchVariant variant = GarchVariant.Garch,
        bool includeMean = true,
        int refitEveryDays = 5,
        int? rollingWindowDays = 2520,
        int minimumReturns = DefaultMinimumReturns)
    {
        Preconditions.AtLeast(refitEveryDays, 1, "trading day");
        Preconditions.AtLeast(minimumReturns, GarchFitter.MinimumReturns, "returns");
        if (rollingWindowDays is int window)
        {
            Preconditions.AtLeast(window, minimumReturns, "returns", nameof(rollingWindowDays));
        }

        _options = new GarchFitOptions
        {
            Variant = variant,
            IncludeMean = includeMean,
            ComputeStandardErrors = false,
            GradientTolerance = RefitGradientTolerance,
        };
        _refitEveryDays = refitEveryDays;
        _rollingWindowDays = rollingWindowDays;
        _minimumReturns = minimumReturns;
    }

    /// <inheritdoc/>
    public string Spec => (_options.Variant == GarchVariant.GjrGarch ? "gjr-garch" : "garch") + (_options.IncludeMean ? string.Empty : ":zero-mean");

    /// <inheritdoc/>
    public IForecastSession Start(ForecastInput input)
    {
        ArgumentNullException.ThrowIfNull(input);
        return new Session(this, input);
    }

    private sealed class Session(GarchForecaster owner, ForecastInput input) : DailySession(input.Prices.Count)
    {
        private readonly double[] _returns = Returns.LogReturns(input.Prices.Close);
        private GarchFit? _good;
        private double _nextVariance;
        private int? _lastAttempt;

        protected override void Step(int day)
        {
            if (day == 0)
            {
                return;
            }

            // Return of this day is _returns[day − 1]; `day` returns are known now.
            if (_good is not null)
            {
                _nextVariance = _good.Parameters.NextVariance(_nextVariance, _returns[day - 1] - _good.Parameters.Mu);
            }

            if (day < owner._minimumReturns || (_lastAttempt is int last && day - last < owner._refitEveryDays))
            {
                return;
            }

            _lastAttempt = day;
            var length = owner._rollingWindowDays is int w ? Math.Min(w, day) : day;
            var window = _returns.AsSpan(day - length, length);
            RefitCount++;
            GarchFit fit;
            try
            {
                fit = _good is null ? GarchFitter.Fit(window, owner._options) : GarchFitter.Fit(window, owner._options, _good);
            }
            catch (ArgumentException)
            {
                // Bad window (for example constant prices): counted, previous parameters kept.
                FailedFitCount++;
                return;
            }

            if (!fit.Converged)
            {
                FailedFitCount++;
            }
            else if (!fit.Parameters.IsStationary)
            {
                NonStationaryFitCount++;
            }
            else
            {
                _good = fit;
                _nextVariance = fit.NextVariance;
            }
        }

        protected override double? Current(int day)
        {
            if (_good is null)
            {
                return null;
            }

            var p = _good.Parameters;
            var average = GarchHorizon.AverageVariance(_nextVariance, p.LongRunVariance!.Value, p.Persistence, input.HorizonDays);
            return GarchHorizon.AnnualizedVolatility(average, input.AnnualizationFactor);
        }
    }

    /// <inheritdoc/>
    public override string ToString() => string.Create(CultureInfo.InvariantCulture,
        $"{Spec} (refit every {_refitEveryDays} days, window {(_rollingWindowDays is int w ? w.ToString(CultureInfo.InvariantCulture) : "expanding")}, first fit at {_minimumReturns} returns)");
}
