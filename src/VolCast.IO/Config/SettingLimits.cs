using VolCast.Core.Backtest;

namespace VolCast.IO.Config;

/// <summary>
/// The one list of accepted ranges for every numeric setting, checked before any data is loaded. The command-line help
/// and the README's configuration section show the same ranges. The bounds are wide enough for any daily or intraday
/// use and small enough that no count overflows and no buffer outgrows memory.
/// </summary>
public static class SettingLimits
{
    /// <summary>Gets the horizon in trading days (<c>horizon</c>, <c>--horizon</c>): up to ten years of trading days.</summary>
    public static SettingRange Horizon { get; } = new("horizon", 1, 2520, "trading days");

    /// <summary>Gets the tenor in calendar days (<c>tenor</c>, <c>--tenor</c>): up to ten years, so a window never runs past the last calendar date.</summary>
    public static SettingRange TenorDays { get; } = new("tenor", 1, 3650, "calendar days");

    /// <summary>Gets a rolling window in trading days (<c>sweepLookbacks</c>, <c>estimate --window</c>).</summary>
    public static SettingRange Window { get; } = new("sweepLookbacks", 2, 2520, "trading days");

    /// <summary>Gets the adaptive selection window in trading days (<c>selectionWindowDays</c>).</summary>
    public static SettingRange SelectionWindowDays { get; } = new("selectionWindowDays", 1, 25200, "trading days");

    /// <summary>Gets the bootstrap replications of the model confidence set (<c>mcs.replications</c>).</summary>
    public static SettingRange McsReplications { get; } = new("mcs.replications", 10, 100_000, string.Empty);

    /// <summary>Gets the bootstrap block length (<c>mcs.blockLength</c>).</summary>
    public static SettingRange McsBlockLength { get; } = new("mcs.blockLength", 1, 2520, "dates");

    /// <summary>Gets the rule-test threshold in volatility points as a decimal (<c>ruleThreshold</c>; 0.02 = 2 points).</summary>
    public static SettingRange RuleThreshold { get; } = new("ruleThreshold", 0, 5, "(decimal volatility)");

    /// <summary>Gets the bars per year used to annualize (<c>annualizationFactor</c>, <c>--annualization</c>): from yearly bars to one-second bars.</summary>
    public static SettingRange AnnualizationFactor { get; } = new("annualizationFactor", 1, 10_000_000, "bars a year");

    /// <summary>Gets the option half-spread of the rule's trades in volatility points (<c>costs.optionHalfSpreadVolPoints</c>).</summary>
    public static SettingRange OptionHalfSpread { get; } = new("costs.optionHalfSpreadVolPoints", 0, VolCast.Core.Trading.TradeCosts.MaximumHalfSpreadVolPoints, "vol points");

    /// <summary>Gets the cost of a hedge trade in basis points of its notional (<c>costs.hedgeCostBps</c>).</summary>
    public static SettingRange HedgeCost { get; } = new("costs.hedgeCostBps", 0, VolCast.Core.Trading.TradeCosts.MaximumHedgeCostBps, "basis points");

    /// <summary>Gets the continuous risk-free rate of the option pricing (<c>rate</c>; 0.05 = 5% a year).</summary>
    public static SettingRange Rate { get; } = new("rate", -1, 1, "(continuous decimal a year)");

    /// <summary>Gets the continuous dividend yield of the option pricing (<c>dividendYield</c>).</summary>
    public static SettingRange DividendYield { get; } = new("dividendYield", -1, 1, "(continuous decimal a year)");

    /// <summary>Gets each threshold of the rule's threshold sweep (<c>ruleThresholds</c>; 0.02 = 2 points).</summary>
    public static SettingRange RuleThresholds { get; } = new("ruleThresholds", 0, 1, "(decimal volatility)");

    /// <summary>Gets the bootstrap replications of the data-snooping tests (<c>snooping.replications</c>).</summary>
    public static SettingRange SnoopingReplications { get; } = new("snooping.replications", 10, 100_000, string.Empty);

    /// <summary>Gets the mean block length of the data-snooping bootstrap (<c>snooping.blockLength</c>).</summary>
    public static SettingRange SnoopingBlockLength { get; } = new("snooping.blockLength", 1, 2520, "dates");

    /// <summary>Gets how many names a batch runs at once (<c>batch --jobs</c>).</summary>
    public static SettingRange Jobs { get; } = new("--jobs", 1, 256, string.Empty);

