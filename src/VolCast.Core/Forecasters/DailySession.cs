using System.Globalization;

namespace VolCast.Core.Forecasters;

/// <summary>
/// Base of the sessions: steps through every day from the last one handled to the one asked for, so that state
/// updates happen once per day in order whatever days the caller asks about.
/// </summary>
internal abstract class DailySession : IForecastSession
{
    private readonly int _dayCount;
    private int _lastDay = -1;

    /// <summary>Creates a session over <paramref name="dayCount"/> days.</summary>
    protected DailySession(int dayCount) => _dayCount = dayCount;

    /// <inheritdoc/>
    public ForecasterCounts Counts => new(RefitCount, FailedFitCount, NonStationaryFitCount, FallbackCount);

    /// <summary>Gets or sets the number of fits attempted.</summary>
    protected int RefitCount { get; set; }

    /// <summary>Gets or sets the number of fits rejected as failed.</summary>
    protected int FailedFitCount { get; set; }

    /// <summary>Gets or sets the number of fits rejected as not stationary.</summary>
    protected int NonStationaryFitCount { get; set; }

    /// <summary>Gets or sets the number of negative-variance fallbacks.</summary>
    protected int FallbackCount { get; set; }

    /// <inheritdoc/>
    public double? Forecast(int t)
    {
        if (t < 0 || t >= _dayCount || t <= _lastDay)
        {
            throw new ArgumentOutOfRangeException(nameof(t), t, string.Create(CultureInfo.InvariantCulture,
                $"t must be a day index after the previous call ({_lastDay}) and below the history length ({_dayCount}), was {t}."));
        }

        for (var day = _lastDay + 1; day <= t; day++)
        {
            Step(day);
        }

        _lastDay = t;
        return Current(t);
    }

    /// <summary>Takes in the data of <paramref name="day"/> (the day's close is now known).</summary>
    protected abstract void Step(int day);

    /// <summary>Returns the forecast at the close of <paramref name="day"/>, after <see cref="Step"/> has run for it.</summary>
    protected abstract double? Current(int day);
}
