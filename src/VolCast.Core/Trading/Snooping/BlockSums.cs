using System.Buffers;
using System.Numerics;

namespace VolCast.Core.Trading.Snooping;

/// <summary>
/// Sums over resampled dates from time-major prefix sums: a block's sum for every column is one subtraction per
/// column, so a replication costs (number of blocks) × (columns) instead of T × (columns).
/// </summary>
internal static class BlockSums
{
    /// <summary>
    /// Rents a time-major prefix-sum table of (T + 1) × m entries, row 0 zero; fill it with <see cref="FillColumn"/>
    /// and return it to <see cref="ArrayPool{T}.Shared"/>.
    /// </summary>
    public static double[] RentPrefix(int days, int columns)
    {
        var prefix = ArrayPool<double>.Shared.Rent((days + 1) * columns);
        prefix.AsSpan(0, columns).Clear();
        return prefix;
    }

    /// <summary>Fills column j of the prefix table with the running sums of (values − shift), raised to the given power (1 or 2).</summary>
    public static void FillColumn(double[] prefix, int columns, int column, ReadOnlySpan<double> values, double shift, int power)
    {
        var running = 0.0;
        for (var t = 0; t < values.Length; t++)
        {
            var z = values[t] - shift;
            running += power == 2 ? z * z : z;
            prefix[((t + 1) * columns) + column] = running;
        }
    }

    /// <summary>Writes into <paramref name="sums"/> (m entries) each column's sum over the dates of replication b.</summary>
    public static void Replication(int[] starts, int[] lengths, int from, int to, int days, double[] prefix, int columns, Span<double> sums)
    {
        sums.Clear();
        for (var i = from; i < to; i++)
        {
            var start = starts[i];
            var length = lengths[i];
            if (start + length <= days)
            {
                AddSegment(prefix, columns, start, length, sums);
            }
            else
            {
                // The block wraps around the end of the sample.
                AddSegment(prefix, columns, start, days - start, sums);
                AddSegment(prefix, columns, 0, start + length - days, sums);
            }
        }
    }

    private static void AddSegment(double[] prefix, int columns, int start, int length, Span<double> sums)
    {
        var from = prefix.AsSpan(start * columns, columns);
        var to = prefix.AsSpan((start + length) * columns, columns);
        var i = 0;
        // Element-wise, so the vector width does not change the result.
        if (Vector.IsHardwareAccelerated)
        {
            var width = Vector<double>.Count;
            for (; i + width <= columns; i += width)
            {
                var s = new Vector<double>(sums.Slice(i, width)) + (new Vector<double>(to.Slice(i, width)) - new Vector<double>(from.Slice(i, width)));
                s.CopyTo(sums.Slice(i, width));
            }
        }

        for (; i < columns; i++)
        {
            sums[i] += to[i] - from[i];
        }
    }
}
