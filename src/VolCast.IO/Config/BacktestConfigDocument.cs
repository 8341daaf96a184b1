namespace VolCast.IO.Config;

/// <summary>The JSON shape of a backtest configuration file; every property optional (camelCase in the file).</summary>
internal sealed class BacktestConfigDocument
{
    public string[]? Forecasters { get; set; }

    public int? Horizon { get; set; }

    public string? Tenor { get; set; }

    public string? Start { get; set; }

    public string? End { get; set; }

    public bool? Sweep { get; set; }

    public bool? FullSweep { get; set; }

    public string[]? SweepEstimators { get; set; }

    public int[]? SweepLookbacks { get; set; }

    public double[]? EwmaLambdas { get; set; }

    public int? SelectionWindowDays { get; set; }

    public McsConfigDocument? Mcs { get; set; }

    public double? RuleThreshold { get; set; }

    public string? RuleForecaster { get; set; }

    public string? RuleHistorical { get; set; }

    public string? Baseline { get; set; }

    public string? Candidate { get; set; }

    public double? AnnualizationFactor { get; set; }

    public string? Target { get; set; }

    public string? DateFormat { get; set; }

    public string? Delimiter { get; set; }

    public string? Decimal { get; set; }

    public string? ImpliedTenor { get; set; }

    public string? ForecastsFile { get; set; }

    public string? ForecastsUnit { get; set; }

    public string? EventsFile { get; set; }

    public string? Suspect { get; set; }

    public bool? SkipBadRows { get; set; }

    public bool? Workbook { get; set; }

    public CostsConfigDocument? Costs { get; set; }

    public double? Rate { get; set; }

    public double? DividendYield { get; set; }

    public string? Entries { get; set; }

    public string? RuleSides { get; set; }

    public string? HedgeVolatility { get; set; }

    public double[]? RuleThresholds { get; set; }

    public SnoopingConfigDocument? Snooping { get; set; }
}
