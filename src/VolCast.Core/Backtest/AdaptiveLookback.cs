using VolCast.Core.Scoring;

namespace VolCast.Core.Backtest;

/// <summary>
/// The out-of-sample lookback choice of one family (see <see cref="AdaptiveSelection"/>): at each date, the candidate
/// with the lowest mean QLIKE over the closed forecast dates of the trailing selection window.
/// </summary>
internal static class AdaptiveLookback
{
    /// <summary>Chooses at every date 0 .. last.</summary>
    /// <param name="candidates">Each candidate's forecasts at dates 0 .. last (null where none).</param>
    /// <param name="windows">The realized windows of the history.</param>
    /// <param name="last">The last date index to choose for.</param>
    /// <param name="selectionWindow">W, the trailing selection window in trading days.</param>
    /// <param name="choice">Receives the chosen candidate's index at each date, or −1 before a choice is possible.</param>
    /// <returns>The adaptive forecast at each date.</returns>
    public static double?[] Choose(IReadOnlyList<double?[]> candidates, RealizedWindows windows, int last, int selectionWindow, int[] choice)
    {
        var m = candidates.Count;
        var forecasts = new double?[last + 1];
        var realized = windows.Realized;
        var close = windows.CloseIndex;

        // usable[s]: every candidate has a positive forecast at s and the target is positive, so all are compared on the same dates.
        var usable = new bool[last + 1];
        var loss = new double[(last + 1) * m];
        for (var s = 0; s <= last; s++)
        {
            if (realized[s] is not double rv || !(rv > 0))
            {
                continue;
            }

            var ok = true;
            for (var c = 0; c < m && ok; c++)
            {
                ok = Preconditions.IsPositive(candidates[c][s]);
            }

            if (!ok)
            {
                continue;
            }

            usable[s] = true;
            for (var c = 0; c < m; c++)
            {
                loss[(s * m) + c] = Losses.Qlike(rv, candidates[c][s]!.Value);
            }
        }

        var sums = new double[m];
        var added = new bool[last + 1];
        var count = 0;
        var addNext = 0;
        var removeNext = 0;
        for (var t = 0; t <= last; t++)
        {
            // Add the dates whose windows closed by t (close index ≤ t) and that are still inside (t − W, t].
            while (addNext <= t && close[addNext] <= t)
            {
                if (usable[addNext] && addNext > t - selectionWindow)
                {
                    added[addNext] = true;
                    count++;
                    for (var c = 0; c < m; c++)
                    {
                        sums[c] += loss[(addNext * m) + c];
                    }
                }

                addNext++;
            }

            // Drop the dates that left the window.
            while (removeNext <= t - selectionWindow)
            {
                if (added[removeNext])
                {
                    added[removeNext] = false;
                    count--;
                    for (var c = 0; c < m; c++)
                    {
                        sums[c] -= loss[(removeNext * m) + c];
                    }
                }

                removeNext++;
            }

            if (count == 0)
            {
                Array.Clear(sums);
                choice[t] = -1;
                continue;
            }

            // Equal counts for all candidates, so the lowest sum is the lowest mean; ties go to the first listed.
            var best = 0;
            for (var c = 1; c < m; c++)
            {
                if (sums[c] < sums[best])
                {
                    best = c;
                }
            }

            choice[t] = best;
            forecasts[t] = candidates[best][t];
        }

        return forecasts;
    }
}
