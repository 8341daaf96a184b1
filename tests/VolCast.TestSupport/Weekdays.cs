namespace VolCast.TestSupport;

/// <summary>A trading calendar of every Monday to Friday, with no holidays: the calendar of invented test histories.</summary>
public static class Weekdays
{
    /// <summary>The first Monday-to-Friday date after <paramref name="date"/>.</summary>
    public static DateOnly After(DateOnly date)
    {
        var next = date.AddDays(1);
        while (IsWeekend(next))
        {
            next = next.AddDays(1);
        }

        return next;
    }

    /// <summary><paramref name="count"/> consecutive weekdays, the first on or after <paramref name="first"/>.</summary>
    public static DateOnly[] From(DateOnly first, int count)
    {
        var dates = new DateOnly[count];
        var date = IsWeekend(first) ? After(first) : first;
        for (var i = 0; i < count; i++)
        {
            dates[i] = date;
            date = After(date);
        }

        return dates;
    }

    /// <summary>Every weekday from <paramref name="first"/> to <paramref name="last"/>, both included.</summary>
    public static IEnumerable<DateOnly> Between(DateOnly first, DateOnly last)
    {
        for (var date = IsWeekend(first) ? After(first) : first; date <= last; date = After(date))
        {
            yield return date;
        }
    }

    private static bool IsWeekend(DateOnly date) => date.DayOfWeek is DayOfWeek.Saturday or DayOfWeek.Sunday;
}
