using System.Globalization;

namespace VolCast.Core.Calibration;

/// <summary>Domain checks of the calibration layer; messages give the rule and the actual value (invariant culture).</summary>
internal static class CalibrationGuard
{
    /// <summary>Checks that a value is finite and above zero.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is NaN, infinite, zero or negative.</exception>
    public static void Positive(double value, string paramName)
    {
        if (!double.IsFinite(value) || value <= 0)
        {
            throw new ArgumentOutOfRangeException(paramName, value, string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must be a finite number above zero, was {value}."));
        }
    }

    /// <summary>Checks that a forecaster's series is aligned with the outcomes.</summary>
    /// <exception cref="ArgumentException">The lengths differ.</exception>
    public static void Aligned(HorizonOutcomes outcomes, ForecasterVolatility forecaster)
    {
        if (forecaster.AnnualizedVolatility.Count != outcomes.Count)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"{forecaster.Name}: the forecasts must be aligned with the outcomes and have the same length ({outcomes.Count} dates), was {forecaster.AnnualizedVolatility.Count}."), nameof(forecaster));
        }
    }

    /// <summary>Checks that a coverage level is strictly between 0 and 1.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The level is outside (0, 1).</exception>
    public static void Probability(double value, string paramName)
    {
        if (!(value > 0 && value < 1))
        {
            throw new ArgumentOutOfRangeException(paramName, value, string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must be strictly between 0 and 1, was {value}."));
        }
    }
}
