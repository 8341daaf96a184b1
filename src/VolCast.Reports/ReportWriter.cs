using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Cone;
using VolCast.Core.Data;
using VolCast.Core.Estimators;
using VolCast.IO.Results;
using VolCast.Reports.Charts;
using VolCast.Reports.Html;
using VolCast.Reports.Model;

namespace VolCast.Reports;

/// <summary>
/// Turns a backtest into its report: maps a <see cref="BacktestResult"/> and its <see cref="BacktestRunInfo"/> to a
/// <see cref="ReportModel"/> (verdict, tables, every chart, data quality, settings) and writes report.html with the
/// chart PNGs.
/// </summary>
/// <remarks>
/// The leading forecasters are the three with the lowest mean QLIKE (implied excluded, each on its own scored dates).
/// Charts that need implied volatility (premium, cumulative loss against implied, rule test) are left out without it.
/// </remarks>
public static class ReportWriter
{
    /// <summary>Gets the names of every file the report can write: report.html and the chart PNGs.</summary>
    public static IReadOnlyList<string> FileNames { get; } =
    [
        ReportFiles.ReportFileName, "forecast-vs-realized.png", "premium.png", "cumulative-qlike.png", "loss-vs-lookback.png",
        "mincer-zarnowitz.png", "cone.png", "rule-test.png", ReportCharts.ReliabilityFileName,
    ];

    /// <summary>Builds the report of one backtest.</summary>
    /// <param name="result">The backtest result.</param>
    /// <param name="run">Tool version, inputs with their SHA-256, times and input warnings.</param>
    /// <param name="prices">The price history the backtest ran on (the cone is drawn from its closes).</param>
    /// <param name="priceRowsRead">Data rows read from the price file, for the data-quality section.</param>
    /// <param name="calibration">The probability-calibration and coverage checks of the same run (<see cref="BacktestCalibrator.Evaluate"/>), or null to leave the "Do the odds hold?" section saying they were not run.</param>
    /// <returns>The report model.</returns>
    public static ReportModel Build(BacktestResult result, BacktestRunInfo run, PriceHistory prices, int priceRowsRead, BacktestCalibration? calibration = null)
    {
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(run);
        ArgumentNullException.ThrowIfNull(prices);
        var pricesFile = run.Inputs.FirstOrDefault(i => i.Role == "prices")?.Path ?? "prices";
        var title = string.Create(CultureInfo.InvariantCulture,
            $"Volatility forecast backtest: {Path.GetFileNameWithoutExtension(pricesFile)}, {HorizonText(result.Settings.Horizon)}");
        return new ReportModel(
            title,
            ReportVerdict.Build(result),
            ReportTables.Build(result),
            Charts(result, prices),
            Quality(result, run, prices, priceRowsRead),
            new RunInfo(run.ToolVersion, run.StartedUtc, run.FinishedUtc - run.StartedUtc, Settings(result, run), [.. run.Inputs.Select(i => new InputFile(i.Role, i.Path, i.Sha256))]))
        {
            Odds = calibration is null ? null : ReportOdds.Build(result, calibration),
        };
    }

    /// <summary>Builds the report and writes report.html and its PNGs into <paramref name="folder"/>.</summary>
    /// <param name="folder">The output folder; created when missing.</param>
    /// <param name="result">The backtest result.</param>
    /// <param name="run">Tool version, inputs, times and warnings.</param>
    /// <param name="prices">The price history the backtest ran on.</param>
    /// <param name="priceRowsRead">Data rows read from the price file.</param>
    /// <param name="calibration">The odds checks of the same run, or null.</param>
    /// <returns>The file names written (without the folder).</returns>
    /// <exception cref="IOException">A report file already exists in the folder.</exception>
    public static IReadOnlyList<string> Write(string folder, BacktestResult result, BacktestRunInfo run, PriceHistory prices, int priceRowsRead, BacktestCalibration? calibration = null)
    {
        var model = Build(result, run, prices, priceRowsRead, calibration);
        return [.. ReportFiles.Write(model, folder, overwrite: false).Select(Path.GetFileName).OfType<string>()];
    }

    internal static IReadOnlyList<ChartImage> Charts(BacktestResult result, PriceHistory prices)
    {
        var charts = new List<ChartImage>();
        var leading = ReportSeries.Leading(result);
        var realized = ReportSeries.Realized(result);
        var implied = result.HasImplied ? ReportSeries.Implied(result) : null;
        charts.Add(ReportCharts.ForecastVsRealized(realized, implied, [.. leading.Select(s => ReportSeries.Forecast(result, s))]));
        if (result.HasImplied)
        {
            charts.Add(ReportCharts.Premium(ReportSeries.Premium(result)));
            charts.Add(ReportCharts.CumulativeLossDifferential([.. leading.Select(s => ReportSeries.QlikeDifferential(result, s))]));
        }

        var curves = ReportSeries.LookbackCurves(result);
        if (curves.Count > 0)
        {
            charts.Add(ReportCharts.LossVsLookback(curves));
        }

        var leader = ReportSeries.Ranked(result).FirstOrDefault(m => m.MincerZarnowitz is not null);
        if (leader is not null)
        {
            var (forecast, realizedVariance) = ReportSeries.Variances(result, leader.Spec);
            charts.Add(ReportCharts.MincerZarnowitz(leader.Spec, forecast, realizedVariance, leader.MincerZarnowitz!.Intercept, leader.MincerZarnowitz.Slope));
        }

        var returns = Returns.LogReturns(prices.Close);
        var cone = VolatilityCone.Compute(returns, VolatilityCone.DefaultHorizons, result.Settings.AnnualizationFactor);
        if (cone.Horizons.Count > 0)
        {
            charts.Add(ReportCharts.Cone(cone, ConeOverlays(result, leading)));
        }

        if (result.RuleTest is RuleTestResult rule)
        {
            var (all, sell) = ReportSeries.RuleGaps(result);
            charts.Add(ReportCharts.RuleTest(all, sell, string.Create(CultureInfo.InvariantCulture,
                $"sell: implied > {rule.ForecastSpec} + {rule.ThresholdVolatility * 100:0.0} pts")));
        }

        return charts;
    }

