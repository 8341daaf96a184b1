namespace VolCast.Reports.Model;

/// <summary>Everything one report shows, as plain values; <see cref="Html.HtmlReport"/> renders it.</summary>
/// <param name="Title">The report's title, e.g. the instrument and horizon.</param>
/// <param name="Verdict">The verdict in plain words.</param>
/// <param name="Tables">The metric tables.</param>
/// <param name="Charts">The rendered charts, in the order to show them.</param>
/// <param name="DataQuality">What the inputs looked like.</param>
/// <param name="Run">Settings, tool version, run time and input hashes.</param>
internal sealed record ReportModel(
    string Title,
    Verdict Verdict,
    IReadOnlyList<MetricTable> Tables,
    IReadOnlyList<ChartImage> Charts,
    DataQuality DataQuality,
    RunInfo Run)
{
    /// <summary>The cautions printed at the end of every report.</summary>
    public IReadOnlyList<string> Cautions { get; init; } = ReportText.Cautions;

    /// <summary>The probability-calibration and range-coverage section, or null when the checks were not run.</summary>
    public OddsSection? Odds { get; init; }

    /// <summary>The "Now" section, today's reading of the data, or null when the report was built without it.</summary>
    public NowSection? Now { get; init; }

    /// <summary>The "Would the rule have paid?" section, or null when the report was built without it (the page then says it was not run).</summary>
    public PnlSection? Pnl { get; init; }

    /// <summary>The tables of the "Which forecaster, which lookback, and when" section; empty leaves the section out.</summary>
    public IReadOnlyList<TextTable> Answers { get; init; } = [];

    /// <summary>The chart drawn under the by-year table of the answers section, or null (fewer than two years, or no year table).</summary>
    public ChartImage? YearChart { get; init; }
}
