using System.Collections.Immutable;
using System.Globalization;
using VolCast.Core.Numerics;

namespace VolCast.Core.Calibration;

/// <summary>
/// Settings of the probability-calibration and range-coverage checks: strikes, drift, bins and the minimum sample
/// for the coverage tests.
/// </summary>
/// <remarks>
/// Time to the horizon is counted in trading days: τ = h / A years, with A the annualization factor (252 by
/// default), the same clock on which every forecaster's volatility is annualized. Calendar time would mix the two
/// clocks and shrink or stretch every forecast's range by the weekend share.
/// </remarks>
public sealed record CalibrationOptions
{
    /// <summary>The default strikes as fractions of the close at t: 0.90, 0.95, 1.00, 1.05, 1.10.</summary>
    public static readonly ImmutableArray<double> DefaultMoneyness = [0.90, 0.95, 1.00, 1.05, 1.10];

    /// <summary>Creates options with the defaults: five strikes, r = q = 0, A = 252, 10 bins, 20 samples for the tests.</summary>
    public CalibrationOptions()
    {
    }

    /// <summary>Strikes as fractions K / S_t of the close at t; each must be finite and above zero.</summary>
    public ImmutableArray<double> Moneyness { get; init; } = DefaultMoneyness;

    /// <summary>Continuously compounded risk-free rate r per year (decimal) used in d2; 0 by default.</summary>
    public double RiskFreeRate { get; init; }

    /// <summary>Continuous dividend yield q per year (decimal) used in d2; 0 by default.</summary>
    public double DividendYield { get; init; }

    /// <summary>Trading days per year A, used both to annualize volatility and for τ = h / A; 252 by default.</summary>
    public double AnnualizationFactor { get; init; } = 252.0;

    /// <summary>Number of equal-width predicted-probability bins on [0, 1] in the reliability table; 10 by default.</summary>
    public int BinCount { get; init; } = 10;

    /// <summary>
    /// The fewest non-overlapping dates (every h-th date with a forecast) for which the Kupiec and Christoffersen
    /// tests are computed; 20 by default. Below it the tests come back as not enough data, with this number.
    /// </summary>
    public int MinimumNonOverlappingSamples { get; init; } = 20;

    /// <summary>
    /// Predicted probabilities are clipped to [ε, 1 − ε] in the log score only (never in the Brier score or the
    /// table), so that a forecast of exactly 0 or 1 that misses gives a large finite penalty; ε = 1e-12 by default.
    /// </summary>
    public double LogScoreClip { get; init; } = 1e-12;

    /// <summary>Standard-normal quantile of the reliability-table intervals; <see cref="StandardNormal.Z95"/> (95%) by default.</summary>
    public double IntervalZ { get; init; } = StandardNormal.Z95;

    /// <summary>Checks every setting and throws with a message naming the first one that is out of range.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A setting is out of range.</exception>
    /// <exception cref="ArgumentException">The moneyness list is empty.</exception>
    public void Validate()
    {
        if (Moneyness.IsDefaultOrEmpty)
        {
            throw new ArgumentException("Moneyness must list at least one strike as a fraction of the close (for example 1.00).", nameof(Moneyness));
        }

        for (var i = 0; i < Moneyness.Length; i++)
        {
            var m = Moneyness[i];
            Preconditions.PositiveAt(m, i, "strike fraction (for example 0.95 for a strike 5% below the close)", nameof(Moneyness));
        }

        Preconditions.Finite(RiskFreeRate);
        Preconditions.Finite(DividendYield);
        Preconditions.Positive(AnnualizationFactor, "number of trading days per year (252 is usual)");

        Preconditions.AtLeast(BinCount, 1, "bin");

        Preconditions.AtLeast(MinimumNonOverlappingSamples, 2, "samples");

        if (!(LogScoreClip > 0 && LogScoreClip < 0.5))
        {
            throw new ArgumentOutOfRangeException(nameof(LogScoreClip), LogScoreClip, string.Create(CultureInfo.InvariantCulture,
                $"LogScoreClip must be in (0, 0.5) (1e-12 is the default), was {LogScoreClip}."));
        }

        Preconditions.Positive(IntervalZ, "normal quantile (1.96 for 95%)");
    }
}
