using System.Collections.Immutable;
using VolCast.Core.Backtest;

namespace VolCast.IO.Results;

/// <summary>Reduces a backtest result to its summary row, so a batch can drop the result and keep memory flat.</summary>
public static class BatchRows
{
    /// <summary>Builds the row of an asset whose backtest finished.</summary>
    /// <param name="name">The asset's name.</param>
    /// <param name="result">The backtest result.</param>
    /// <returns>The row.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    public static BatchAssetRow FromResult(string name, BacktestResult result)
    {
        ArgumentNullException.ThrowIfNull(name);
        ArgumentNullException.ThrowIfNull(result);
        ForecasterMetrics? best = null;
        var tests = ImmutableArray.CreateBuilder<BatchForecasterTest>();
        var members = ImmutableArray.CreateBuilder<string>();
        foreach (var m in result.Metrics)
        {
            if (m.InMcs == true)
            {
                members.Add(m.Spec);
            }

            if (m.Kind == ForecastKind.Implied)
            {
                continue;
            }

            if (m.Losses is { } losses && double.IsFinite(losses.Qlike) && (best?.Losses is null || losses.Qlike < best.Losses.Qlike))
            {
                best = m;
            }

            if (m.VersusImplied?.Qlike is { Statistic: double stat, PValue: double p } && double.IsFinite(stat) && p >= 0 && p <= 1)
            {
                tests.Add(new BatchForecasterTest(m.Spec, stat, p));
            }
        }

        var lookbacks = ImmutableArray.CreateBuilder<BatchLookback>();
        foreach (var a in result.Adaptive)
        {
            if (a.DatesWithChoice == 0 || a.Candidates.IsEmpty)
            {
                continue;
            }

            var counts = new int[a.Candidates.Length];
            foreach (var choice in a.Choices)
            {
                var index = choice is null ? -1 : a.Candidates.IndexOf(choice);
                if (index >= 0)
                {
                    counts[index]++;
                }
            }

            var top = 0;
            for (var i = 1; i < counts.Length; i++)
            {
                if (counts[i] > counts[top])
                {
                    top = i;
                }
            }

            lookbacks.Add(new BatchLookback(a.Family, a.Candidates[top], (double)counts[top] / a.DatesWithChoice, a.ChangeCount));
        }

        double sum = 0;
        var n = 0;
        for (var i = 0; i < result.Dates.Length; i++)
        {
            if (result.Implied[i] is double iv && result.Realized[i] is double rv)
            {
                sum += iv - rv;
                n++;
            }
        }

        var bestDm = best?.VersusImplied?.Qlike;
        return new BatchAssetRow
        {
            Name = name,
            Succeeded = true,
            HasImplied = result.HasImplied,
            Dates = result.DataQuality.DatesWithTarget,
            BestQlike = best?.Spec,
            BestQlikeValue = best?.Losses?.Qlike,
            BestDmStatistic = bestDm?.Statistic,
            BestDmPValue = bestDm?.PValue,
            McsMembers = members.ToImmutable(),
            Lookbacks = lookbacks.ToImmutable(),
            MeanPremium = n == 0 ? null : sum / n,
            VersusImplied = tests.ToImmutable(),
        };
    }

    /// <summary>Builds the row of an asset that failed.</summary>
    /// <param name="name">The asset's name.</param>
    /// <param name="hasImplied">Whether an implied file was found for it.</param>
    /// <param name="error">What went wrong, as the user should read it.</param>
    /// <returns>The row.</returns>
    public static BatchAssetRow Failed(string name, bool hasImplied, string error) =>
        new() { Name = name, Succeeded = false, HasImplied = hasImplied, Error = error };
}
