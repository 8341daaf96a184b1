using System.Globalization;

namespace VolCast.Core.Options;

/// <summary>Argument checks shared by the pricing formulas; messages give the rule and the actual value.</summary>
internal static class PricingGuard
{
    /// <summary>Checks that a price level (spot, forward, strike) is finite and above zero.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is NaN, infinite, zero or negative.</exception>
    public static void Positive(double value, string paramName)
    {
        if (!double.IsFinite(value) || value <= 0)
        {
            throw new ArgumentOutOfRangeException(paramName, value,
                string.Create(CultureInfo.InvariantCulture, $"{paramName} must be a finite number above zero, was {value}."));
        }
    }

    /// <summary>Checks that a value (time, volatility) is finite and not negative.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is NaN, infinite or negative.</exception>
    public static void NonNegative(double value, string paramName)
    {
        if (!double.IsFinite(value) || value < 0)
        {
            throw new ArgumentOutOfRangeException(paramName, value,
                string.Create(CultureInfo.InvariantCulture, $"{paramName} must be a finite number at or above zero, was {value}."));
        }
    }

    /// <summary>Checks the arguments common to every formula.</summary>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of range.</exception>
    public static void Common(double underlying, string underlyingName, double strike, double yearsToExpiry, double volatility, double rate)
    {
        Positive(underlying, underlyingName);
        Positive(strike, nameof(strike));
        NonNegative(yearsToExpiry, nameof(yearsToExpiry));
        NonNegative(volatility, nameof(volatility));
        Guard.Finite(rate, nameof(rate));
    }
}
