using System.Runtime.CompilerServices;

namespace VolCast.Core.Estimators;

/// <summary>
/// Prefix sums of one per-bar series held in double-double form (a high part and the accumulated rounding
/// error), so that the sum over any window is recovered in O(1) to about one rounding of the window sum
/// itself, however long the history.
/// </summary>
/// <remarks>
/// An add-and-subtract rolling sum drifts: every step leaves a rounding error behind, and over tens of
/// thousands of bars these add up. Here each addition is an error-free transformation (Knuth's TwoSum):
/// the rounding error of every step is kept in the low part, so the prefix sum P[i] = Σ x[j&lt;i] is
/// high[i] + low[i] to about 1e-32 relative. A window sum is (high difference) + (low difference); the high
/// difference is itself split exactly, so nothing accumulates.  Filled once by its owner while it is built, then only read.
/// </remarks>
internal sealed class PrefixSum
{
    private readonly double[] _highs;
    private readonly double[] _lows;

    /// <summary>Builds the prefix sums of <paramref name="terms"/> (or of their squares); element i covers terms[0 .. i − 1].</summary>
    /// <param name="terms">The per-bar series.</param>
    /// <param name="squares">True to sum x², each square's rounding error recovered exactly by a fused multiply-add.</param>
    public PrefixSum(ReadOnlySpan<double> terms, bool squares = false)
    {
        // Two arrays rather than interleaved pairs: each stays under the large-object threshold for a few
        // thousand bars, which keeps repeated builds out of generation-2 collections.
        // Every element is written below, so the arrays need not be zeroed first.
        var highs = GC.AllocateUninitializedArray<double>(terms.Length + 1);
        var lows = GC.AllocateUninitializedArray<double>(terms.Length + 1);
        highs[0] = 0;
        lows[0] = 0;
        double high = 0, low = 0;
        for (var i = 0; i < terms.Length; i++)
        {
            var x = terms[i];
            var extra = 0.0;
            if (squares)
            {
                var square = x * x;
                extra = Math.FusedMultiplyAdd(x, x, -square);
                x = square;
            }

            var sum = high + x;
            var virtualX = sum - high;
            low += (high - (sum - virtualX)) + (x - virtualX) + extra;
            high = sum;
            highs[i + 1] = sum;
            lows[i + 1] = low;
        }

        _highs = highs;
        _lows = lows;
    }

    /// <summary>Returns the sum of terms[end − length + 1 .. end] (both inclusive).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public double Window(int end, int length)
    {
        var stop = end + 1;
        var start = stop - length;
        return (_highs[stop] - _highs[start]) + (_lows[stop] - _lows[start]);
    }

    /// <summary>Returns the same window sum as a double-double (<paramref name="high"/> + <paramref name="low"/>).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public void Window(int end, int length, out double high, out double low)
    {
        var stop = end + 1;
        var start = stop - length;
        var a = _highs[stop];
        var b = -_highs[start];
        var sum = a + b;
        var virtualB = sum - a;
        var error = (a - (sum - virtualB)) + (b - virtualB) + (_lows[stop] - _lows[start]);
        high = sum + error;
        low = error - (high - sum);
    }
    /// <summary>
    /// Returns the sample variance (divisor n − 1) of a window from the prefix sums of x and x², with the
    /// cancellation in Σx² − (Σx)²/n done in double-double arithmetic.
    /// </summary>
    /// <remarks>
    /// In plain doubles that difference loses about log10(Σx² / Σ(x − x̄)²) digits: a window of nearly equal
    /// returns would be off in the tenth digit. When more than one bit would be lost it is carried in
    /// double-double, so the result is accurate to a few units in the last place of the variance itself either
    /// way. A window of identical values gives zero.
    /// </remarks>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static double SampleVariance(PrefixSum sum, PrefixSum sumOfSquares, int end, int length)
    {
        double n = length;

        // Fast path: when (Σx)²/n is at most half of Σx² (daily returns, whose mean is small beside their spread)
        // the subtraction loses at most one bit and plain doubles are accurate to a few units in the last place.
        var s1 = sum.Window(end, length);
        var s2 = sumOfSquares.Window(end, length);
        var meanPart = s1 * s1 / n;
        if (meanPart <= 0.5 * s2)
        {
            return (s2 - meanPart) / (n - 1);
        }

        sum.Window(end, length, out var s1High, out var s1Low);
        sumOfSquares.Window(end, length, out var s2High, out var s2Low);

        // (Σx)² as a double-double: exact product of the high parts (fused multiply-add) plus the cross term.
        var square = s1High * s1High;
        var squareLow = Math.FusedMultiplyAdd(s1High, s1High, -square) + (2 * s1High * s1Low);

        // (Σx)² / n as a double-double: the remainder of the division is exact with a fused multiply-add.
        var quotient = square / n;
        var quotientLow = (Math.FusedMultiplyAdd(-quotient, n, square) + squareLow) / n;

        // Σx² − (Σx)²/n.
        var b = -quotient;
        var difference = s2High + b;
        var virtualB = difference - s2High;
        var error = (s2High - (difference - virtualB)) + (b - virtualB) + (s2Low - quotientLow);
        var centred = difference + error;
        return Math.Max(0.0, centred / (n - 1));
    }
}