    internal static IReadOnlyList<ConeOverlay> ConeOverlays(BacktestResult result, IReadOnlyList<string> leading)
    {
        var days = result.Settings.Horizon.NominalDays;
        var overlays = new List<ConeOverlay>();
        if (result.HasImplied && ReportSeries.Latest(result, ImpliedSeries.Name) is (DateOnly date, double iv))
        {
            overlays.Add(new ConeOverlay(string.Create(CultureInfo.InvariantCulture, $"implied {date:yyyy-MM-dd}"), days, iv));
        }

        foreach (var spec in leading)
        {
            if (ReportSeries.Latest(result, spec) is (DateOnly _, double value))
            {
                overlays.Add(new ConeOverlay(spec, days, value));
            }
        }

        return overlays;
    }

    private static DataQuality Quality(BacktestResult result, BacktestRunInfo run, PriceHistory prices, int rowsRead)
    {
        var q = result.DataQuality;
        var warnings = new List<string>(run.InputWarnings);
        warnings.AddRange(result.Warnings);
        var c = CultureInfo.InvariantCulture;
        warnings.Add(string.Create(c, $"{q.DatesWithoutTarget} forecast dates at the end have forecasts but no realized target yet (their window had not closed); they are in forecasts.csv but not scored."));
        if (q.ZeroRealizedDates > 0)
        {
            warnings.Add(string.Create(c, $"{q.ZeroRealizedDates} dates had zero realized volatility and are not scored (QLIKE is undefined there)."));
        }

        if (result.HasImplied)
        {
            warnings.Add(string.Create(c, $"{q.ForecastDatesWithoutImplied} forecast dates have no implied quote; {q.ImpliedDatesWithoutPrices} implied quotes fall on dates without prices and are not used."));
        }

        double? coverage = result.HasImplied && q.ForecastDates > 0 ? q.ForecastDatesWithImplied / (double)q.ForecastDates : null;
        return new DataQuality(rowsRead, Math.Max(0, rowsRead - prices.Count), q.DatesWithTarget - q.ZeroRealizedDates, coverage, warnings);
    }

    private static List<Setting> Settings(BacktestResult result, BacktestRunInfo run)
    {
        var s = result.Settings;
        var c = CultureInfo.InvariantCulture;
        var settings = new List<Setting>
        {
            new("Horizon", HorizonText(s.Horizon) + string.Create(c, $" (forecasters asked for {s.Horizon.NominalDays} trading days; HAC lag {result.HacLag})")),
            new("Forecast dates", string.Create(c, $"{result.Dates[0]:yyyy-MM-dd} to {result.Dates[^1]:yyyy-MM-dd} ({result.Dates.Length})")),
            new("Realized target", s.Target switch { RealizedTarget.SquaredReturns => "zero-mean squared close-to-close log returns", var t => t.ToString() }),
            new("Annualization", string.Create(c, $"{s.AnnualizationFactor:0.##} trading days a year")),
            new("Forecasters", string.Join(", ", s.Forecasters)),
            new("Lookback sweep", s.Sweep
                ? $"{string.Join(", ", s.SweepEstimators.Select(EstimatorNames.Name))} over {string.Join(", ", s.SweepLookbacks)} days; EWMA decays {string.Join(", ", s.EwmaLambdas.Select(l => l.ToString("0.00", c)))}"
                : "off"),
            new("Adaptive selection window", string.Create(c, $"{s.SelectionWindowDays} trading days")),
            new("Model confidence set", string.Create(c, $"α = {s.McsAlpha:0.00}, {s.McsReplications} bootstrap replications, block length {(s.McsBlockLength is int b ? b.ToString(c) : "the horizon")}, seed {s.McsSeed}")),
            new("Baseline and candidate", $"baseline {result.Baseline}, candidate {result.Candidate}"),
        };
        if (result.RuleTest is RuleTestResult rule)
        {
            settings.Add(new("Rule test", string.Create(c, $"threshold {rule.ThresholdVolatility * 100:0.0} vol points; forecast {rule.ForecastSpec}, historical {rule.HistoricalSpec}")));
        }

        settings.Add(new("Implied unit", run.ImpliedUnit ?? "no implied file"));
        return settings;
    }

    private static string HorizonText(BacktestHorizon horizon) => horizon.TradingDays is int h
        ? string.Create(CultureInfo.InvariantCulture, $"{h}-trading-day horizon")
        : string.Create(CultureInfo.InvariantCulture, $"{horizon.TenorCalendarDays}-calendar-day tenor");
}
