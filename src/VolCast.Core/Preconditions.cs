using System.Globalization;
using System.Runtime.CompilerServices;

namespace VolCast.Core;

/// <summary>
/// The argument checks of Core, written once. Each check throws the exception type callers rely on
/// (<see cref="ArgumentException"/> for the shape of the input, <see cref="ArgumentOutOfRangeException"/> for a value
/// out of its range), names the argument (taken from the call site unless given), and says what was expected and what
/// was found, formatted with the invariant culture. Checks that belong to one domain (a price history's bars, an
/// estimator's need for columns) stay beside that domain and call these for the common part.
/// </summary>
internal static class Preconditions
{
    /// <summary>True when the value is finite and above zero: the one test of "a usable positive number".</summary>
    public static bool IsPositive(double value) => double.IsFinite(value) && value > 0;

    /// <summary>True when the value is present, finite and above zero.</summary>
    public static bool IsPositive(double? value) => value is double v && IsPositive(v);

    /// <summary>Checks that a value is finite (NaN and infinities fail).</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is NaN or infinite.</exception>
    public static void Finite(double value, [CallerArgumentExpression(nameof(value))] string paramName = "")
    {
        if (!double.IsFinite(value))
        {
            throw OutOfRange(paramName, value, $"{paramName} must be a finite number, was {value}.");
        }
    }

    /// <summary>Checks that a value is finite and above zero.</summary>
    /// <param name="value">The value.</param>
    /// <param name="what">What the value is, for the message ("number", "price", "volatility", …).</param>
    /// <param name="paramName">The argument's name.</param>
    /// <exception cref="ArgumentOutOfRangeException">The value is NaN, infinite, zero or negative.</exception>
    public static void Positive(double value, string what = "number", [CallerArgumentExpression(nameof(value))] string paramName = "")
    {
        if (!IsPositive(value))
        {
            throw OutOfRange(paramName, value, $"{paramName} must be a finite {what} above zero, was {value}.");
        }
    }

    /// <summary>Checks that a value is finite and zero or more.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is NaN, infinite or negative.</exception>
    public static void NonNegative(double value, string what = "number", [CallerArgumentExpression(nameof(value))] string paramName = "")
    {
        if (!double.IsFinite(value) || value < 0)
        {
            throw OutOfRange(paramName, value, $"{paramName} must be a finite {what} of zero or more, was {value}.");
        }
    }

    /// <summary>Checks that a value lies strictly between 0 and 1 (a probability, a level, a significance).</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is outside the open interval (0, 1) or NaN.</exception>
    public static void Fraction(double value, [CallerArgumentExpression(nameof(value))] string paramName = "")
    {
        if (!(value > 0 && value < 1))
        {
            throw OutOfRange(paramName, value, $"{paramName} must be strictly between 0 and 1, was {value}.");
        }
    }

    /// <summary>Checks that a value lies in the closed interval [0, 1] (a probability that may be certain).</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is outside [0, 1] or NaN.</exception>
    public static void Probability(double value, [CallerArgumentExpression(nameof(value))] string paramName = "")
    {
        if (!(value >= 0 && value <= 1))
        {
            throw OutOfRange(paramName, value, $"{paramName} must be between 0 and 1 inclusive, was {value}.");
        }
    }

    /// <summary>Checks that a count (a window, a horizon, a number of bins) is at least a minimum.</summary>
    /// <param name="value">The count.</param>
    /// <param name="minimum">The smallest allowed count.</param>
    /// <param name="unit">The unit of the count, for the message ("trading days", "bins", …).</param>
    /// <param name="paramName">The argument's name.</param>
    /// <exception cref="ArgumentOutOfRangeException">The count is below the minimum.</exception>
    public static void AtLeast(int value, int minimum, string unit, [CallerArgumentExpression(nameof(value))] string paramName = "")
    {
        if (value < minimum)
        {
            throw OutOfRange(paramName, value, $"{paramName} must be at least {minimum} {unit}, was {value}.");
        }
    }

