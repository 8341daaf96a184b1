namespace VolCast.Reports.Model;

/// <summary>The report's "Would the rule have paid?" section: the rules as delta-hedged straddle trades, or why they were not run.</summary>
/// <param name="Absence">Why the trading backtest was not run (shown instead of the section's contents), or null when it was.</param>
/// <param name="Points">Sentences in plain words: the tests that decide, the data-snooping result and the break-even half-spread.</param>
/// <param name="Tables">The tables, in the order to show them.</param>
/// <param name="Charts">The charts, in the order to show them.</param>
/// <param name="Settings">The settings and conventions the trades used.</param>
/// <param name="Cautions">The cautions shown beside the section.</param>
public sealed record PnlSection(
    string? Absence,
    IReadOnlyList<string> Points,
    IReadOnlyList<TextTable> Tables,
    IReadOnlyList<ChartImage> Charts,
    IReadOnlyList<Setting> Settings,
    IReadOnlyList<string> Cautions)
{
    /// <summary>A section that says only why the trading backtest was not run.</summary>
    /// <param name="reason">The reason, in plain words.</param>
    /// <returns>The section.</returns>
    public static PnlSection Absent(string reason) => new(reason, [], [], [], [], []);
}
