using System.Globalization;
using VolCast.Core.Scoring;
using VolCast.Core.Trading;

namespace VolCast.IO.Results;

/// <summary>The one-sentence answer of the rule's trading backtest, in plain words: the line summary.txt leads with.</summary>
public static class RulePnlAnswer
{
    /// <summary>The level at which the data-snooping p-value is read (5%).</summary>
    public const double Level = 0.05;

    /// <summary>Gets the cautions shown beside the rule's P&amp;L wherever it is shown.</summary>
    public static string Cautions { get; } =
        "Short options can lose far more than the premium received; the simulation ignores the smile, early assignment, margin and liquidity; past P&L does not predict future P&L; follow the rules of your firm and jurisdiction.";

    /// <summary>The answer: proposed against current per year after costs, the worst drawdown, the data-snooping verdict, the walk-forward threshold and the break-even half-spread.</summary>
    /// <param name="report">The rule's trading backtest.</param>
    /// <returns>One sentence.</returns>
    public static string Sentence(RulePnlReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        var c = CultureInfo.InvariantCulture;
        var r = report.AtClose;
        var versus = r.ProposedVersusCurrent;
        var proposed = r[TradingRule.Proposed];
        var walk = r[TradingRule.WalkForwardThreshold];
        var difference = versus.DifferencePerYear;
        var test = versus.Test.TStatistic is double t && versus.Test.PValue is double p
            ? string.Create(c, $"t = {t:F2}, {PValueText.Clause(p)}")
            : "no test: the two rules' paths do not differ";
        var spa = report.Means.Spa.Consistent;
        var bestPerYear = report.Means.Estimates[report.Means.BestRule] * r.Settings.AnnualizationDays;
        var search = bestPerYear <= 0
            ? string.Create(c, $"no rule searched beat always-sell: the best was {Math.Abs(bestPerYear):F2} vol points a year behind it (data-snooping test SPA {PValueText.Clause(spa)})")
            : string.Create(c, $"the best rule's edge over always-sell ({bestPerYear:F2} vol points a year) {(spa <= Level ? "survives" : "does not survive")} the data-snooping test (SPA {PValueText.Clause(spa)})");
        var breakEven = r.BreakEven.EdgeHalfSpreadVolPoints is double w
            ? string.Create(c, $"the proposed rule's edge over always-sell is zero at a half-spread of {w:F2} vol points ({r.Settings.Costs.OptionHalfSpreadVolPoints:F2} assumed)")
            : "no half-spread between zero and any width makes the proposed rule's edge over always-sell zero";
        var currentNote = report.CurrentRuleNote is string note ? " (" + note + ")" : string.Empty;
        var current = r[TradingRule.Current];
        return string.Create(c,
            $"Switching from the current rule{currentNote} to the proposed one would have earned {Math.Abs(difference):F2} vol points per year {(difference >= 0 ? "more" : "less")} ({test}) after costs; the proposed rule's worst drawdown was {proposed.PathNet.MaxDrawdown:F2} vol points (the current rule's {current.PathNet.MaxDrawdown:F2}); {search}; the walk-forward threshold earned {walk.PathNet.PnlPerYear:F2} vol points per year; {breakEven}.");
    }
}
