using System.Globalization;

namespace VolCast.Reports.Model;

/// <summary>A named series of values on trading dates, oldest first; missing days are simply absent.</summary>
internal sealed record TimeSeries
{
    /// <summary>Creates a series, checking the dates increase and the values are finite.</summary>
    /// <param name="name">The label shown in legends, e.g. a forecaster's spec such as <c>ewma:0.94</c>.</param>
    /// <param name="dates">The dates, strictly increasing.</param>
    /// <param name="values">One finite value per date.</param>
    /// <exception cref="ArgumentException">The lengths differ, a date does not follow the one before, or a value is not finite.</exception>
    public TimeSeries(string name, IReadOnlyList<DateOnly> dates, IReadOnlyList<double> values)
    {
        ArgumentNullException.ThrowIfNull(name);
        ArgumentNullException.ThrowIfNull(dates);
        ArgumentNullException.ThrowIfNull(values);
        if (dates.Count != values.Count)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"series '{name}' has {dates.Count} dates but {values.Count} values; expected one value per date."), nameof(values));
        }

        for (var i = 0; i < dates.Count; i++)
        {
            if (i > 0 && dates[i] <= dates[i - 1])
            {
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"series '{name}': date {i} ({dates[i]:yyyy-MM-dd}) does not follow {dates[i - 1]:yyyy-MM-dd}; expected increasing dates."), nameof(dates));
            }

            if (!double.IsFinite(values[i]))
            {
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"series '{name}': value {i} ({dates[i]:yyyy-MM-dd}) must be finite, was {values[i]}."), nameof(values));
            }
        }

        Name = name;
        Dates = dates;
        Values = values;
    }

    /// <summary>The label shown in legends.</summary>
    public string Name { get; }

    /// <summary>The dates, strictly increasing.</summary>
    public IReadOnlyList<DateOnly> Dates { get; }

    /// <summary>One value per date.</summary>
    public IReadOnlyList<double> Values { get; }
}