    /// <summary>Checks that a whole number lies in [<paramref name="minimum"/>, <paramref name="maximum"/>].</summary>
    /// <param name="value">The number.</param>
    /// <param name="minimum">The smallest allowed value.</param>
    /// <param name="maximum">The largest allowed value.</param>
    /// <param name="maximumMeaning">What the maximum is, for the message ("the number of observations minus one").</param>
    /// <param name="paramName">The argument's name.</param>
    /// <exception cref="ArgumentOutOfRangeException">The number is outside the range.</exception>
    public static void Between(int value, int minimum, int maximum, string maximumMeaning, [CallerArgumentExpression(nameof(value))] string paramName = "")
    {
        if (value < minimum || value > maximum)
        {
            throw OutOfRange(paramName, value, $"{paramName} must be between {minimum} and {maximumMeaning} ({maximum}), was {value}.");
        }
    }

    /// <summary>Checks that the element <paramref name="index"/> of a series is finite.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The element is NaN or infinite.</exception>
    public static void FiniteAt(double value, int index, string paramName)
    {
        if (!double.IsFinite(value))
        {
            throw OutOfRange(paramName, value, $"{paramName}[{index}] must be a finite number, was {value}.");
        }
    }

    /// <summary>Checks that the element <paramref name="index"/> of a series is finite and above zero.</summary>
    /// <param name="value">The element.</param>
    /// <param name="index">Its position in the series.</param>
    /// <param name="what">What the element is ("price", "volatility").</param>
    /// <param name="paramName">The series' argument name.</param>
    /// <param name="because">Why zero is not allowed, when it is not obvious; appended to the message.</param>
    /// <exception cref="ArgumentOutOfRangeException">The element is NaN, infinite, zero or negative.</exception>
    public static void PositiveAt(double value, int index, string what, string paramName, string? because = null)
    {
        if (!IsPositive(value))
        {
            var reason = because is null ? string.Empty : " " + because;
            throw OutOfRange(paramName, value, $"{paramName}[{index}] must be a finite {what} above zero{reason}, was {value}.");
        }
    }

    /// <summary>Checks that the element <paramref name="index"/> of a series is finite and zero or more.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The element is NaN, infinite or negative.</exception>
    public static void NonNegativeAt(double value, int index, string what, string paramName)
    {
        if (!double.IsFinite(value) || value < 0)
        {
            throw OutOfRange(paramName, value, $"{paramName}[{index}] must be a finite {what} of zero or more, was {value}.");
        }
    }

    /// <summary>Checks that a series is aligned with another one: the same number of elements.</summary>
    /// <param name="actual">The series' length.</param>
    /// <param name="expected">The length of the series it must be aligned with.</param>
    /// <param name="alignedWith">What it must be aligned with, for the message ("the dates", "realized").</param>
    /// <param name="paramName">The series' argument name.</param>
    /// <exception cref="ArgumentException">The lengths differ.</exception>
    public static void SameLength(int actual, int expected, string alignedWith, string paramName)
    {
        if (actual != expected)
        {
            throw new ArgumentException(Text(
                $"{paramName} must be aligned with {alignedWith} and have the same length ({expected}), was {actual}."), paramName);
        }
    }

    /// <summary>Checks that a series holds at least a minimum number of observations.</summary>
    /// <param name="count">The number of observations.</param>
    /// <param name="minimum">The fewest the computation needs.</param>
    /// <param name="purpose">What they are needed for, for the message ("for a Diebold-Mariano test").</param>
    /// <param name="paramName">The series' argument name.</param>
    /// <exception cref="ArgumentException">The series is too short.</exception>
    public static void CountAtLeast(int count, int minimum, string purpose, string paramName)
    {
        if (count < minimum)
        {
            throw new ArgumentException(Text(
                $"{paramName} must hold at least {minimum} observations {purpose}, was {count}."), paramName);
        }
    }

    /// <summary>Checks that a destination span has room for the values to be written.</summary>
    /// <exception cref="ArgumentException">The destination is too short.</exception>
    public static void Room(int destinationLength, int needed, string unit, string paramName)
    {
        if (destinationLength < needed)
        {
            throw new ArgumentException(Text(
                $"{paramName} must hold at least {needed} {unit}, had room for {destinationLength}."), paramName);
        }
    }

    private static ArgumentOutOfRangeException OutOfRange(string paramName, object value, FormattableString message) =>
        new(paramName, value, Text(message));

    private static string Text(FormattableString message) => message.ToString(CultureInfo.InvariantCulture);
}
