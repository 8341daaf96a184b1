namespace VolCast.Core.Data;

/// <summary>
/// A daily price history held as parallel columns (struct of arrays), sorted by date with no duplicates.
/// </summary>
/// <remarks>
/// Prices are as they are to be used: when the source carried an adjusted close, the loader has already
/// scaled open, high, low and close by adj_close / close on each row. A close-only history has no
/// open, high or low columns (<see cref="HasRange"/> is false); range-based estimators refuse it.
/// Instances are immutable: the arrays are copied on construction and exposed as read-only spans.
/// </remarks>
public sealed class PriceHistory
{
    private readonly DateOnly[] _dates;
    private readonly double[] _close;
    private readonly double[]? _open;
    private readonly double[]? _high;
    private readonly double[]? _low;

    private PriceHistory(DateOnly[] dates, double[]? open, double[]? high, double[]? low, double[] close)
    {
        _dates = dates;
        _open = open;
        _high = high;
        _low = low;
        _close = close;
    }

    /// <summary>Creates a history with open, high, low and close columns.</summary>
    /// <param name="dates">Trading dates, strictly increasing.</param>
    /// <param name="open">Opening prices, finite and positive.</param>
    /// <param name="high">Daily highs, at least max(open, close).</param>
    /// <param name="low">Daily lows, at most min(open, close).</param>
    /// <param name="close">Closing prices, finite and positive.</param>
    /// <exception cref="ArgumentException">The columns differ in length, a price is not finite and positive,
    /// a bar is inconsistent, or the dates are not strictly increasing.</exception>
    public static PriceHistory FromBars(
        ReadOnlySpan<DateOnly> dates,
        ReadOnlySpan<double> open,
        ReadOnlySpan<double> high,
        ReadOnlySpan<double> low,
        ReadOnlySpan<double> close)
    {
        Preconditions.SameLength(open.Length, dates.Length, "the dates", nameof(open));
        Preconditions.SameLength(high.Length, dates.Length, "the dates", nameof(high));
        Preconditions.SameLength(low.Length, dates.Length, "the dates", nameof(low));
        Preconditions.SameLength(close.Length, dates.Length, "the dates", nameof(close));
        CheckDates(dates);
        for (var i = 0; i < dates.Length; i++)
        {
            Preconditions.PositiveAt(open[i], i, "price", nameof(open));
            Preconditions.PositiveAt(high[i], i, "price", nameof(high));
            Preconditions.PositiveAt(low[i], i, "price", nameof(low));
            Preconditions.PositiveAt(close[i], i, "price", nameof(close));
            if (low[i] > Math.Min(open[i], close[i]) || high[i] < Math.Max(open[i], close[i]))
            {
                throw new ArgumentException(FormattableString.Invariant(
                    $"Bar {i} ({dates[i]:yyyy-MM-dd}) is inconsistent: expected low <= min(open, close) and high >= max(open, close), was O={open[i]} H={high[i]} L={low[i]} C={close[i]}."));
            }
        }

        return new PriceHistory(dates.ToArray(), open.ToArray(), high.ToArray(), low.ToArray(), close.ToArray());
    }

    /// <summary>Creates a close-only history.</summary>
    /// <param name="dates">Trading dates, strictly increasing.</param>
    /// <param name="close">Closing prices, finite and positive.</param>
    /// <exception cref="ArgumentException">The columns differ in length, a price is not finite and positive,
    /// or the dates are not strictly increasing.</exception>
    public static PriceHistory FromCloses(ReadOnlySpan<DateOnly> dates, ReadOnlySpan<double> close)
    {
        Preconditions.SameLength(close.Length, dates.Length, "the dates", nameof(close));
        CheckDates(dates);
        for (var i = 0; i < dates.Length; i++)
        {
            Preconditions.PositiveAt(close[i], i, "price", nameof(close));
        }

        return new PriceHistory(dates.ToArray(), null, null, null, close.ToArray());
    }

    /// <summary>Gets the number of trading days.</summary>
    public int Count => _dates.Length;

    /// <summary>Gets a value indicating whether open, high and low are present.</summary>
    public bool HasRange => _open is not null;

    /// <summary>Gets the trading dates, strictly increasing.</summary>
    public ReadOnlySpan<DateOnly> Dates => _dates;

    /// <summary>Gets the closing prices.</summary>
    public ReadOnlySpan<double> Close => _close;

    /// <summary>Gets the opening prices.</summary>
    /// <exception cref="InvalidOperationException">The history is close-only.</exception>
    public ReadOnlySpan<double> Open => _open ?? throw MissingRange();

    /// <summary>Gets the daily highs.</summary>
    /// <exception cref="InvalidOperationException">The history is close-only.</exception>
    public ReadOnlySpan<double> High => _high ?? throw MissingRange();

    /// <summary>Gets the daily lows.</summary>
    /// <exception cref="InvalidOperationException">The history is close-only.</exception>
    public ReadOnlySpan<double> Low => _low ?? throw MissingRange();

    /// <summary>Returns the history of the first <paramref name="count"/> days, as it stood at the close of day count − 1.</summary>
    /// <param name="count">How many days to keep, from 0 to <see cref="Count"/>.</param>
    /// <returns>A history that shares no storage with this one.</returns>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="count"/> is negative or above <see cref="Count"/>.</exception>
    public PriceHistory Take(int count)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(count, Count);
        return new PriceHistory(
            _dates[..count],
            _open?[..count],
            _high?[..count],
            _low?[..count],
            _close[..count]);
    }

    private static InvalidOperationException MissingRange() =>
        new("This price history has closes only; open, high and low columns are needed for range-based estimators.");

    private static void CheckDates(ReadOnlySpan<DateOnly> dates)
    {
        for (var i = 1; i < dates.Length; i++)
        {
            if (dates[i] <= dates[i - 1])
            {
                throw new ArgumentException(FormattableString.Invariant(
                    $"Dates must be strictly increasing: date {i} ({dates[i]:yyyy-MM-dd}) is not after date {i - 1} ({dates[i - 1]:yyyy-MM-dd})."),
                    nameof(dates));
            }
        }
    }
}
