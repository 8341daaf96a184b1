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
    {
        _high = new double[terms.Length + 1];
        _low = new double[terms.Length + 1];
        double high = 0, low = 0;
        for (var i = 0; i < terms.Length; i++)
        {
            var x = terms[i];
            var sum = high + x;
            var virtualX = sum - high;
            low += (high - (sum - virtualX)) + (x - virtualX);
            high = sum;
            _high[i + 1] = high;
            _low[i + 1] = low;
        }
    }

    /// <summary>Returns the sum of terms[end − length + 1 .. end] (both inclusive).</summary>
    public double Window(int end, int length)
    {
        var stop = end + 1;
        var start = stop - length;
        return (_high[stop] - _high[start]) + (_low[stop] - _low[start]);
    }
}
