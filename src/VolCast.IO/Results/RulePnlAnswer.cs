using System.Globalization;
using VolCast.Core.Scoring;
using VolCast.Core.Trading;
using VolCast.Core.Trading.Snooping;

namespace VolCast.IO.Results;

/// <summary>The one-sentence answer of the rule's trading backtest, in plain words: the line summary.txt leads with.</summary>
public static class RulePnlAnswer
{
    /// <summary>The level at which the data-snooping p-value is read (5%).</summary>
    public const double Level = 0.05;

    /// <summary>Gets the cautions shown beside the rule's P&amp;L wherever it is shown.</summary>
    public static string Cautions { get; } =
        "Short options can lose far more than the premium received; the simulation ignores the smile, early assignment, margin and liquidity; past P&L does not predict future P&L; follow the rules of your firm and jurisdiction.";

    /// <summary>The answer: proposed against current per year after costs, both rules' worst drawdowns, the data-snooping verdict, the walk-forward threshold and the break-even half-spread; the report's verdict and summary.txt both say it in these words.</summary>
    /// <param name="report">The rule's trading backtest.</param>
    /// <returns>One sentence.</returns>
    public static string Sentence(RulePnlReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        var c = CultureInfo.InvariantCulture;
        var r = report.AtClose;
        var versus = r.ProposedVersusCurrent;
        var difference = versus.DifferencePerYear;
        var test = versus.Test.TStatistic is double t && versus.Test.PValue is double p
            ? string.Create(c, $"t = {t:0.00}, {PValueText.Clause(p)}")
            : "no test: the two rules' paths do not differ";
        var best = report.Means.BestRule;
        var bestLabel = report.Means.Rules == r.Sweep.Length ? Readable(r.Sweep[best]) : string.Create(c, $"rule {best + 1} of {report.Means.Rules}");
        var currentNote = report.CurrentRuleNote is string note ? " (" + note + ")" : string.Empty;
        return string.Create(c,
            $"Switching from the current rule{currentNote} to the proposed one would have earned {Math.Abs(difference):0.00} vol points per year {(difference >= 0 ? "more" : "less")} ({test}) after costs; the proposed rule's worst drawdown was {r[TradingRule.Proposed].PathNet.MaxDrawdown:0.00} vol points (the current rule's {r[TradingRule.Current].PathNet.MaxDrawdown:0.00}); {SearchWords(report.Means, bestLabel, r.Settings.AnnualizationDays)}; the walk-forward threshold earned {r[TradingRule.WalkForwardThreshold].PathNet.PnlPerYear:0.00} vol points per year; {BreakEvenWords(r.BreakEven, r.Settings.Costs.OptionHalfSpreadVolPoints)}.");
    }

    /// <summary>
    /// A sweep rule in words for a reader, such as "yang-zhang:21, sell only, threshold 1.0 vol points"; the files keep
    /// the compact key (<see cref="ThresholdSweepRow.Label"/>) that the data-snooping tests are indexed by.
    /// </summary>
    /// <param name="row">The sweep rule.</param>
    /// <returns>The rule in words.</returns>
    public static string Readable(ThresholdSweepRow row)
    {
        ArgumentNullException.ThrowIfNull(row);
        var sides = row.Sides == RuleSides.Both ? "sell and buy" : "sell only";
        return string.Create(CultureInfo.InvariantCulture, $"{row.ForecastSpec}, {sides}, threshold {row.Threshold * 100:0.0} vol points");
    }

    /// <summary>
    /// The data-snooping clause: when the best rule searched is behind always-sell there is no edge to survive, and the
    /// clause says so instead of calling a loss an edge.
    /// </summary>
    /// <param name="means">The test on mean daily net P&amp;L differences.</param>
    /// <param name="bestLabel">The best rule's label.</param>
    /// <param name="annualizationDays">Trading days per year.</param>
    /// <returns>The clause, without a final full stop.</returns>
    public static string SearchWords(DataSnoopingResult means, string bestLabel, double annualizationDays)
    {
        ArgumentNullException.ThrowIfNull(means);
        var c = CultureInfo.InvariantCulture;
        var perYear = means.Estimates[means.BestRule] * annualizationDays;
        var spa = PValueText.Clause(means.Spa.Consistent);
        if (perYear <= 0)
        {
            return string.Create(c, $"no rule searched beat always-sell: the best ({bestLabel}) was {Math.Abs(perYear):0.00} vol points a year behind it (data-snooping test SPA {spa})");
        }

        var survives = means.Spa.Consistent < Level ? "survives" : "does not survive";
        return string.Create(c, $"the best rule's edge over always-sell ({bestLabel}, {perYear:0.00} vol points a year) {survives} the data-snooping test (SPA {spa})");
    }

    /// <summary>The break-even clause: on which side of the break-even half-spread the proposed rule beats always-sell.</summary>
    /// <param name="breakEven">The break-even of the proposed rule against always-sell.</param>
    /// <param name="configured">The half-spread the run assumed, in vol points.</param>
    /// <returns>The clause, without a final full stop.</returns>
    public static string BreakEvenWords(BreakEvenSpread breakEven, double configured)
    {
        ArgumentNullException.ThrowIfNull(breakEven);
        var c = CultureInfo.InvariantCulture;
        if (breakEven.EdgeHalfSpreadVolPoints is not double w)
        {
            return breakEven.EdgePerYear > 0
                ? "the proposed rule's edge over always-sell does not vanish at any half-spread"
                : string.Create(c, $"the proposed rule has no edge over always-sell at any half-spread ({breakEven.EdgePerYear:0.00} vol points per year at {configured:0.00})");
        }

        // The edge is linear in the spread: it is positive on the side of the break-even where it grows.
        var side = breakEven.EdgeChangePerVolPoint > 0 ? "wider" : "narrower";
        return string.Create(c, $"the proposed rule beats always-sell only at a half-spread {side} than {w:0.00} vol points ({configured:0.00} assumed)");
    }
}
