using System.CommandLine;
using System.Globalization;
using VolCast.Cli.Batch;
using VolCast.Core.Backtest;
using VolCast.IO;
using VolCast.IO.Config;

namespace VolCast.Cli.Commands;

/// <summary><c>volcast batch</c>: the backtest over every name in a folder, in parallel and resumable, with a cross-asset summary.</summary>
internal static class BatchCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliConsole console)
    {
        var pricesDir = new Option<string>("--prices-dir") { Description = "Folder of daily price files, one NAME.csv per asset (same columns as backtest --prices). Read only.", Required = true };
        var impliedDir = new Option<string?>("--implied-dir") { Description = "Folder of implied-volatility files matched by name (NAME.csv with date, iv). A name without one is ranked among forecasters only and marked in the summary." };
        var ivUnit = new Option<string?>("--iv-unit") { Description = "Unit of every implied file's iv column: percent (20 = 20%) or decimal (0.20); inferred per file with a warning when left out." };
        ivUnit.AcceptOnlyFromAmong("percent", "decimal");
        var config = new Option<string?>("--config") { Description = "JSON configuration used for every name (same keys as backtest --config). Every setting is optional. " + SettingLimits.HelpText() };
        var horizon = new Option<int?>("--horizon") { Description = $"Forecast horizon in trading days, {SettingLimits.Horizon} (default 21). Overrides the configuration." };
        var tenor = new Option<string?>("--tenor") { Description = $"Forecast horizon as a calendar tenor such as 30d ({SettingLimits.TenorDays}), mapped through each price file's own trading calendar. Overrides the configuration." };
        var output = new Option<string?>("--out") { Description = "Batch folder (default reports/batch): assets/NAME/ per name, summary.csv and summary.html. An existing batch folder is resumed." };
        var jobs = new Option<int?>("--jobs") { Description = $"How many names run at the same time, {SettingLimits.Jobs} (default: the number of processor cores)." };
        var impliedTenor = new Option<string?>("--implied-tenor") { Description = "The tenor every implied file quotes, such as 30d (default: the backtest's own horizon). A tenor that does not match the horizon is warned about." };
        var force = new Option<bool>("--force") { Description = "Recompute every name, even those whose results are complete and whose inputs and configuration are unchanged." };
        var command = new Command("batch", "Run the same backtest over every NAME.csv in a folder, in parallel; results per name go to OUT/assets/NAME/. A rerun keeps names whose results are complete and whose inputs (by SHA-256) and configuration are unchanged, so an interrupted batch resumes; one bad file fails only its name. Writes summary.csv, lookbacks.csv, beats-implied.csv and summary.html (share of names where each forecaster beats implied, with a Benjamini-Hochberg false discovery rate correction). Ctrl-C stops cleanly, keeping finished names (exit code 130).")
        {
            pricesDir, impliedDir, ivUnit, impliedTenor, config, horizon, tenor, output, jobs, force,
        };
        var formatOptions = InputFormatOptions.AddTo(command);
        command.SetAction(parse => console.Execute(() => Run(console, new Arguments(
            parse.GetValue(pricesDir)!,
            parse.GetValue(impliedDir),
            parse.GetValue(ivUnit),
            parse.GetValue(config),
            parse.GetValue(horizon),
            parse.GetValue(tenor),
            parse.GetValue(output),
            parse.GetValue(jobs),
            parse.GetValue(force),
            parse.GetValue(impliedTenor),
            parse,
            formatOptions))));
        return command;
    }

    /// <summary>Turns the command-line values into a batch request, checking them.</summary>
    private static BatchRequest Request(Arguments a)
    {
        if (a.Jobs is int j)
        {
            SettingLimits.Jobs.Check(j, "--jobs");
        }

        var outFolder = a.Out ?? Path.Combine("reports", "batch");
        OutputChecks.Folder(outFolder);
        OutputChecks.Separate(outFolder, a.PricesDir, a.ImpliedDir);
        var settings = BacktestOptions.Resolve(a.Config, a.Horizon, a.Tenor);
        var unit = BacktestOptions.Unit(a.IvUnit);
        var (configFormat, configTenor) = InputFormatOptions.FromConfig(a.Config);
        return new BatchRequest(a.PricesDir, a.ImpliedDir, unit, settings, a.Config, outFolder, a.Jobs ?? Environment.ProcessorCount, a.Force)
        {
            Format = a.FormatOptions.Resolve(a.Parse, configFormat),
            ImpliedTenorDays = InputFormatOptions.ImpliedTenorDays(a.ImpliedTenor, configTenor),
        };
    }

    private static int Run(CliConsole console, Arguments a)
    {
        var request = Request(a);
        using var stop = new CancellationTokenSource();
        ConsoleCancelEventHandler onCancel = (_, e) =>
        {
            // Let running names stop between forecasters and keep every finished one; a second Ctrl-C ends the process.
            e.Cancel = !stop.IsCancellationRequested;
            stop.Cancel();
        };
        Console.CancelKeyPress += onCancel;
        var progress = new BatchConsoleProgress(console.Out, ConsoleProgress.IsTerminal(console.Out));
        BatchOutcome outcome;
        try
        {
            outcome = BatchRunner.Run(request, progress, stop.Token);
        }
        finally
        {
            progress.Finish();
            Console.CancelKeyPress -= onCancel;
        }

        foreach (var row in outcome.Rows.Where(r => !r.Succeeded))
        {
            console.Error.WriteLine($"error: {row.Name}: {row.Error}");
        }

        if (outcome.Cancelled)
        {
            console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"batch stopped: {outcome.Rows.Count} names finished and kept in {request.OutputFolder}{Path.DirectorySeparatorChar}assets; run the same command again to resume."));
            return ExitCodes.Interrupted;
        }

        console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"{outcome.Rows.Count} names: {outcome.Computed - outcome.Failed} computed, {outcome.Reused} kept from an earlier run, {outcome.Failed} failed."));
        console.Out.WriteLine($"wrote {request.OutputFolder}{Path.DirectorySeparatorChar} (assets/NAME/, summary.csv, lookbacks.csv, beats-implied.csv, summary.html)");
        return outcome.Failed > 0 ? ExitCodes.BadInput : ExitCodes.Success;
    }

    private sealed record Arguments(
        string PricesDir, string? ImpliedDir, string? IvUnit, string? Config, int? Horizon, string? Tenor, string? Out, int? Jobs, bool Force,
        string? ImpliedTenor, ParseResult Parse, InputFormatOptions FormatOptions);
}