    /// <summary>Gets every range, for the help text and the README.</summary>
    public static IReadOnlyList<SettingRange> All { get; } =
        [
            Horizon, TenorDays, Window, SelectionWindowDays, McsReplications, McsBlockLength, RuleThreshold, AnnualizationFactor,
            OptionHalfSpread, HedgeCost, Rate, DividendYield, RuleThresholds, SnoopingReplications, SnoopingBlockLength, Jobs,
        ];

    /// <summary>
    /// Reads a calendar tenor written as whole days followed by d (<c>30d</c>, any capitals, spaces around allowed) and
    /// checks it against <see cref="TenorDays"/>: any run of digits is a tenor, and one out of range (however many digits
    /// it has) is refused with the range and the text as written, like every other setting.
    /// </summary>
    /// <param name="text">The tenor as the user wrote it.</param>
    /// <param name="shownAs">How the setting is named in the message (<c>tenor</c>, <c>impliedTenor</c>, <c>--tenor</c>).</param>
    /// <param name="source">The configuration file, or null for the command line.</param>
    /// <returns>The tenor in calendar days, or null when the text is not digits followed by d (the caller says what was expected).</returns>
    /// <exception cref="SettingRangeException">The tenor is outside <see cref="TenorDays"/>.</exception>
    public static int? TenorDaysOf(string text, string shownAs, string? source = null)
    {
        ArgumentNullException.ThrowIfNull(text);
        var t = text.Trim().ToLowerInvariant();
        if (t.Length < 2 || !t.EndsWith('d') || !t[..^1].All(char.IsAsciiDigit))
        {
            return null;
        }

        // A run of digits too long for a number reads as infinity, which is simply out of range.
        var days = double.Parse(t[..^1], System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture);
        TenorDays.Check(days, shownAs, source, text.Trim());
        return (int)days;
    }

    /// <summary>The ranges of the configuration's numeric settings in one line, for --help.</summary>
    /// <returns>The text.</returns>
    public static string HelpText() =>
        "Ranges: " + string.Join("; ", All.Where(r => !r.Name.StartsWith('-')).Select(r => r.Name + " " + r)) + ".";

    /// <summary>Checks every numeric setting of a configuration against its range.</summary>
    /// <param name="settings">The settings read from the file.</param>
    /// <param name="file">The configuration file, named in the message.</param>
    /// <exception cref="SettingRangeException">A setting is out of range.</exception>
    public static void Check(BacktestSettings settings, string file)
    {
        ArgumentNullException.ThrowIfNull(settings);
        if (settings.Horizon.TradingDays is int h)
        {
            Horizon.Check(h, Horizon.Name, file);
        }

        if (settings.Horizon.TenorCalendarDays is int d)
        {
            TenorDays.Check(d, TenorDays.Name, file);
        }

        foreach (var lookback in settings.SweepLookbacks)
        {
            Window.Check(lookback, Window.Name, file);
        }

        SelectionWindowDays.Check(settings.SelectionWindowDays, SelectionWindowDays.Name, file);
        McsReplications.Check(settings.McsReplications, McsReplications.Name, file);
        if (settings.McsBlockLength is int block)
        {
            McsBlockLength.Check(block, McsBlockLength.Name, file);
        }

        RuleThreshold.Check(settings.RuleThreshold, RuleThreshold.Name, file);
        AnnualizationFactor.Check(settings.AnnualizationFactor, AnnualizationFactor.Name, file);
        var trading = settings.Trading;
        OptionHalfSpread.Check(trading.Costs.OptionHalfSpreadVolPoints, OptionHalfSpread.Name, file);
        HedgeCost.Check(trading.Costs.HedgeCostBps, HedgeCost.Name, file);
        Rate.Check(trading.Rate, Rate.Name, file);
        DividendYield.Check(trading.DividendYield, DividendYield.Name, file);
        if (!trading.SweepThresholds.IsDefault)
        {
            foreach (var threshold in trading.SweepThresholds)
            {
                RuleThresholds.Check(threshold, RuleThresholds.Name, file);
            }
        }

        SnoopingReplications.Check(settings.SnoopingReplications, SnoopingReplications.Name, file);
        if (settings.SnoopingBlockLength is int snoopingBlock)
        {
            SnoopingBlockLength.Check(snoopingBlock, SnoopingBlockLength.Name, file);
        }
    }
}
