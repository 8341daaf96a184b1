namespace VolCast.Core.Trading;

/// <summary>The daily P&amp;L path summed over one calendar year, in vol points.</summary>
/// <param name="Year">The calendar year.</param>
/// <param name="Pnl">The sum of the year's daily P&amp;L.</param>
public sealed record YearPnl(int Year, double Pnl);
