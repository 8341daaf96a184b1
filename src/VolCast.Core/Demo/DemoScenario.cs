using VolCast.Core.Data;

namespace VolCast.Core.Demo;

/// <summary>
/// The invented demo scenario: the daily history of an invented index (Alder Ridge Composite) with its
/// 30-calendar-day implied volatility, and a close-only history of a second invented asset.
/// </summary>
/// <param name="Index">Daily OHLC of the invented index.</param>
/// <param name="Implied">The index's 30-calendar-day implied volatility, with some days missing.</param>
/// <param name="ExpectedVolatility">The model's own expected average volatility over the next 30 calendar days, per index date (what implied is built on, before premium and noise).</param>
/// <param name="SecondAsset">Close-only history of a second invented asset on the same calendar.</param>
public sealed record DemoScenario(
    PriceHistory Index,
    ImpliedSeries Implied,
    IReadOnlyList<double> ExpectedVolatility,
    PriceHistory SecondAsset);
