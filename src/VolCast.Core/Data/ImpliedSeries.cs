namespace VolCast.Core.Data;

/// <summary>
/// An implied-volatility history: one annualized implied volatility (decimal, 0.20 = 20%) per date,
/// sorted by date with no duplicates.
/// </summary>
public sealed class ImpliedSeries
{
    /// <summary>
    /// The name of the implied series wherever a series is named: the forecaster spec, the column and row of the
    /// result files, and the report's legends.
    /// </summary>
    public const string Name = "implied";

    private readonly DateOnly[] _dates;
    private readonly double[] _volatility;

    /// <summary>Creates an implied-volatility series.</summary>
    /// <param name="dates">Observation dates, strictly increasing.</param>
    /// <param name="volatility">Annualized implied volatility as a decimal, finite and above zero.</param>
    /// <exception cref="ArgumentException">The lengths differ, a value is not finite and positive,
    /// or the dates are not strictly increasing.</exception>
    public ImpliedSeries(ReadOnlySpan<DateOnly> dates, ReadOnlySpan<double> volatility)
    {
        Preconditions.SameLength(volatility.Length, dates.Length, "the dates", nameof(volatility));
        for (var i = 0; i < dates.Length; i++)
        {
            Preconditions.PositiveAt(volatility[i], i, "volatility", nameof(volatility));
            if (i > 0 && dates[i] <= dates[i - 1])
            {
                throw new ArgumentException(FormattableString.Invariant(
                    $"Dates must be strictly increasing: date {i} ({dates[i]:yyyy-MM-dd}) is not after date {i - 1} ({dates[i - 1]:yyyy-MM-dd})."),
                    nameof(dates));
            }
        }

        _dates = dates.ToArray();
        _volatility = volatility.ToArray();
    }

    /// <summary>Gets the number of observations.</summary>
    public int Count => _dates.Length;

    /// <summary>Gets the observation dates.</summary>
    public ReadOnlySpan<DateOnly> Dates => _dates;

    /// <summary>Gets the annualized implied volatilities (decimal).</summary>
    public ReadOnlySpan<double> Volatility => _volatility;
}
