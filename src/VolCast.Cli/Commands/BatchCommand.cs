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
        var pricesDir = new Option<string>("--prices-dir") { Description = "Folder of daily price files, one NAME.csv per asset (same columns as backtest --prices). Read only. Required, except with --reduce, which can take it from the shards' plan." };
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
        var suspect = new Option<string?>("--suspect") { Description = BacktestOptions.SuspectHelp + " Applies to each name on its own: a name stopped by its suspect rows fails alone and the summary lists it." };
        suspect.AcceptOnlyFromAmong("warn", "drop", "stop");
        var skipBadRows = new Option<bool>("--skip-bad-rows") { Description = BacktestOptions.SkipBadRowsHelp + " Each name lists its own in OUT/assets/NAME/rejected-rows.csv." };
        var workbook = new Option<bool>("--workbook") { Description = BacktestOptions.WorkbookHelp + " Each name gets its own in OUT/assets/NAME/." };
        var shard = new Option<string?>("--shard") { Description = "Compute only shard K of N (0-based, --shard K/N): the names whose stable hash of the name (64-bit FNV-1a of its UTF-8 bytes) modulo N is K, so adding a name never moves the others. Shards may write into one shared --out at the same time; a shard writes no summary (see --reduce). --shard auto takes K and N from a Kubernetes indexed job (JOB_COMPLETION_INDEX, with --shards N) or a Slurm job array (SLURM_ARRAY_TASK_ID, SLURM_ARRAY_TASK_COUNT)." };
        var shards = new Option<int?>("--shards") { Description = "With --shard auto in a Kubernetes indexed job: the number of shards, equal to the job's completions." };
        var reduce = new Option<bool>("--reduce") { Description = "Compute nothing: read the names' finished folders in --out and write summary.csv, beats-implied.csv and summary.html, byte for byte as one batch would. --reduce --out DIR alone takes the names, the options and the tool version from DIR/" + BatchPlan.FileName + ", which every shard writes; options given with --reduce (from --prices-dir on) are checked against it. Names with no finished results, or computed with another configuration or tool version, are listed and the exit code is 3." };
        var allowMissing = new Option<bool>("--allow-missing") { Description = "With --reduce: write a partial summary even when names are not finished; they are marked as not finished in it." };
        var reports = new Option<string>("--reports") { Description = "Which report pages to draw: full (one page with charts per name, and the summary page; the default), summary (data files per name, charts only on the summary page) or none (data files and summary.csv only). A name's page can be drawn later with volcast backtest on the same inputs.", DefaultValueFactory = _ => "full" };
        reports.AcceptOnlyFromAmong("full", "summary", "none");
        var command = new Command("batch", "Run the same backtest over every NAME.csv in a folder, in parallel; results per name go to OUT/assets/NAME/. A rerun keeps names whose results are complete and whose inputs (by SHA-256) and configuration are unchanged, so an interrupted batch resumes; one bad file fails only its name. Writes summary.csv, lookbacks.csv, beats-implied.csv and summary.html (share of names where each forecaster beats implied, with a Benjamini-Hochberg false discovery rate correction). Ctrl-C stops cleanly, keeping finished names (exit code 130).")
        {
            pricesDir, impliedDir, ivUnit, impliedTenor, config, horizon, tenor, output, jobs, force, suspect, skipBadRows, workbook, reports, shard, shards, reduce, allowMissing,
        };
        var formatOptions = InputFormatOptions.AddTo(command);
        // The options that say what to compute: a reduce takes either all of them from the shards' plan or the shards' own from --prices-dir on.
        Option[] computing = [impliedDir, ivUnit, impliedTenor, config, horizon, tenor, suspect, skipBadRows, workbook, reports, formatOptions.DateFormat, formatOptions.Delimiter, formatOptions.Decimal];
        command.SetAction(parse => console.Execute(() => Run(console, new Arguments(
            parse.GetValue(pricesDir),
            parse.GetValue(impliedDir),
            parse.GetValue(ivUnit),
            parse.GetValue(config),
            parse.GetValue(horizon),
            parse.GetValue(tenor),
            parse.GetValue(output),
            parse.GetValue(jobs),
            parse.GetValue(force),
            parse.GetValue(impliedTenor),
            parse.GetValue(reports)!,
            parse.GetValue(shard),
            parse.GetValue(shards),
            parse.GetValue(reduce),
            parse.GetValue(allowMissing),
            parse,
            formatOptions,
            parse.GetValue(suspect),
            parse.GetValue(skipBadRows),
            parse.GetValue(workbook))
        {
            ComputingGiven = [.. computing.Where(o => parse.GetResult(o) is { Implicit: false }).Select(o => o.Name)],
        })));
        return command;
    }

    /// <summary>Turns the command-line values into a batch request, checking them.</summary>
    private static BatchRequest Request(Arguments a)
    {
        var outFolder = a.Out ?? Path.Combine("reports", "batch");
        OutputChecks.Folder(outFolder);
        OutputChecks.Separate(outFolder, a.PricesDir, a.ImpliedDir);
        var pricesDir = a.PricesDir ?? throw new UsageException("--prices-dir is required: the folder of NAME.csv price files to run the batch over (only --reduce --out DIR can do without it).");
        var settings = BacktestOptions.Resolve(a.Config, a.Horizon, a.Tenor);
        if (a.Config is not null && (BacktestConfigFile.ReadForecasts(a.Config).File is not null || BacktestConfigFile.ReadEventsFile(a.Config) is not null))
        {
            // One forecasts or events file does not fit every name; rather than ignore it silently, say so.
            throw new UsageException($"{BacktestOptions.Shown(a.Config)}: batch does not read forecastsFile or eventsFile (they belong to one instrument); remove them from the configuration, or run that name with volcast backtest.");
        }

        var unit = BacktestOptions.Unit(a.IvUnit);
        var (configFormat, configTenor) = InputFormatOptions.FromConfig(a.Config);
        return new BatchRequest(pricesDir, a.ImpliedDir, unit, settings, a.Config, outFolder, a.Jobs ?? Environment.ProcessorCount, a.Force)
        {
            Format = a.FormatOptions.Resolve(a.Parse, configFormat),
            ImpliedTenorDays = InputFormatOptions.ImpliedTenorDays(a.ImpliedTenor, configTenor),
            Shard = Shard(a),
            Reports = a.Reports switch { "summary" => BatchReports.Summary, "none" => BatchReports.None, _ => BatchReports.Full },
            Checks = BacktestOptions.Checks(a.Config, a.Suspect, a.SkipBadRows),
            Workbook = BacktestOptions.Workbook(a.Config, a.Workbook),
        };
    }

    private static BatchShard? Shard(Arguments a)
    {
        if (a.Shards is int n && (n < 1 || n > BatchShard.MaxCount))
        {
            throw new UsageException(string.Create(CultureInfo.InvariantCulture, $"--shards {n}: the number of shards must be 1 to {BatchShard.MaxCount}, the job's completions."));
        }

        if (a.Shard is null)
        {
            return a.Shards is null ? null : throw new UsageException("--shards goes with --shard auto in a Kubernetes indexed job; give --shard auto --shards N, or --shard K/N.");
        }

        if (string.Equals(a.Shard, "auto", StringComparison.Ordinal))
        {
            return BatchShard.FromEnvironment(Environment.GetEnvironmentVariable, a.Shards);
        }

        return a.Shards is null ? BatchShard.Parse(a.Shard) : throw new UsageException("--shards goes only with --shard auto; with --shard K/N the count is N.");
    }

    /// <summary>Refuses option combinations that cannot mean anything, before anything is read.</summary>
    private static void CheckCombinations(Arguments a)
    {
        if (a.Jobs is int j)
        {
            SettingLimits.Jobs.Check(j, "--jobs");
        }

        if (a.Reduce && (a.Shard is not null || a.Shards is not null))
        {
            throw new UsageException("--reduce cannot be combined with --shard or --shards: run the shards first, each with --shard, then one volcast batch --reduce --out DIR.");
        }

        if (a.Reduce && a.Force)
        {
            throw new UsageException("--reduce computes nothing, so --force has nothing to recompute: rerun the shards with --force, then volcast batch --reduce --out DIR.");
        }

        if (a.AllowMissing && !a.Reduce)
        {
            throw new UsageException("--allow-missing applies only to --reduce, which writes the summary after the shards.");
        }

        if (a.Reduce && a.PricesDir is null && a.ComputingGiven.Count > 0)
        {
            throw new UsageException($"--reduce without --prices-dir takes every option from the shards' plan ({BatchPlan.FileName} in --out), so {string.Join(", ", a.ComputingGiven)} would not be checked; "
                + "give only --out (and --allow-missing), or the shards' options from --prices-dir on, to have them checked against the plan.");
        }
    }

    private static int Reduce(CliConsole console, string outputFolder, BatchRequest? request, bool allowMissing)
    {
        BatchReduceOutcome outcome;
        try
        {
            // The first Ctrl-C stops the reduce before the summary files go into place (they are written in full first and
            // then moved in together), so summary.csv and summary.html never come from two reduces. A second one ends the
            // process at once, after the moves under way.
            outcome = BatchReducer.Reduce(outputFolder, request, allowMissing, console.Interrupt);
        }
        catch (OperationCanceledException) when (console.Interrupt.IsCancellationRequested)
        {
            console.Error.WriteLine($"interrupted: the reduce was stopped before it wrote the summary; nothing in {outputFolder} was changed.");
            return ExitCodes.Interrupted;
        }

        foreach (var warning in outcome.Warnings)
        {
            console.Error.WriteLine("warning: " + warning);
        }

        foreach (var row in outcome.Rows.Where(r => !r.Succeeded && !outcome.Missing.Any(m => m.StartsWith(r.Name + " (", StringComparison.Ordinal))))
        {
            console.Error.WriteLine($"error: {row.Name}: {row.Error}");
        }

        if (outcome.Missing.Count > 0)
        {
            console.Error.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"error: {outcome.Missing.Count} of {outcome.Rows.Count} names have no finished results in {outputFolder}: {string.Join("; ", outcome.Missing)}."));
            console.Error.WriteLine(outcome.Written
                ? "warning: --allow-missing: the summary is partial; those names are marked as not finished in it."
                : "error: no summary written; if shards are still running, reduce again when they have ended; otherwise rerun the shards that own those names (a rerun computes only what is missing), or pass --allow-missing for a partial summary.");
        }

        if (outcome.Written)
        {
            console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"{outcome.Rows.Count} names reduced: {outcome.Rows.Count - outcome.Failed - outcome.Missing.Count} finished, {outcome.Failed} failed, {outcome.Missing.Count} not finished."));
            console.Out.WriteLine($"wrote {outputFolder}{Path.DirectorySeparatorChar} (summary.csv, lookbacks.csv, beats-implied.csv, forecasts-long.csv{(outcome.Reports == BatchReports.None ? string.Empty : ", summary.html")})");
        }

        return outcome.Failed > 0 || (outcome.Missing.Count > 0 && !allowMissing) ? ExitCodes.BadInput : ExitCodes.Success;
    }

    private static int Run(CliConsole console, Arguments a)
    {
        CheckCombinations(a);
        if (a.Reduce && a.PricesDir is null)
        {
            var folder = a.Out ?? Path.Combine("reports", "batch");
            OutputChecks.Folder(folder);
            return Reduce(console, folder, null, a.AllowMissing);
        }

        var request = Request(a);
        if (a.Reduce)
        {
            return Reduce(console, request.OutputFolder, request, a.AllowMissing);
        }

        var progress = new BatchConsoleProgress(console.Out, ConsoleProgress.IsTerminal(console.Out));
        BatchOutcome outcome;
        try
        {
            // The first Ctrl-C lets running names stop between forecasters and keeps every finished one; a second ends the process.
            outcome = BatchRunner.Run(request, progress, console.Interrupt);
        }
        finally
        {
            progress.Finish();
        }

        foreach (var row in outcome.Rows.Where(r => !r.Succeeded))
        {
            console.Error.WriteLine($"error: {row.Name}: {row.Error}");
        }

        if (outcome.Cancelled)
        {
            // Stopped before the first name finished, there is no assets folder of this run to point to.
            console.Out.WriteLine(outcome.Rows.Count == 0
                ? "batch stopped before any name finished; no results were written. Run the same command again to start."
                : string.Create(CultureInfo.InvariantCulture,
                    $"batch stopped: {outcome.Rows.Count} {(outcome.Rows.Count == 1 ? "name" : "names")} finished and kept in {request.OutputFolder}{Path.DirectorySeparatorChar}assets; run the same command again to resume."));
            return ExitCodes.Interrupted;
        }

        console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"{(request.Shard is { } sh ? $"shard {sh}: " : string.Empty)}{outcome.Rows.Count} names: {outcome.Computed - outcome.Failed} computed, {outcome.Reused} kept from an earlier run, {outcome.Failed} failed."));
        if (request.Shard is not null)
        {
            console.Out.WriteLine($"wrote {request.OutputFolder}{Path.DirectorySeparatorChar}assets/ (no summary from a shard: when every shard has finished, run volcast batch --reduce --out {request.OutputFolder})");
            return outcome.Failed > 0 ? ExitCodes.BadInput : ExitCodes.Success;
        }

        console.Out.WriteLine($"wrote {request.OutputFolder}{Path.DirectorySeparatorChar} (assets/NAME/, summary.csv, lookbacks.csv, beats-implied.csv, forecasts-long.csv{(request.Reports == BatchReports.None ? string.Empty : ", summary.html")})");
        return outcome.Failed > 0 ? ExitCodes.BadInput : ExitCodes.Success;
    }

    private sealed record Arguments(
        string? PricesDir, string? ImpliedDir, string? IvUnit, string? Config, int? Horizon, string? Tenor, string? Out, int? Jobs, bool Force,
        string? ImpliedTenor, string Reports, string? Shard, int? Shards, bool Reduce, bool AllowMissing, ParseResult Parse, InputFormatOptions FormatOptions, string? Suspect, bool SkipBadRows, bool Workbook)
    {
        /// <summary>Gets the options that say what to compute which were given on the command line, by name.</summary>
        public IReadOnlyList<string> ComputingGiven { get; init; } = [];
    }
}
