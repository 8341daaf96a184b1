using System.Globalization;

namespace VolCast.IO.Reading;

/// <summary>
/// Warns about values far outside their neighbours, which usually mean a corrupt cell or a change of unit rather
/// than a market move. The rule works on log changes d_t = ln(x_t / x_{t−1}) against a robust scale: the median of
/// |d| over the <see cref="ScaleWindow"/> changes before each block of <see cref="ScaleBlock"/> dates, divided by
/// 0.6745 so that it estimates the standard deviation of normal changes (the median absolute deviation around zero).
/// <list type="bullet">
/// <item>An isolated spike: |d_t| above <see cref="SpikeScales"/> scales and above ln 2 (a doubling or halving), and
/// the next change reverts at least half of it (opposite sign, |d_t + d_{t+1}| ≤ |d_t| / 2).</item>
/// <item>A change of scale: |d_t| ≥ ln 20 (a factor of twenty) that does not revert within <see cref="ScaleHold"/> dates.</item>
/// <item>For prices, any |d_t| above 1 (a close that multiplies or divides by e ≈ 2.7 in one day) is named as well.</item>
/// </list>
/// Findings are warnings only; at most <see cref="MaxListed"/> are listed per file, then one line counts the rest.
/// </summary>
internal static class JumpChecks
{
    /// <summary>How many earlier changes the robust scale uses.</summary>
    public const int ScaleWindow = 63;

    /// <summary>The scale is recomputed every this many dates (it moves slowly; this keeps the check linear).</summary>
    public const int ScaleBlock = 21;

    /// <summary>A spike is a change of more than this many robust scales.</summary>
    public const double SpikeScales = 10;

    /// <summary>A change of scale must hold for this many dates.</summary>
    public const int ScaleHold = 5;

    /// <summary>At most this many findings are listed per file.</summary>
    public const int MaxListed = 20;

    /// <summary>Warns about spikes, changes of scale and (for prices) log changes above 1 in a positive series sorted by date.</summary>
    /// <param name="dates">The dates.</param>
    /// <param name="values">The values, all above zero.</param>
    /// <param name="lines">Each value's physical line.</param>
    /// <param name="file">The file, for warnings.</param>
    /// <param name="what">What the values are, such as "close" or "implied volatility".</param>
    /// <param name="flagLargeChanges">Whether any |log change| above 1 is named (prices).</param>
    /// <param name="warnings">Receives the warnings.</param>
    /// <param name="suspects">Receives each finding as well, with the date of the row to drop for an isolated spike (the other findings name no single row), or null.</param>
    public static void Warn(ReadOnlySpan<DateOnly> dates, ReadOnlySpan<double> values, ReadOnlySpan<int> lines, string file, string what, bool flagLargeChanges, List<InputWarning> warnings, List<SuspectFinding>? suspects = null)
    {
        var n = values.Length;
        if (n < 3)
        {
            return;
        }

        var d = new double[n];
        for (var k = 1; k < n; k++)
        {
            d[k] = Math.Log(values[k] / values[k - 1]);
        }

        var found = 0;
        var window = new double[ScaleWindow];
        var scale = double.NaN;
        var nextScale = 1;
        var t = 1;
        while (t < n)
        {
            if (t >= nextScale)
            {
                scale = RobustScale(d, t, window);
                nextScale = t + ScaleBlock;
            }

            var c = CultureInfo.InvariantCulture;
            string? message = null;
            var droppable = false;
            var skip = 0;
            var abs = Math.Abs(d[t]);
            if (abs >= Math.Log(20) && Holds(d, t))
            {
                message = string.Create(c, $"the {what} changes scale here, from {ValueText.Number(values[t - 1])} on {ValueText.Date(dates[t - 1])} (line {lines[t - 1]}) to {ValueText.Number(values[t])} on {ValueText.Date(dates[t])}, a factor of {ValueText.Number(Math.Round(Math.Exp(abs), 1))}, and stays there; a change of unit (percent to decimal?) or of series in mid-file makes every later value wrong.");
                skip = ScaleHold;
            }
            else if (t + 1 < n && abs > Math.Log(2) && double.IsFinite(scale) && abs > SpikeScales * scale
                && Math.Sign(d[t + 1]) == -Math.Sign(d[t]) && Math.Abs(d[t] + d[t + 1]) <= abs / 2)
            {
                message = string.Create(c, $"the {what} {ValueText.Number(values[t])} on {ValueText.Date(dates[t])} is an isolated spike: {ValueText.Number(Math.Round(abs / scale, 0))} times the usual daily change (robust scale), reverting the next day to {ValueText.Number(values[t + 1])}; a bad print or corrupt cell distorts every measure that uses it.");
                droppable = true;
                skip = 1;
            }
            else if (flagLargeChanges && abs > 1)
            {
                message = string.Create(c, $"the {what} moves from {ValueText.Number(values[t - 1])} to {ValueText.Number(values[t])} in one step, a log return of {ValueText.Number(Math.Round(d[t], 3))} (above 1 in size); check the row for a bad print or an unadjusted split.");
            }

            if (message is not null)
            {
                found++;
                suspects?.Add(new SuspectFinding(file, lines[t], droppable ? dates[t] : null, message));
                if (found <= MaxListed)
                {
                    warnings.Add(new InputWarning(file, lines[t], message));
                }
            }

            t += 1 + skip;
        }

        if (found > MaxListed)
        {
            warnings.Add(new InputWarning(file, null, string.Create(CultureInfo.InvariantCulture,
                $"{found - MaxListed} more value(s) of the {what} far outside their neighbours were found and not listed ({found} in all).")));
        }
    }

    /// <summary>Whether a large change at t keeps its new level for the next <see cref="ScaleHold"/> dates (no return within a factor of 4).</summary>
    private static bool Holds(double[] d, int t)
    {
        var level = 0.0;
        var end = Math.Min(d.Length, t + 1 + ScaleHold);
        if (end - (t + 1) < 1)
        {
            return false;
        }

        for (var k = t + 1; k < end; k++)
        {
            level += d[k];
            if (Math.Abs(d[t] + level) < Math.Abs(d[t]) - Math.Log(4))
            {
                return false;
            }
        }

        return true;
    }

    /// <summary>The median |d| of up to <see cref="ScaleWindow"/> changes before t, over 0.6745; NaN with fewer than 10.</summary>
    private static double RobustScale(double[] d, int t, double[] window)
    {
        var start = Math.Max(1, t - ScaleWindow);
        var count = t - start;
        if (count < 10)
        {
            // Early in the file, look ahead instead, so the first weeks are checked too.
            start = 1;
            count = Math.Min(ScaleWindow, d.Length - 1);
            if (count < 10)
            {
                return double.NaN;
            }
        }

        for (var k = 0; k < count; k++)
        {
            window[k] = Math.Abs(d[start + k]);
        }

        var span = window.AsSpan(0, count);
        span.Sort();
        var median = count % 2 == 1 ? span[count / 2] : (span[(count / 2) - 1] + span[count / 2]) / 2;

        // A flat stretch has a zero median; a floor of one basis point keeps the rule from firing on every tick after it.
        return Math.Max(median / 0.6745, 1e-4);
    }
}
