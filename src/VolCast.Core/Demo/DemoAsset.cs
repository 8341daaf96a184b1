using VolCast.Core.Data;

namespace VolCast.Core.Demo;

/// <summary>One invented asset of the demo universe: its daily bars, its 30-day implied volatility and the model's own expected volatility.</summary>
/// <param name="Name">The invented name, also the file name stem (for example <c>aspen-hollow</c>).</param>
/// <param name="Parameters">How the asset was generated.</param>
/// <param name="Prices">Daily OHLC.</param>
/// <param name="Implied">The 30-calendar-day implied volatility, with some days missing.</param>
/// <param name="ExpectedVolatility">The model's expected average volatility over the next 30 calendar days, per price date.</param>
public sealed record DemoAsset(string Name, DemoAssetParameters Parameters, PriceHistory Prices, ImpliedSeries Implied, IReadOnlyList<double> ExpectedVolatility);
