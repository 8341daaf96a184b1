using System.Collections.Immutable;

namespace VolCast.Core.Scoring;

/// <summary>
/// The model confidence set: each model's MCS p-value and membership, in the order the loss series were given.
/// </summary>
/// <param name="Count">Number of dates T.</param>
/// <param name="PValues">Each model's MCS p-value: the largest elimination p-value up to and including its own elimination (1 for the last survivor).</param>
/// <param name="InSet">Whether each model is in the set: its MCS p-value is at least α.</param>
/// <param name="EliminationOrder">Model indices in the order they were eliminated; the last is the final survivor.</param>
/// <param name="EliminationPValues">The bootstrap p-value of the equivalence test at each elimination step (aligned with <paramref name="EliminationOrder"/>; 1 for the final survivor).</param>
/// <param name="Options">The settings used.</param>
public sealed record ModelConfidenceSetResult(
    int Count,
    ImmutableArray<double> PValues,
    ImmutableArray<bool> InSet,
    ImmutableArray<int> EliminationOrder,
    ImmutableArray<double> EliminationPValues,
    ModelConfidenceSetOptions Options);
