namespace VolCast.Core.Trading;

/// <summary>The lowest and highest value of one figure over a set of alternatives (the start offsets of one-at-a-time trades).</summary>
/// <param name="Low">The lowest value.</param>
/// <param name="High">The highest value.</param>
public sealed record FigureRange(double Low, double High)
{
    /// <summary>Widens a range to take in a value; an absent value leaves it as it is.</summary>
    /// <param name="range">The range so far, or null before the first value.</param>
    /// <param name="value">The value, or null when the figure is undefined for this alternative.</param>
    /// <returns>The widened range, or null while no value has been seen.</returns>
    public static FigureRange? Include(FigureRange? range, double? value)
    {
        if (value is not double v)
        {
            return range;
        }

        return range is null ? new FigureRange(v, v) : new FigureRange(Math.Min(range.Low, v), Math.Max(range.High, v));
    }
}
