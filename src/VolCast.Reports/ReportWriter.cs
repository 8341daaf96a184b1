using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Cone;
using VolCast.Core.Data;
using VolCast.Core.Estimators;
using VolCast.IO;
using VolCast.IO.Csv;
using VolCast.IO.Results;
using VolCast.Reports.Charts;
using VolCast.Reports.Html;
using VolCast.Reports.Model;

namespace VolCast.Reports;

/// <summary>
/// Turns a backtest into its report: maps a <see cref="BacktestResult"/> and its <see cref="BacktestRunInfo"/> to a
/// <see cref="ReportModel"/> (verdict, the rule's option P&amp;L, tables, every chart, data quality, settings) and writes report.html with the
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
        "mincer-zarnowitz.png", "cone.png", ConeFileName, "rule-test.png", ReportCharts.ReliabilityFileName,
        PnlCharts.CumulativeFileName, PnlCharts.MarksFileName, PnlCharts.TradesFileName, PnlCharts.YearsFileName,
        GroupCharts.YearsFileName,
    ];

    /// <summary>The cone's data file: the percentiles the cone chart draws, in the columns of <see cref="ConeCsv"/>.</summary>
    public const string ConeFileName = "cone.csv";

    /// <summary>Builds the report of one backtest, drawing every chart.</summary>
    /// <param name="run">The run: result, odds checks, run information and the price history it ran on.</param>
    /// <param name="cancellationToken">Stops between charts.</param>
    /// <returns>The report model.</returns>
    /// <exception cref="OperationCanceledException">The token was cancelled.</exception>
    internal static ReportModel Build(BacktestRun run, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(run);
        return Build(run, Cone(run.Result, run.Prices), null, false, cancellationToken);
    }

    /// <summary>Builds the report and writes report.html, its PNGs and, when the cone is drawn, cone.csv (its numbers) into <paramref name="folder"/>.</summary>
    /// <param name="folder">The folder to write to (the caller's staging folder); created when missing.</param>
    /// <param name="run">The run.</param>
    /// <param name="progress">Receives one report per chart drawn ("drawing charts") and one when the page is written, or null.</param>
    /// <param name="drawBeside">Whether the P&amp;L section's charts are drawn on another thread beside the others (when a core is free).</param>
    /// <param name="cancellationToken">Stops between charts, before the page is rendered and between files.</param>
    /// <returns>The file names written (without the folder).</returns>
    /// <exception cref="IOException">A report file already exists in the folder.</exception>
    /// <exception cref="OperationCanceledException">The token was cancelled.</exception>
    public static IReadOnlyList<string> Write(string folder, BacktestRun run, IProgress<BacktestProgress>? progress = null, bool drawBeside = false, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(run);
        var cone = Cone(run.Result, run.Prices);
        var model = Build(run, cone, progress, drawBeside, cancellationToken);
        progress?.Report(new BacktestProgress("writing the report", 0, 1));
        var written = ReportFiles.Write(model, folder, overwrite: false, cancellationToken).Select(Path.GetFileName).OfType<string>().ToList();
        if (cone.Horizons.Count > 0)
        {
            cancellationToken.ThrowIfCancellationRequested();
            AtomicFile.WriteText(Path.Combine(folder, ConeFileName), w => ConeCsv.Write(w, cone));
            written.Insert(0, ConeFileName);
        }

        progress?.Report(new BacktestProgress("writing the report", 1, 1));
        return written;
    }

    /// <summary>
    /// The volatility cone of the closes the backtest ran on up to its last forecast date (the same closes as the Now
    /// section's cone percentile, so "today" is the same day in both), with the backtest's annualization factor.
    /// </summary>
    internal static VolatilityConeResult Cone(BacktestResult result, PriceHistory prices)
    {
        var last = result.Dates.IsEmpty ? -1 : prices.Dates.BinarySearch(result.Dates[^1]);
        var close = last >= 0 ? prices.Close[..(last + 1)] : prices.Close;
        return VolatilityCone.Compute(Returns.LogReturns(close), VolatilityCone.DefaultHorizons, result.Settings.AnnualizationFactor);
    }

    private static ReportModel Build(BacktestRun run, VolatilityConeResult cone, IProgress<BacktestProgress>? progress, bool drawBeside, CancellationToken cancellationToken)
    {
        var result = run.Result;
        var info = run.Info;
        var pricesFile = info.Inputs.FirstOrDefault(i => i.Role == "prices")?.Path ?? "prices";
        var title = string.Create(CultureInfo.InvariantCulture,
            $"Volatility forecast backtest: {Path.GetFileNameWithoutExtension(pricesFile)}, {HorizonText(result.Settings.Horizon)}");
        var pnlBeside = drawBeside ? Task.Run(() => ReportPnl.Build(run.RulePnl, run.RulePnlAbsence, result.Settings.Horizon, cancellationToken), cancellationToken) : null;
        var charts = Charts(result, cone, progress, cancellationToken);
        cancellationToken.ThrowIfCancellationRequested();
        var odds = ReportOdds.Build(result, run.Calibration);
        var pnl = pnlBeside is null ? ReportPnl.Build(run.RulePnl, run.RulePnlAbsence, result.Settings.Horizon, cancellationToken) : pnlBeside.GetAwaiter().GetResult();
        var quality = Quality(result, info, run.PriceRowsRead);
        return new ReportModel(
            title,
            ReportVerdict.Build(result, run.RulePnl),
            ReportTables.Build(result),
            charts,
            quality with { Notes = [.. quality.Notes, .. ReportAnswers.EventLines(run.Groups)] },
            new RunInfo(info.ToolVersion, info.StartedUtc, info.FinishedUtc - info.StartedUtc, Settings(result, info), [.. info.Inputs.Select(i => new InputFile(i.Role, i.Path, i.Sha256))]))
        {
            Odds = odds,
            Pnl = pnl,
            Now = ReportNow.Build(Core.Now.NowReading.From(result, run.Prices, run.RulePnl)),
            Answers = ReportAnswers.Tables(result, run.Groups),
            YearChart = GroupCharts.Years(run.Groups.Rows, SeriesColors.For(result)),
        };
    }

    internal static IReadOnlyList<ChartImage> Charts(
        BacktestResult result, VolatilityConeResult cone, IProgress<BacktestProgress>? progress = null, CancellationToken cancellationToken = default)
    {
        var charts = new List<ChartImage>();

        // Drawing is linear in the dates (long series are thinned to what the pixels can show), but on long histories it
        // takes seconds, so each chart is reported as it is done, and Ctrl-C is honoured between charts.
        var planned = 4 + (result.HasImplied ? 2 : 0) + (result.RuleTest is null ? 0 : 1);
        progress?.Report(new BacktestProgress("drawing charts", 0, planned));
        void Next() => cancellationToken.ThrowIfCancellationRequested();
        void Drawn() => progress?.Report(new BacktestProgress("drawing charts", Math.Min(charts.Count, planned), planned));
        Next();
        var leading = ReportSeries.Leading(result);
        var colors = SeriesColors.For(result);
        var realized = ReportSeries.Realized(result);
        var implied = result.HasImplied ? ReportSeries.Implied(result) : null;
        charts.Add(ReportCharts.ForecastVsRealized(realized, implied, [.. leading.Select(s => ReportSeries.Forecast(result, s))], colors));
        Drawn();
        if (result.HasImplied)
        {
            Next();
            charts.Add(ReportCharts.Premium(ReportSeries.Premium(result)));
            Next();
            charts.Add(ReportCharts.CumulativeLossDifferential([.. leading.Select(s => ReportSeries.QlikeDifferential(result, s))], colors));
            Drawn();
        }

        var curves = ReportSeries.LookbackCurves(result);
        if (curves.Count > 0)
        {
            Next();
            charts.Add(ReportCharts.LossVsLookback(curves, colors));
            Drawn();
        }

        var leader = ReportSeries.Ranked(result).FirstOrDefault(m => m.MincerZarnowitz is not null);
        if (leader is not null)
        {
            Next();
            var (forecast, realizedVariance) = ReportSeries.Variances(result, leader.Spec);
            charts.Add(ReportCharts.MincerZarnowitz(leader.Spec, forecast, realizedVariance, leader.MincerZarnowitz!.Intercept, leader.MincerZarnowitz.Slope, colors));
            Drawn();
        }

        Next();
        if (cone.Horizons.Count > 0)
        {
            charts.Add(ReportCharts.Cone(cone, ConeOverlays(result, leading), colors));
            Drawn();
        }

        if (result.RuleTest is RuleTestResult rule)
        {
            Next();
            var (all, sell) = ReportSeries.RuleGaps(result);
            charts.Add(ReportCharts.RuleTest(all, sell, string.Create(CultureInfo.InvariantCulture,
                $"sell: implied > {rule.ForecastSpec} + {rule.ThresholdVolatility * 100:0.0} pts"), rule.ForecastSpec,
                SignalledAgainstAll.Compute(rule, historical: false, RuleSignal.SellVolatility, result.HacLag).PValue, colors));
        }

        progress?.Report(new BacktestProgress("drawing charts", planned, planned));
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

    private static DataQuality Quality(BacktestResult result, BacktestRunInfo run, int rowsRead)
    {
        var q = result.DataQuality;
        var warnings = new List<string>(run.InputWarnings);
        warnings.AddRange(result.Warnings);
        var c = CultureInfo.InvariantCulture;

        // Routine notes (what every backtest has: the last windows not yet closed, dates without a quote) are kept apart
        // from warnings (something in the inputs that needs a look), so the warning count means something.
        var routine = new List<string>
        {
            string.Create(c, $"{q.DatesWithoutTarget} forecast dates at the end have forecasts but no realized target yet (their window had not closed); they are in forecasts.csv but not scored."),
        };
        if (q.ZeroRealizedDates > 0)
        {
            routine.Add(string.Create(c, $"{q.ZeroRealizedDates} dates had zero realized volatility and are not scored (QLIKE is undefined there)."));
        }

        if (result.HasImplied)
        {
            routine.Add(string.Create(c, $"{q.ForecastDatesWithoutImplied} forecast dates have no implied quote; {q.ImpliedDatesWithoutPrices} implied quotes fall on dates without prices and are not used."));
        }

        double? coverage = result.HasImplied && q.ScoredDates > 0 ? q.ScoredDatesWithImplied / (double)q.ScoredDates : null;
        return new DataQuality(rowsRead, q.ScoredDates, coverage, warnings)
        {
            Notes = run.InputNotes,
            RoutineNotes = routine,
            ScoredDatesWithImplied = result.HasImplied ? q.ScoredDatesWithImplied : null,
            Suspect = run.Suspect,
            RowsLeftOut = run.RowsLeftOut,
        };
    }

    private static List<Setting> Settings(BacktestResult result, BacktestRunInfo run)
    {
        var s = result.Settings;
        var c = CultureInfo.InvariantCulture;
        var settings = new List<Setting>
        {
            new("Horizon", HorizonStatement(result) + string.Create(c, $"; forecasters are asked for the nominal {s.Horizon.NominalDays}, the realized target spans each date's own window, Newey-West errors use lag {result.HacLag} (the nominal), and the tests of the forecast move bands space their dates by the longest window")),
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
        if (!run.InputFormat.IsDefault)
        {
            settings.Add(new("Input CSV format", run.InputFormat.Describe()));
        }

        return settings;
    }

    /// <summary>
    /// The horizon stated once, with both counts the tests use: "30-calendar-day tenor = 20–22 trading days, 21 nominal",
    /// or "21-trading-day horizon" when it is fixed in trading days.
    /// </summary>
    internal static string HorizonStatement(BacktestResult result)
    {
        var horizon = result.Settings.Horizon;
        if (horizon.TradingDays is not null)
        {
            return HorizonText(horizon);
        }

        var (shortest, longest) = WindowRange(result);
        var span = shortest == longest ? shortest.ToString(CultureInfo.InvariantCulture) : string.Create(CultureInfo.InvariantCulture, $"{shortest}–{longest}");
        return string.Create(CultureInfo.InvariantCulture, $"{HorizonText(horizon)} = {span} trading days, {horizon.NominalDays} nominal");
    }

    /// <summary>The shortest and longest realized window in trading days over the forecast dates (the nominal days when none is known).</summary>
    internal static (int Shortest, int Longest) WindowRange(BacktestResult result)
    {
        int? shortest = null, longest = null;
        foreach (var days in result.WindowDays)
        {
            if (days is int d)
            {
                shortest = Math.Min(shortest ?? d, d);
                longest = Math.Max(longest ?? d, d);
            }
        }

        var nominal = result.Settings.Horizon.NominalDays;
        return (shortest ?? nominal, longest ?? nominal);
    }

    private static string HorizonText(BacktestHorizon horizon) => horizon.TradingDays is int h
        ? string.Create(CultureInfo.InvariantCulture, $"{h}-trading-day horizon")
        : string.Create(CultureInfo.InvariantCulture, $"{horizon.TenorCalendarDays}-calendar-day tenor");
}
