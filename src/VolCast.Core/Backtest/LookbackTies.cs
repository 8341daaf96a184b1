using System.Collections.Immutable;
using VolCast.Core.Scoring;

namespace VolCast.Core.Backtest;

/// <summary>Computes <see cref="LookbackAnswer"/>: the in-sample best, the tie set and the walk-forward choice's stability of one family.</summary>
internal static class LookbackTies
{
    /// <summary>Answers "which lookback?" for one family.</summary>
    /// <param name="family">The family's name.</param>
    /// <param name="specs">The candidates' specs, in sweep order.</param>
    /// <param name="series">Each candidate's forecast at every row (aligned with <paramref name="realized"/>).</param>
    /// <param name="scored">The scored rows (target positive), ascending.</param>
    /// <param name="realized">The realized target at every row.</param>
    /// <param name="adaptive">The family's walk-forward choice, or null.</param>
    /// <param name="options">The confidence set's settings; the block length is raised to <paramref name="horizonDays"/> when shorter.</param>
    /// <param name="horizonDays">The longest realized window, the least block length.</param>
    /// <returns>The answer.</returns>
    public static LookbackAnswer Compute(
        string family,
        IReadOnlyList<string> specs,
        IReadOnlyList<double?[]> series,
        IReadOnlyList<int> scored,
        double?[] realized,
        AdaptiveSelection? adaptive,
        ModelConfidenceSetOptions options,
        int horizonDays)
    {
        var m = specs.Count;
        var common = new List<int>(scored.Count);
        foreach (var t in scored)
        {
            var all = true;
            for (var c = 0; c < m && all; c++)
            {
                all = Preconditions.IsPositive(series[c][t]);
            }

            if (all)
            {
                common.Add(t);
            }
        }

        var n = common.Count;
        var losses = new List<double[]>(m);
        string? best = null;
        var bestLoss = double.PositiveInfinity;
        for (var c = 0; c < m; c++)
        {
            var l = new double[n];
            var sum = 0.0;
            for (var i = 0; i < n; i++)
            {
                l[i] = Losses.Qlike(realized[common[i]]!.Value, series[c][common[i]]!.Value);
                sum += l[i];
            }

            losses.Add(l);
            if (n > 0 && sum / n < bestLoss)
            {
                bestLoss = sum / n;
                best = specs[c];
            }
        }

        var block = Math.Min(Math.Max(options.BlockLength, horizonDays), Math.Max(1, n));
        var tie = ImmutableArray<string>.Empty;
        var p = ImmutableArray<double>.Empty;
        string? note = null;
        if (m < 2)
        {
            note = "a single lookback: nothing to compare";
            tie = [.. specs];
        }
        else if (n < 2 * block || n < 10)
        {
            note = $"only {n} dates on which every lookback has a forecast, too few for a block bootstrap with blocks of {block}";
        }
        else
        {
            var set = ModelConfidenceSet.Compute(losses, new ModelConfidenceSetOptions(block, options.Seed, options.Alpha, options.BootstrapReplications, options.Statistic, options.Bootstrap));
            tie = [.. specs.Where((_, c) => set.InSet[c])];
            p = [.. set.PValues];
        }

        var (last, most, share, changes, withChoice) = Stability(adaptive);
        return new LookbackAnswer(family, [.. specs], n, best, last, tie, p, 1 - options.Alpha, block, most, share, changes, withChoice, note);
    }

    private static (string? Last, string? Most, double? Share, int Changes, int WithChoice) Stability(AdaptiveSelection? adaptive)
    {
        if (adaptive is null || adaptive.DatesWithChoice == 0)
        {
            return (null, null, null, adaptive?.ChangeCount ?? 0, 0);
        }

        var counts = new Dictionary<string, int>(StringComparer.Ordinal);
        string? last = null;
        foreach (var choice in adaptive.Choices)
        {
            if (choice is not null)
            {
                counts[choice] = counts.GetValueOrDefault(choice) + 1;
                last = choice;
            }
        }

        var top = counts.OrderByDescending(kv => kv.Value).ThenBy(kv => adaptive.Candidates.IndexOf(kv.Key)).First();
        return (last, top.Key, top.Value / (double)adaptive.DatesWithChoice, adaptive.ChangeCount, adaptive.DatesWithChoice);
    }
}
