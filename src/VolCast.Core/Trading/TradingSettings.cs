using System.Collections.Immutable;
using System.Globalization;

namespace VolCast.Core.Trading;

/// <summary>The settings of the rule's trading backtest; every default is the documented convention.</summary>
/// <remarks>
/// Volatilities and thresholds are decimals (0.02 = two vol points); rate and dividend yield are continuous decimals per
/// year. When adjusted closes already hold the dividends, the dividend yield must stay 0 (the caller checks that).
/// </remarks>
public sealed record TradingSettings
{
    /// <summary>Gets the default threshold sweep: 0 to 5 vol points.</summary>
    public static ImmutableArray<double> DefaultSweep { get; } = [0, 0.005, 0.01, 0.02, 0.03, 0.04, 0.05];

    /// <summary>Gets the continuously compounded risk-free rate r (default 0).</summary>
    public double Rate { get; init; }

    /// <summary>Gets the continuous dividend yield q (default 0).</summary>
    public double DividendYield { get; init; }

    /// <summary>Gets the trading costs (default 0.25 vol points half-spread, 1 basis point per hedge trade).</summary>
    public TradeCosts Costs { get; init; } = TradeCosts.Default;

    /// <summary>Gets the volatility of the hedge deltas (default the entry implied volatility).</summary>
    public HedgeVolatility HedgeVolatility { get; init; } = HedgeVolatility.Implied;

    /// <summary>Gets which sides the forecast rules trade (default sell only).</summary>
    public RuleSides Sides { get; init; } = RuleSides.SellOnly;

    /// <summary>Gets which signals open the trades of the trade table (default one at a time, no overlap).</summary>
    public TradeEntries Entries { get; init; } = TradeEntries.OneAtATime;

    /// <summary>Gets when a trade is entered (default at the close of the firing date).</summary>
    public EntryTiming EntryTiming { get; init; } = EntryTiming.FiringClose;

    /// <summary>Gets the rule's threshold on implied − forecast, decimal (default 0.02 = two vol points).</summary>
    public double Threshold { get; init; } = 0.02;

    /// <summary>Gets the thresholds of the sweep (at least two distinct values; default 0 to 0.05).</summary>
    public ImmutableArray<double> SweepThresholds { get; init; } = DefaultSweep;

    /// <summary>Gets the trading days per year used to annualize daily P&amp;L (default 252).</summary>
    public double AnnualizationDays { get; init; } = 252;

    /// <summary>Gets the stress move of the spot (default −0.10 = −10%).</summary>
    public double StressSpotMove { get; init; } = StraddleTrader.DefaultStressSpotMove;

    /// <summary>Gets the stress shift of implied volatility (default +0.10 = +10 vol points).</summary>
    public double StressVolatilityShift { get; init; } = StraddleTrader.DefaultStressVolatilityShift;

    /// <summary>Checks every setting.</summary>
    /// <exception cref="ArgumentException">A setting is out of range; the message names it and the accepted range.</exception>
    public void Validate()
    {
        ArgumentNullException.ThrowIfNull(Costs);
        TradingGuard.Rate(Rate, nameof(Rate));
        TradingGuard.Rate(DividendYield, nameof(DividendYield));
        CheckThreshold(Threshold, nameof(Threshold));
        if (SweepThresholds.IsDefault || SweepThresholds.Length < 2)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"The threshold sweep needs at least two distinct thresholds to compare (and to test for data snooping), was {(SweepThresholds.IsDefault ? 0 : SweepThresholds.Length)}; for example [0, 0.01, 0.02]."), nameof(SweepThresholds));
        }

        for (var i = 0; i < SweepThresholds.Length; i++)
        {
            CheckThreshold(SweepThresholds[i], $"{nameof(SweepThresholds)}[{i}]");
            for (var j = 0; j < i; j++)
            {
                if (SweepThresholds[j] == SweepThresholds[i])
                {
                    throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                        $"The threshold sweep lists {SweepThresholds[i]} twice (positions {j} and {i}); give each threshold once."), nameof(SweepThresholds));
                }
            }
        }

        if (!double.IsFinite(AnnualizationDays) || AnnualizationDays < 1 || AnnualizationDays > 366)
        {
            throw new ArgumentOutOfRangeException(nameof(AnnualizationDays), AnnualizationDays, string.Create(CultureInfo.InvariantCulture,
                $"The trading days per year must be between 1 and 366 (usually 252), was {AnnualizationDays}."));
        }

        if (!double.IsFinite(StressSpotMove) || StressSpotMove <= -1 || StressSpotMove > 1)
        {
            throw new ArgumentOutOfRangeException(nameof(StressSpotMove), StressSpotMove, string.Create(CultureInfo.InvariantCulture,
                $"The stress move of the spot must be above -1 and at most 1 (-0.10 = -10%), was {StressSpotMove}."));
        }

        if (!double.IsFinite(StressVolatilityShift) || StressVolatilityShift < 0 || StressVolatilityShift > 1)
        {
            throw new ArgumentOutOfRangeException(nameof(StressVolatilityShift), StressVolatilityShift, string.Create(CultureInfo.InvariantCulture,
                $"The stress shift of implied volatility must be between 0 and 1 (0.10 = +10 vol points), was {StressVolatilityShift}."));
        }
    }

    private static void CheckThreshold(double value, string name)
    {
        if (!double.IsFinite(value) || value < 0 || value > 1)
        {
            throw new ArgumentOutOfRangeException(name, value, string.Create(CultureInfo.InvariantCulture,
                $"{name} must be a threshold between 0 and 1 in decimal volatility (0.02 = two vol points), was {value}."));
        }
    }
}
