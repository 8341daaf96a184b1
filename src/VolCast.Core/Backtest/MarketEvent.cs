namespace VolCast.Core.Backtest;

/// <summary>A dated event whose forecast windows are scored apart (an earnings release, a central-bank meeting, the user's own).</summary>
/// <param name="Date">The event's date; a date that is not a trading day falls in the window whose span covers it.</param>
/// <param name="Kind">The user's label, or null.</param>
/// <param name="Scheduled">True when the date was known in advance; false when it was added after the fact (for example a crash day), which makes leaving it out hindsight.</param>
public sealed record MarketEvent(DateOnly Date, string? Kind, bool Scheduled);
