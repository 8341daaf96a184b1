namespace VolCast.Core.Options;

/// <summary>What to do when the tenor falls before the first or after the last usable expiry of a date.</summary>
public enum TenorExtrapolation
{
    /// <summary>Give no value for that date and report why (the default).</summary>
    Refuse,

    /// <summary>Use the at-the-money volatility of the nearest expiry (flat volatility) and report the date as extrapolated.</summary>
    FlatVolatility,
}
