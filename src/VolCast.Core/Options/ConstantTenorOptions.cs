using System.Globalization;

namespace VolCast.Core.Options;

/// <summary>The settings of a constant-tenor implied-volatility series.</summary>
public sealed record ConstantTenorOptions
{
    /// <summary>Creates the settings.</summary>
    /// <param name="tenorDays">The tenor in calendar days, at least 1 (30 for a 30-day series).</param>
    /// <param name="extrapolation">What to do when the tenor lies outside the quoted expiries.</param>
    /// <exception cref="ArgumentOutOfRangeException">The tenor is below one day.</exception>
    public ConstantTenorOptions(int tenorDays, TenorExtrapolation extrapolation = TenorExtrapolation.Refuse)
    {
        Preconditions.AtLeast(tenorDays, 1, "calendar day");

        TenorDays = tenorDays;
        Extrapolation = extrapolation;
    }

    /// <summary>Gets the tenor in calendar days.</summary>
    public int TenorDays { get; }

    /// <summary>Gets the tenor in years, ACT/365.</summary>
    public double TenorYears => TenorDays / DayCount.DaysPerYear;

    /// <summary>Gets what to do when the tenor lies outside the quoted expiries.</summary>
    public TenorExtrapolation Extrapolation { get; }
}
