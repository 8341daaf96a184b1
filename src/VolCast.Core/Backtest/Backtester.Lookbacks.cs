using System.Collections.Immutable;
using VolCast.Core.Forecasters;
using VolCast.Core.Scoring;

namespace VolCast.Core.Backtest;

/// <content>The "which lookback?" step of <see cref="Run"/>: per family, the in-sample best, the tie set and the walk-forward choice.</content>
public static partial class Backtester
{
    private static ImmutableArray<LookbackAnswer> LookbackAnswers(
        Frame frame,
        ScoredDateSet scored,
        List<(string Family, IVolatilityForecaster[] Candidates)> families,
        Dictionary<string, double?[]> series,
        List<(AdaptiveSelection Selection, double?[] Values)> adaptive,
        BacktestSettings settings,
        CancellationToken cancellationToken)
    {
        var answers = ImmutableArray.CreateBuilder<LookbackAnswer>(families.Count);
        var options = new ModelConfidenceSetOptions(
            Math.Max(settings.McsBlockLength ?? scored.MaximumWindow, scored.MaximumWindow), settings.McsSeed, settings.McsAlpha, settings.McsReplications);
        foreach (var (family, candidates) in families)
        {
            cancellationToken.ThrowIfCancellationRequested();
            var selection = adaptive.FirstOrDefault(a => a.Selection.Family == family).Selection;
            answers.Add(LookbackTies.Compute(
                family,
                [.. candidates.Select(c => c.Spec)],
                [.. candidates.Select(c => series[c.Spec])],
                scored.Dates,
                frame.Windows.Realized,
                selection,
                options,
                scored.MaximumWindow));
        }

        return answers.MoveToImmutable();
    }
}
