using VolCast.Core.Options;

namespace VolCast.Core.Tests.Options;

public sealed class DayCountTests
{
    [Fact]
    public void YearsAct365_LeapYear_CountsCalendarDaysOver365()
    {
        // ACT/365 fixed (ISDA definitions [M]): 2024 has 366 days, so a full calendar year is 366/365.
        Assert.Equal(366 / 365.0, DayCount.YearsAct365(new DateOnly(2024, 1, 1), new DateOnly(2025, 1, 1)), 1e-15);
        Assert.Equal(1 / 365.0, DayCount.YearsAct365(new DateOnly(2024, 2, 28), new DateOnly(2024, 2, 29)), 1e-15);
    }

    [Fact]
    public void FormatTenor_Days_WritesSuffix()
    {
        Assert.Equal("30d", DayCount.FormatTenor(30));
    }
}
