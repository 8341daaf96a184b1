namespace VolCast.Reports.Model;

/// <summary>The report's "Do the odds hold?" section: the reliability diagram, the coverage table and the plain-words verdicts.</summary>
/// <param name="Reliability">The reliability diagram, or null when no forecaster had a probability to draw.</param>
/// <param name="Coverage">One row per forecaster: shares of |z| ≤ 1 and ≤ 2, the Kupiec and Christoffersen p-values and the tails.</param>
/// <param name="Verdicts">Sentences on how the ranges held, one per forecaster shown.</param>
/// <param name="Notes">How the numbers were computed: the probability model, the pooling, the non-overlapping sample.</param>
internal sealed record OddsSection(ChartImage? Reliability, MetricTable Coverage, IReadOnlyList<string> Verdicts, IReadOnlyList<string> Notes);
