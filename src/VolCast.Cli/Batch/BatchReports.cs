namespace VolCast.Cli.Batch;

/// <summary>Which report pages a batch draws.</summary>
internal enum BatchReports
{
    /// <summary>One report page with its charts per name, and the summary page.</summary>
    Full,

    /// <summary>Data files per name; the summary page (with its charts) only. A name's page can be drawn later with <c>volcast backtest</c>.</summary>
    Summary,

    /// <summary>Data files per name and summary.csv and beats-implied.csv; no page at all.</summary>
    None,
}
