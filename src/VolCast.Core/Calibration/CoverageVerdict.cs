using System.Globalization;
using System.Text;
using VolCast.Core.Scoring;

namespace VolCast.Core.Calibration;

/// <summary>Plain-words verdicts on a forecaster's forecast move bands (±1σ, ±2σ), for the report.</summary>
/// <remarks>
/// <para>
/// The bands are called too wide (too narrow) when the Kupiec test of the |z| ≤ 1 range rejects at the chosen
/// significance and the share held is above (below) 68.27%; otherwise they are called consistent with the
/// forecast. "By about X%" is 1/√(mean z²) − 1 for too wide and √(mean z²) − 1 for too narrow: the change in width
/// that would have made mean z² equal to 1. When the tests could not be run the sentence says how many
/// non-overlapping dates there were and how many were needed.
/// </para>
/// <para>
/// A third of the realized volatility that followed (low, middle, high: hindsight) is named as too narrow (too wide) when the whole Wilson interval of its |z| ≤ 1 share lies below
/// (above) 68.27%.
/// </para>
/// </remarks>
public static class CoverageVerdict
{
    /// <summary>One sentence on a forecaster's ranges, with the regimes where they failed when given.</summary>
    /// <param name="coverage">The coverage result.</param>
    /// <param name="regimes">Regime rows from <see cref="CoverageRegimes.ByTerciles"/>, or null.</param>
    /// <param name="significance">Kupiec significance level, 0.05 by default.</param>
    /// <returns>For example "move bands from implied were too wide by about 25%: |z| ≤ 1 held 78% of the time against 68% expected (Kupiec p = 0.003, 238 non-overlapping dates)".</returns>
    /// <exception cref="ArgumentNullException"><paramref name="coverage"/> is null.</exception>
    public static string Describe(CoverageResult coverage, IReadOnlyList<RegimeCoverage>? regimes = null, double significance = 0.05)
    {
        ArgumentNullException.ThrowIfNull(coverage);
        Preconditions.Fraction(significance);
        var c = CultureInfo.InvariantCulture;
        var one = coverage.Levels[0];
        var text = new StringBuilder();
        text.Append(c, $"move bands from {coverage.Spec}");
        if (coverage.Count == 0 || one.ShareWithin is not { } share || coverage.ZScale is not { } scale)
        {
            text.Append(c, $" could not be checked: the forecaster had no value on any of the {coverage.MissingCount} dates");
            return text.ToString();
        }

        var held = string.Create(c, $"|z| ≤ 1 held {share * 100:0}% of the time against {one.NominalCoverage * 100:0}% expected");
        if (one.Status == CoverageTestStatus.NotEnoughData || one.Kupiec is null)
        {
            text.Append(c, $" could not be tested: {one.NonOverlappingCount} non-overlapping dates, {one.SamplesNeeded} needed ({held})");
        }
        else if (one.Kupiec.PValue < significance)
        {
            var wide = share > one.NominalCoverage;
            var by = wide ? (1 / scale) - 1 : scale - 1;
            text.Append(c, $" were too {(wide ? "wide" : "narrow")}");
            if (by > 0)
            {
                text.Append(c, $" by about {by * 100:0}% (the spread of z was {scale:0.00}, against 1 for calibrated bands)");
            }

            text.Append(c, $": {held} (Kupiec {PValueText.Clause(one.Kupiec.PValue)}, {one.NonOverlappingCount} non-overlapping dates)");
        }
        else
        {
            text.Append(c, $" held as forecast: {held} (Kupiec {PValueText.Clause(one.Kupiec.PValue)}, {one.NonOverlappingCount} non-overlapping dates)");
        }

        if (coverage.MissingCount > 0)
        {
            // Implied is quoted, not forecast: its missing dates are dates without a quote.
            var missing = coverage.Spec == Data.ImpliedSeries.Name ? "no implied quote" : "no forecast";
            text.Append(c, $"; {coverage.MissingCount} dates had {missing} and were not scored");
        }

        if (regimes is not null)
        {
            foreach (var regime in regimes)
            {
                if (regime.IntervalUpper < regime.NominalWithinOne)
                {
                    text.Append(c, $"; too narrow in the {Third(regime.Label)} third of realized volatility, known in hindsight (|z| ≤ 1 held {regime.ShareWithinOne * 100:0}%)");
                }
                else if (regime.IntervalLower > regime.NominalWithinOne)
                {
                    text.Append(c, $"; too wide in the {Third(regime.Label)} third of realized volatility, known in hindsight (|z| ≤ 1 held {regime.ShareWithinOne * 100:0}%)");
                }
            }
        }

        return text.ToString();
    }

    /// <summary>
    /// The plain name of a hindsight third (low, middle, high), so that it is not read as the volatility level known at
    /// the forecast date, which the report's table by level calls calm, middle and stressed.
    /// </summary>
    private static string Third(string label) => label switch
    {
        "calm" => "low",
        "stressed" => "high",
        _ => label,
    };
}
