using System.Globalization;

namespace VolCast.Core.Calibration;

/// <summary>One forecaster's annualized volatility forecasts (decimal), aligned with <see cref="HorizonOutcomes"/>.</summary>
/// <remarks>
/// A date on which the forecaster has no value (a warm-up period, an implied quote that is missing) is null. Such
/// dates are counted and listed in the results, never dropped silently. A value that is present must be finite and
/// above zero.
/// </remarks>
public sealed record ForecasterVolatility
{
    /// <summary>Creates the series and checks it.</summary>
    /// <param name="spec">The forecaster's spec as written in a configuration, for example <c>yang-zhang:21</c> or <c>implied</c>.</param>
    /// <param name="annualizedVolatility">σ_F per date, annualized decimal; null where the forecaster has no value.</param>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">The spec is blank.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A value present is not finite or not above zero.</exception>
    public ForecasterVolatility(string spec, double?[] annualizedVolatility)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(spec);
        ArgumentNullException.ThrowIfNull(annualizedVolatility);
        for (var i = 0; i < annualizedVolatility.Length; i++)
        {
            if (annualizedVolatility[i] is { } v && (!double.IsFinite(v) || v <= 0))
            {
                throw new ArgumentOutOfRangeException(nameof(annualizedVolatility), v, string.Create(CultureInfo.InvariantCulture,
                    $"{spec}: annualizedVolatility[{i}] must be a finite volatility above zero, or null where the forecaster has no value, was {v}."));
            }
        }

        Spec = spec;
        AnnualizedVolatility = annualizedVolatility;
    }

    /// <summary>The forecaster's spec, as written in a configuration.</summary>
    public string Spec { get; }

    /// <summary>σ_F per date, annualized decimal; null where missing.</summary>
    public IReadOnlyList<double?> AnnualizedVolatility { get; }

    internal double?[] Values => (double?[])AnnualizedVolatility;
}
