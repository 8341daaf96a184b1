using System.Globalization;

namespace VolCast.Core.Data;

/// <summary>Daily log returns from closing prices.</summary>
/// <remarks>
/// The return of day t is r_t = ln(C_t / C_{t−1}), so a history of n closes has n − 1 returns and the
/// return at index i of the result belongs to price index i + 1.
/// </remarks>
public static class Returns
{
    /// <summary>Writes the log returns of <paramref name="close"/> into <paramref name="destination"/>.</summary>
    /// <param name="close">Closing prices, finite and above zero.</param>
    /// <param name="destination">Receives close.Length − 1 returns; must be at least that long.</param>
    /// <exception cref="ArgumentException">The destination is too short.</exception>
    public static void LogReturns(ReadOnlySpan<double> close, Span<double> destination)
    {
        var count = Math.Max(close.Length - 1, 0);
        Preconditions.Room(destination.Length, count, "returns", nameof(destination));

        for (var i = 0; i < count; i++)
        {
            destination[i] = Math.Log(close[i + 1] / close[i]);
        }
    }

    /// <summary>Returns the log returns of <paramref name="close"/> (one fewer than the closes; empty for fewer than two).</summary>
    /// <param name="close">Closing prices, finite and above zero.</param>
    /// <returns>A new array of close.Length − 1 log returns.</returns>
    public static double[] LogReturns(ReadOnlySpan<double> close)
    {
        var result = new double[Math.Max(close.Length - 1, 0)];
        LogReturns(close, result);
        return result;
    }
}
