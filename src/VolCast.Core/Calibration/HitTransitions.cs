namespace VolCast.Core.Calibration;

/// <summary>
/// Counts of a failure sequence's first-order transitions, n_ij = number of days in state i followed by a day in
/// state j (1 = failure), as Christoffersen's (1998) independence test needs.
/// </summary>
/// <param name="N00">No failure followed by no failure.</param>
/// <param name="N01">No failure followed by a failure.</param>
/// <param name="N10">A failure followed by no failure.</param>
/// <param name="N11">A failure followed by a failure.</param>
internal readonly record struct HitTransitions(int N00, int N01, int N10, int N11)
{
    /// <summary>The number of transitions counted.</summary>
    public int Total => N00 + N01 + N10 + N11;
}
