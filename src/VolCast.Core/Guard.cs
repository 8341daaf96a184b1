using System.Globalization;

namespace VolCast.Core;

/// <summary>
/// Domain checks shared by Core's public entry points. Each message states the rule and the actual value,
/// formatted with the invariant culture.
/// </summary>
internal static class Guard
{
    /// <summary>Checks that a column has the expected length.</summary>
    /// <exception cref="ArgumentException">The lengths differ.</exception>
    public static void SameLength(int expected, int actual, string paramName)
    {
        if (expected != actual)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must have the same length as the dates ({expected}), was {actual}."), paramName);
        }
    }

    /// <summary>Checks that a price is finite and strictly positive.</summary>
    /// <exception cref="ArgumentException">The price is NaN, infinite, zero or negative.</exception>
    public static void PositivePrice(double value, string paramName, int index)
    {
        if (!double.IsFinite(value) || value <= 0)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"{paramName}[{index}] must be a finite price above zero, was {value}."), paramName);
        }
    }

    /// <summary>Checks that a value is finite (NaN and infinities fail).</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is NaN or infinite.</exception>
    public static void Finite(double value, string paramName)
    {
        if (!double.IsFinite(value))
        {
            throw new ArgumentOutOfRangeException(paramName, value,
                string.Create(CultureInfo.InvariantCulture, $"{paramName} must be a finite number, was {value}."));
        }
    }

    /// <summary>Checks that a window length is at least a minimum number of trading days.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The window is below the minimum.</exception>
    public static void WindowAtLeast(int window, int minimum, string paramName)
    {
        if (window < minimum)
        {
            throw new ArgumentOutOfRangeException(paramName, window,
                string.Create(CultureInfo.InvariantCulture, $"{paramName} must be at least {minimum} trading days (was {window})."));
        }
    }
}
