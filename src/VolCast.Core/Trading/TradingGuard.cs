using System.Globalization;

namespace VolCast.Core.Trading;

/// <summary>Argument checks of the trading layer; each message says what was wrong and what was expected.</summary>
internal static class TradingGuard
{
    /// <summary>The largest volatility accepted (500%), beyond which a value is a unit mistake (percent given as decimal).</summary>
    public const double MaximumVolatility = 5.0;

    /// <summary>Checks a volatility: finite, above zero, at most <see cref="MaximumVolatility"/>.</summary>
    public static void Volatility(double value, string paramName)
    {
        if (!double.IsFinite(value) || value <= 0 || value > MaximumVolatility)
        {
            throw new ArgumentOutOfRangeException(paramName, value, string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must be a volatility above 0 and at most {MaximumVolatility} (decimal: 0.20 = 20%), was {value}."));
        }
    }

    /// <summary>Checks a volatility at a date of an aligned series.</summary>
    public static void Volatility(double? value, string paramName, int index)
    {
        if (value is double v && (!double.IsFinite(v) || v <= 0 || v > MaximumVolatility))
        {
            throw new ArgumentOutOfRangeException(paramName, v, string.Create(CultureInfo.InvariantCulture,
                $"{paramName}[{index}] must be a volatility above 0 and at most {MaximumVolatility} (decimal: 0.20 = 20%), or absent, was {v}."));
        }
    }

    /// <summary>Checks a forecast at a date of an aligned series: finite, zero or above (flat prices forecast zero), at most <see cref="MaximumVolatility"/>.</summary>
    public static void Forecast(double? value, string paramName, int index)
    {
        if (value is double v && (!double.IsFinite(v) || v < 0 || v > MaximumVolatility))
        {
            throw new ArgumentOutOfRangeException(paramName, v, string.Create(CultureInfo.InvariantCulture,
                $"{paramName}[{index}] must be a forecast volatility between 0 and {MaximumVolatility} (decimal: 0.20 = 20%), or absent, was {v}."));
        }
    }

    /// <summary>Checks a continuous rate or yield: finite and between −1 and 1 (−100% to 100% a year).</summary>
    public static void Rate(double value, string paramName)
    {
        if (!double.IsFinite(value) || Math.Abs(value) > 1)
        {
            throw new ArgumentOutOfRangeException(paramName, value, string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must be a continuous decimal rate between -1 and 1 (0.05 = 5% a year), was {value}."));
        }
    }
}
