using System.Globalization;

namespace VolCast.Core.Options;

/// <summary>Time to expiry in years.</summary>
public static class DayCount
{
    /// <summary>The number of days in a year under ACT/365.</summary>
    public const double DaysPerYear = 365.0;

    /// <summary>Years from <paramref name="from"/> to <paramref name="to"/> as calendar days / 365 (ACT/365 fixed).</summary>
    /// <param name="from">The quote date.</param>
    /// <param name="to">The expiry date.</param>
    /// <returns>The year fraction; zero or negative when <paramref name="to"/> is not after <paramref name="from"/>.</returns>
    /// <remarks>Expiry is taken at the same time of day as the quote (both dates whole days), so an option
    /// quoted the day before it expires has T = 1/365.</remarks>
    public static double YearsAct365(DateOnly from, DateOnly to) => (to.DayNumber - from.DayNumber) / DaysPerYear;

    /// <summary>Calendar days from <paramref name="from"/> to <paramref name="to"/>.</summary>
    /// <param name="from">The earlier date.</param>
    /// <param name="to">The later date.</param>
    /// <returns>The number of days, negative when <paramref name="to"/> is before <paramref name="from"/>.</returns>
    public static int CalendarDays(DateOnly from, DateOnly to) => to.DayNumber - from.DayNumber;

    /// <summary>Formats a number of calendar days as a tenor, for example 30d.</summary>
    /// <param name="days">The number of calendar days.</param>
    /// <returns>The tenor text.</returns>
    public static string FormatTenor(int days) => days.ToString(CultureInfo.InvariantCulture) + "d";
}
