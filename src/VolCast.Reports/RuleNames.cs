using VolCast.Core.Trading;

namespace VolCast.Reports;

/// <summary>The rules' names as the report prints them.</summary>
internal static class RuleNames
{
    /// <summary>The rule's name in plain words.</summary>
    public static string Name(TradingRule rule) => rule switch
    {
        TradingRule.AlwaysSell => "always sell",
        TradingRule.Proposed => "proposed",
        TradingRule.Current => "current",
        TradingRule.Historical => "plain historical",
        _ => "walk-forward threshold",
    };
}
