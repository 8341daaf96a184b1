namespace VolCast.Core.Trading;

/// <summary>Where the option half-spread stops the proposed rule paying, from the ladders' P&amp;L per year (linear in the spread).</summary>
/// <remarks>
/// Each trade pays the half-spread in vol points (carried at r), so a rule's P&amp;L per year falls by its trades per
/// year (÷ h in the ladder) for each vol point of spread. The proposed rule trades on a subset of the dates the
/// always-sell rule trades on, so a wider spread costs always-sell more: the edge vanishes as the spread narrows, and
/// <see cref="EdgeHalfSpreadVolPoints"/> is the half-spread below which the edge is gone.
/// </remarks>
/// <param name="EdgePerYear">Proposed − always-sell net P&amp;L per year at the configured half-spread, vol points.</param>
/// <param name="EdgeChangePerVolPoint">Change of that edge per vol point of half-spread.</param>
/// <param name="EdgeHalfSpreadVolPoints">The half-spread at which the edge is zero; null when it would be negative (the edge survives every spread) or the edge does not depend on the spread.</param>
/// <param name="ProposedHalfSpreadVolPoints">The half-spread at which the proposed rule's own net P&amp;L is zero; null when negative or the rule never trades.</param>
public sealed record BreakEvenSpread(double EdgePerYear, double EdgeChangePerVolPoint, double? EdgeHalfSpreadVolPoints, double? ProposedHalfSpreadVolPoints);
