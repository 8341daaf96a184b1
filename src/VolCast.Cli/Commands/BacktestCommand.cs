using System.CommandLine;
using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Scoring;
using VolCast.IO;
using VolCast.IO.Config;
using VolCast.IO.Results;

namespace VolCast.Cli.Commands;

/// <summary><c>volcast backtest</c>: the main job — forecasters walk forward, scored against the realized volatility that followed and against implied.</summary>
internal static class BacktestCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliConsole console)
    {
        var prices = new Option<string>("--prices") { Description = "Daily price history CSV (date, open, high, low, close[, adj_close, volume]; or date, close). Read only.", Required = true };
        var implied = new Option<string?>("--implied") { Description = "Implied-volatility CSV (date, iv). Optional: without it forecasters are ranked among themselves." };
        var ivUnit = new Option<string?>("--iv-unit") { Description = "Unit of the iv column: percent (20 = 20%) or decimal (0.20); inferred with a warning when left out." };
        ivUnit.AcceptOnlyFromAmong("percent", "decimal");
        var config = new Option<string?>("--config") { Description = BacktestOptions.ConfigHelp };
        var horizon = new Option<int?>("--horizon") { Description = $"Forecast horizon in trading days, {SettingLimits.Horizon} (default 21). Overrides the configuration." };
        var tenor = new Option<string?>("--tenor") { Description = $"Forecast horizon as a calendar tenor such as 30d ({SettingLimits.TenorDays}), mapped through the price file's own trading calendar. Overrides the configuration." };
        var start = new Option<string?>("--start") { Description = "First forecast date, yyyy-MM-dd (earlier rows still warm the forecasters up)." };
        var end = new Option<string?>("--end") { Description = "Last forecast date, yyyy-MM-dd." };
        var output = new Option<string?>("--out") { Description = "Output folder, which must not exist (default reports/backtest-<prices file name without extension>). Written in a hidden temporary folder and moved into place when complete." };
        var force = new Option<bool>("--force") { Description = "Use an existing output folder: replace the earlier run's files (those listed in its run.json) as one set, keeping any other file; a file of an output name that volcast did not write is never replaced." };
        var impliedTenor = new Option<string?>("--implied-tenor") { Description = "The tenor the implied series quotes, such as 30d (default: the backtest's own horizon). A tenor that does not match the horizon is warned about." };
        var forecasts = new Option<string?>("--forecasts") { Description = "Your own volatility forecasts, CSV (date, NAME1, NAME2, …): each column is scored as the forecaster user:NAME and may be the baseline, candidate or rule forecaster. The value dated t must be made from data known at t's close: the tool cannot check this. Overrides the configuration's forecastsFile." };
        var forecastsUnit = new Option<string?>("--forecasts-unit") { Description = "Unit of the forecasts file: percent (20 = 20%) or decimal (0.20); inferred with a warning when left out. Overrides the configuration's forecastsUnit." };
        forecastsUnit.AcceptOnlyFromAmong("percent", "decimal");
        var suspect = new Option<string?>("--suspect") { Description = BacktestOptions.SuspectHelp };
        suspect.AcceptOnlyFromAmong("warn", "drop", "stop");
        var skipBadRows = new Option<bool>("--skip-bad-rows") { Description = BacktestOptions.SkipBadRowsHelp };
        var events = new Option<string?>("--events") { Description = "Events CSV (date[, kind][, scheduled]): forecast windows that contain an event are scored apart, scheduled events apart from dates added after the fact. Optional; overrides the configuration's eventsFile." };
        var workbook = new Option<bool>("--workbook") { Description = BacktestOptions.WorkbookHelp };
        var command = new Command("backtest", "Run forecasters walk-forward with no look-ahead and score them against the realized volatility that followed and against implied: losses, Mincer-Zarnowitz, Diebold-Mariano, encompassing, model confidence set, lookback sweep with an out-of-sample adaptive choice, and a rule test. Writes report.html with its PNG charts, forecasts.csv, metrics.csv, metrics.json, run.json and summary.txt (and rejected-rows.csv when input rows were left out). Ctrl-C stops the run without writing any results (exit code 130).")
        {
            prices, implied, ivUnit, impliedTenor, config, horizon, tenor, start, end, output, force, suspect, skipBadRows, workbook, events, forecasts, forecastsUnit,
        };
        var formatOptions = InputFormatOptions.AddTo(command);
        command.SetAction(parse => console.Execute(() => Run(console, new Arguments(
            parse.GetValue(prices)!,
            parse.GetValue(implied),
            parse.GetValue(ivUnit),
            parse.GetValue(config),
            parse.GetValue(horizon),
            parse.GetValue(tenor),
            parse.GetValue(start),
            parse.GetValue(end),
            parse.GetValue(output),
            parse.GetValue(force),
            parse.GetValue(impliedTenor),
            parse,
            formatOptions,
            parse.GetValue(suspect),
            parse.GetValue(skipBadRows),
            parse.GetValue(workbook),
            parse.GetValue(events))
        {
            Forecasts = parse.GetValue(forecasts),
            ForecastsUnit = parse.GetValue(forecastsUnit),
        })));
        return command;
    }

    private static int Run(CliConsole console, Arguments a)
    {
        var settings = BacktestOptions.Resolve(a.Config, a.Horizon, a.Tenor, a.Start, a.End);
        var outFolder = a.Out ?? Path.Combine("reports", "backtest-" + Path.GetFileNameWithoutExtension(a.Prices));
        OutputChecks.Folder(outFolder);
        var unit = BacktestOptions.Unit(a.IvUnit);
        var (configFormat, configTenor) = InputFormatOptions.FromConfig(a.Config);
        var job = new BacktestJob(a.Prices, a.Implied, unit, settings, a.Config, outFolder, a.Force)
        {
            Format = a.FormatOptions.Resolve(a.Parse, configFormat),
            ImpliedTenorDays = InputFormatOptions.ImpliedTenorDays(a.ImpliedTenor, configTenor),
            Checks = BacktestOptions.Checks(a.Config, a.Suspect, a.SkipBadRows),
            Workbook = BacktestOptions.Workbook(a.Config, a.Workbook),
            Events = a.Events ?? (a.Config is null ? null : BacktestConfigFile.ReadEventsFile(a.Config)),
        };
        var (configForecasts, configForecastsUnit) = a.Config is null ? (null, ImpliedUnit.Infer) : BacktestConfigFile.ReadForecasts(a.Config);
        job = job with
        {
            Forecasts = a.Forecasts ?? configForecasts,
            ForecastsUnit = a.ForecastsUnit is null ? configForecastsUnit : BacktestOptions.Unit(a.ForecastsUnit),
        };
        var progress = new ConsoleProgress(console.Out, ConsoleProgress.IsTerminal(console.Out));
        BacktestRun run;
        try
        {
            // The first Ctrl-C (the process-wide handler) stops the run at its next check, and the results, staged in a
            // temporary sibling folder, are never moved into place. A second one ends the process at once.
            run = BacktestPipeline.Run(job, console.Warn, progress, cancellationToken: console.Interrupt);
        }
        catch (OperationCanceledException) when (console.Interrupt.IsCancellationRequested)
        {
            console.Error.WriteLine($"interrupted: the backtest was stopped before it finished; no results were written to {outFolder}.");
            return ExitCodes.Interrupted;
        }
        finally
        {
            progress.Finish();
        }

        var result = run.Result;
        var head = result.CandidateVersusBaseline;
        console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"{result.Dates.Length} forecast dates ({result.DataQuality.DatesWithTarget} with a realized target), {result.Forecasts.Length} forecasters, horizon {result.Settings.Horizon}."));
        console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"candidate {result.Candidate} vs baseline {result.Baseline}: DM QLIKE {Show(head.Qlike?.Statistic)} ({ShowP(head.Qlike?.PValue)}), DM MSE {Show(head.MseVariance?.Statistic)} ({ShowP(head.MseVariance?.PValue)}); negative favours the candidate."));
        console.Out.WriteLine(run.RulePnl is null
            ? $"rule's trades not run: {run.RulePnlAbsence}"
            : "would the rule have paid? " + RulePnlAnswer.Sentence(run.RulePnl));
        console.Out.WriteLine($"wrote {outFolder}{Path.DirectorySeparatorChar} (report.html and its charts, forecasts.csv, metrics.csv, metrics.json, run.json, summary.txt, now.json{(run.RulePnl is null ? string.Empty : ", trades.csv, rule-pnl.csv, rule-pnl-next-day.csv")})");
        return ExitCodes.Success;
    }

    private static string ShowP(double? p) => p is double v && double.IsFinite(v) ? PValueText.Clause(v) : "p n/a";

    private static string Show(double? value) => value is double v && double.IsFinite(v) ? v.ToString("F4", CultureInfo.InvariantCulture) : "n/a";

    private sealed record Arguments(
        string Prices, string? Implied, string? IvUnit, string? Config, int? Horizon, string? Tenor, string? Start, string? End, string? Out, bool Force,
        string? ImpliedTenor, ParseResult Parse, InputFormatOptions FormatOptions, string? Suspect, bool SkipBadRows, bool Workbook, string? Events)
    {
        public string? Forecasts { get; init; }

        public string? ForecastsUnit { get; init; }
    }
}
