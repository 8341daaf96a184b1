using System.Globalization;

namespace VolCast.Core.Scoring;

/// <summary>
/// Domain checks for the scoring layer. Each message states the rule, the offending index and value, and
/// what was expected, formatted with the invariant culture.
/// </summary>
internal static class ScoringGuard
{
    /// <summary>Checks that two aligned series have the same length.</summary>
    /// <exception cref="ArgumentException">The lengths differ.</exception>
    public static void SameLength(int expected, int actual, string expectedName, string paramName)
    {
        if (expected != actual)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must be aligned with {expectedName} and have the same length ({expected}), was {actual}."), paramName);
        }
    }

    /// <summary>Checks that a series has at least a minimum number of observations.</summary>
    /// <exception cref="ArgumentException">The series is too short.</exception>
    public static void AtLeast(int count, int minimum, string paramName, string why)
    {
        if (count < minimum)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must hold at least {minimum} observations {why}, was {count}."), paramName);
        }
    }

    /// <summary>Checks that a forecast volatility is finite and strictly positive.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is NaN, infinite, zero or negative.</exception>
    public static void PositiveForecast(double value, string paramName, int index)
    {
        if (!double.IsFinite(value) || value <= 0)
        {
            throw new ArgumentOutOfRangeException(paramName, value, string.Create(CultureInfo.InvariantCulture,
                $"{paramName}[{index}] must be a finite volatility above zero, was {value}."));
        }
    }

    /// <summary>Checks that a realized volatility is finite and not negative (zero is allowed).</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is NaN, infinite or negative.</exception>
    public static void NonNegativeRealized(double value, string paramName, int index)
    {
        if (!double.IsFinite(value) || value < 0)
        {
            throw new ArgumentOutOfRangeException(paramName, value, string.Create(CultureInfo.InvariantCulture,
                $"{paramName}[{index}] must be a finite volatility of zero or more, was {value}."));
        }
    }

    /// <summary>Checks that a realized volatility is finite and strictly positive, as normalized QLIKE needs.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is NaN, infinite, zero or negative.</exception>
    public static void PositiveRealized(double value, string paramName, int index)
    {
        if (!double.IsFinite(value) || value <= 0)
        {
            throw new ArgumentOutOfRangeException(paramName, value, string.Create(CultureInfo.InvariantCulture,
                $"{paramName}[{index}] must be a finite volatility above zero for normalized QLIKE (ln(RV^2/F^2) is undefined at zero), was {value}; use the unnormalized form for differentials."));
        }
    }

    /// <summary>Checks that a series value is finite.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is NaN or infinite.</exception>
    public static void Finite(double value, string paramName, int index)
    {
        if (!double.IsFinite(value))
        {
            throw new ArgumentOutOfRangeException(paramName, value, string.Create(CultureInfo.InvariantCulture,
                $"{paramName}[{index}] must be a finite number, was {value}."));
        }
    }

    /// <summary>Checks that a HAC lag is zero or more and leaves observations to estimate with.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The lag is negative or not below the sample size.</exception>
    public static void Lag(int lag, int count, string paramName)
    {
        if (lag < 0 || lag >= count)
        {
            throw new ArgumentOutOfRangeException(paramName, lag, string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must be between 0 and the number of observations minus one ({count - 1}), was {lag}."));
        }
    }

    /// <summary>Checks that a horizon is at least one trading day.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The horizon is below one.</exception>
    public static void Horizon(int horizonDays, string paramName)
    {
        if (horizonDays < 1)
        {
            throw new ArgumentOutOfRangeException(paramName, horizonDays, string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must be at least 1 trading day, was {horizonDays}."));
        }
    }
}
