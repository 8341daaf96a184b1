namespace VolCast.Core.Trading.Snooping;

/// <summary>
/// Hansen's (2005) test for superior predictive ability: the studentized statistic and its three bootstrap p-values.
/// </summary>
/// <param name="Statistic">T^SPA = max(0, max_k √T·θ_k / ω̂_k), over the rules whose ω̂_k is not zero.</param>
/// <param name="Threshold">√(2 ln ln T) (0 when T ≤ e): a rule whose t-statistic is below minus this is taken as poor and keeps its own negative mean in the consistent p-value.</param>
/// <param name="Lower">p-value with every rule's null mean at min(θ_k, 0) (SPA_l: a lower bound).</param>
/// <param name="Consistent">The consistent p-value SPA_c: null mean θ_k for rules below the threshold, 0 for the rest.</param>
/// <param name="Upper">p-value with every null mean at 0, the least favourable configuration (SPA_u; equals the studentized Reality Check when <paramref name="Statistic"/> is above 0).</param>
public sealed record SpaPValues(double Statistic, double Threshold, double Lower, double Consistent, double Upper);
