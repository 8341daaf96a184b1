using System.Collections.Immutable;
using VolCast.Core.Scoring;

namespace VolCast.Core.Backtest;

/// <summary>The model confidence set over every forecaster and implied, on QLIKE.</summary>
/// <remarks>
/// Computed on the common dates where every member has a positive forecast and the realized target is positive,
/// so that all members are scored on the same dates, as the method requires. A forecaster without any forecast on
/// those dates would empty the common set, so members with no forecast on at least half the scorable dates are
/// left out and listed in <paramref name="Excluded"/>.
/// </remarks>
/// <param name="Members">Specs of the members, in the order of the result's arrays.</param>
/// <param name="Excluded">Specs left out because they had too few forecasts for a common sample.</param>
/// <param name="CommonDates">Number of common dates used.</param>
/// <param name="Result">The set (p-values, membership, elimination order); null when fewer than 2 members or 2 common dates.</param>
/// <param name="Note">Why there is no result, or null.</param>
public sealed record McsSummary(
    ImmutableArray<string> Members,
    ImmutableArray<string> Excluded,
    int CommonDates,
    ModelConfidenceSetResult? Result,
    string? Note);
