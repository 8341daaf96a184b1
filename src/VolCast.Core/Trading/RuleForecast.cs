namespace VolCast.Core.Trading;

/// <summary>A forecast series that drives a rule, aligned with the price history.</summary>
/// <param name="Spec">The forecaster's spec, for example close-to-close:21.</param>
/// <param name="Values">The annualized forecast (decimal) made at each date's close, null where there is none; one per close.</param>
internal sealed record RuleForecast(string Spec, IReadOnlyList<double?> Values);
