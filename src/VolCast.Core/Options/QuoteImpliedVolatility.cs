namespace VolCast.Core.Options;

/// <summary>The implied volatility of one quote, solved on its expiry's forward.</summary>
/// <param name="Quote">The quote.</param>
/// <param name="Forward">The forward price used.</param>
/// <param name="Result">The solve's outcome.</param>
public readonly record struct QuoteImpliedVolatility(OptionQuote Quote, double Forward, ImpliedVolatilityResult Result);
