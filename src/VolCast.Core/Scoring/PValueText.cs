using System.Globalization;

namespace VolCast.Core.Scoring;

/// <summary>
/// The one way a p-value is written for people (report, summary, console): three decimals, and "&lt; 0.001" below
/// 0.001, so a tiny p-value never reads as "0.000" and never as "= &lt; 0.001".
/// </summary>
public static class PValueText
{
    /// <summary>The smallest p-value written as a number; anything below is written "&lt; 0.001".</summary>
    public const double Floor = 0.001;

    /// <summary>The p-value alone, as a table cell shows it: "0.150" or "&lt; 0.001"; "-" when it is missing or not finite.</summary>
    /// <param name="p">The p-value, or null.</param>
    /// <returns>The text.</returns>
    public static string Value(double? p) => p switch
    {
        double v when !double.IsFinite(v) => "-",
        double v when v < Floor => "< 0.001",
        double v => v.ToString("0.000", CultureInfo.InvariantCulture),
        _ => "-",
    };

    /// <summary>The p-value in a sentence: "p = 0.150" or "p &lt; 0.001".</summary>
    /// <param name="p">The p-value.</param>
    /// <returns>The clause.</returns>
    public static string Clause(double p) => p < Floor ? "p < 0.001" : "p = " + Value(p);
}
