namespace VolCast.Core.Estimators;

/// <summary>
/// Prefix sums of one per-bar series held in double-double form (a high part and the accumulated rounding
/// error), so that the sum over any window is recovered in O(1) to about one rounding of the window sum
/// itself, however long the history.
/// </summary>
/// <remarks>
/// An add-and-subtract rolling sum drifts: every step leaves a rounding error behind, and over tens of
/// thousands of bars these add up. Here each addition is an error-free transformation (Knuth's TwoSum):
/// the rounding error of every step is kept in <c>_low</c>, so the prefix sum P[i] = Σ x[j&lt;i] is
/// <c>_high[i] + _low[i]</c> to about 1e-32 relative. A window sum is (high difference) + (low difference);
/// the high difference of two close neighbours is exact or rounded once, so nothing accumulates.
/// </remarks>
internal sealed class PrefixSum
{
    private readonly double[] _high;
    private readonly double[] _low;

    /// <summary>Builds the prefix sums of <paramref name="terms"/>; element i covers terms[0 .. i − 1].</summary>
    public PrefixSum(ReadOnlySpan<double> terms)
        : this(terms, squared: false)
    {
    }

    private PrefixSum(ReadOnlySpan<double> values, bool squared)
    {
        _high = new double[values.Length + 1];
        _low = new double[values.Length + 1];
        double high = 0, low = 0;
        for (var i = 0; i < values.Length; i++)
        {
            var x = values[i];
            var extra = 0.0;
            if (squared)
            {
                // The rounding error of x² is recovered exactly by a fused multiply-add and kept with the rest.
                var square = x * x;
                extra = Math.FusedMultiplyAdd(x, x, -square);
                x = square;
            }

            var sum = high + x;
            var virtualX = sum - high;
            low += (high - (sum - virtualX)) + (x - virtualX) + extra;
            high = sum;
            _high[i + 1] = high;
            _low[i + 1] = low;
        }
    }

    /// <summary>Builds the prefix sums of the squares of <paramref name="values"/>, each square carried exactly.</summary>
    public static PrefixSum OfSquares(ReadOnlySpan<double> values) => new(values, squared: true);

    /// <summary>Returns the sum of terms[end − length + 1 .. end] (both inclusive).</summary>
    public double Window(int end, int length)
    {
        var stop = end + 1;
        var start = stop - length;
        return (_high[stop] - _high[start]) + (_low[stop] - _low[start]);
    }

    /// <summary>Returns the same window sum as a double-double (<paramref name="high"/> + <paramref name="low"/>).</summary>
    public void Window(int end, int length, out double high, out double low)
    {
        var stop = end + 1;
        var start = stop - length;
        var a = _high[stop];
        var b = -_high[start];
        var sum = a + b;
        var virtualB = sum - a;
        var error = (a - (sum - virtualB)) + (b - virtualB) + (_low[stop] - _low[start]);
        high = sum + error;
        low = error - (high - sum);
    }

    /// <summary>
    /// Returns the sample variance (divisor n − 1) of a window from the prefix sums of x and x², with the
    /// cancellation in Σx² − (Σx)²/n done in double-double arithmetic.
    /// </summary>
    /// <remarks>
    /// In plain doubles that difference loses about log10(Σx² / Σ(x − x̄)²) digits: a window of nearly equal
    /// returns after a turbulent period would be off in the tenth digit. Carried in double-double, the result is
    /// accurate to a few units in the last place of the variance itself. A window of identical values gives zero.
    /// </remarks>
    public static double SampleVariance(PrefixSum sum, PrefixSum sumOfSquares, int end, int length)
    {
        sum.Window(end, length, out var s1High, out var s1Low);
        sumOfSquares.Window(end, length, out var s2High, out var s2Low);
        double n = length;

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
