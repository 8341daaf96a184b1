using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Scoring;
using VolCast.IO;
using VolCast.IO.Config;

namespace VolCast.Cli.Commands;

/// <summary>
/// <c>volcast demo</c>: runs the full backtest on the invented scenario in data-demo/ with its committed configuration
/// and writes the report to reports/demo/; with <c>--regenerate</c>, rewrites data-demo/ from its seeds instead.
/// </summary>
internal static class DemoCommand
{
    /// <summary>The data folder's name.</summary>
    public const string DataFolderName = "data-demo";

    /// <summary>Builds the command.</summary>
    public static Command Create(CliConsole console)
    {
        var output = new Option<string?>("--out")
        {
            Description = "Output folder. Default reports/demo beside data-demo, which is replaced each time (the default is implicitly --force, for reports/demo only). Another folder must not exist unless --force.",
        };
        var force = new Option<bool>("--force") { Description = "Use an existing --out folder, replacing only volcast's own files in it." };
        var data = new Option<string?>("--data")
        {
            Description = "The demo data folder. Default: data-demo in the current folder, else the data-demo of the source tree volcast was built from.",
        };
        var regenerate = new Option<bool>("--regenerate")
        {
            Description = "Instead of running the demo, rewrite the demo data (index, implied, option quotes, second asset, configuration, 20-name universe) bit for bit from their seeds into --data (default data-demo), replacing those files.",
        };
        var forecasts = new Option<string?>("--forecasts")
        {
            Description = "Your own volatility forecasts, CSV (date, NAME1, NAME2, …), scored beside the demo's forecasters as user:NAME; for example data-demo/alder-ridge-expected-vol-30d.csv, the scenario's own expected volatility. Relative to the working folder; overrides the demo configuration's forecastsFile.",
        };
        var forecastsUnit = new Option<string?>("--forecasts-unit") { Description = "Unit of the forecasts file: percent (20 = 20%) or decimal (0.20); inferred with a warning when left out." };
        forecastsUnit.AcceptOnlyFromAmong("percent", "decimal");
        var command = new Command(
            "demo",
            "Run the full backtest on the invented demo scenario (data-demo/: every forecaster, the lookback sweep and adaptive choice, model confidence set, rule test, baseline yang-zhang:21 against candidate garch) and write report.html, the charts and the results to reports/demo/.")
        {
            output, force, data, regenerate, forecasts, forecastsUnit,
        };
        command.SetAction(parse => console.Execute(() => parse.GetValue(regenerate)
            ? Regenerate(console, parse.GetValue(data))
            : Run(console, parse.GetValue(data), parse.GetValue(output), parse.GetValue(force), (parse.GetValue(forecasts), parse.GetValue(forecastsUnit)))));
        return command;
    }

    /// <summary>
    /// Finds data-demo: the current folder's, else the one beside VolCast.sln above the tool's own folder, else (with
    /// <paramref name="besideTool"/>) the copy installed beside the tool; null when none exists.
    /// </summary>
    /// <remarks>The repository's copy comes before the installed one so that a build inside the repository runs (and
    /// <c>--regenerate</c> rewrites) the data the repository holds, and its run records name the same paths.</remarks>
    internal static string? FindDataFolder(bool besideTool = false)
    {
        var local = Path.GetFullPath(DataFolderName);
        if (File.Exists(Path.Combine(local, DemoFiles.Index)))
        {
            return local;
        }

        if (FindRepositoryDataFolder() is string repository)
        {
            return repository;
        }

        var installed = Path.Combine(AppContext.BaseDirectory, DataFolderName);
        return besideTool && File.Exists(Path.Combine(installed, DemoFiles.Index)) ? installed : null;
    }

    /// <summary>Gets whether a data folder is the copy installed beside the tool (its reports must not be written there).</summary>
    internal static bool IsBesideTool(string folder) =>
        string.Equals(Path.GetFullPath(folder).TrimEnd(Path.DirectorySeparatorChar), Path.Combine(AppContext.BaseDirectory, DataFolderName).TrimEnd(Path.DirectorySeparatorChar), StringComparison.Ordinal);

    private static string? FindRepositoryDataFolder()
    {
        for (var folder = new DirectoryInfo(AppContext.BaseDirectory); folder is not null; folder = folder.Parent)
        {
            if (File.Exists(Path.Combine(folder.FullName, "VolCast.sln")))
            {
                var candidate = Path.Combine(folder.FullName, DataFolderName);
                return File.Exists(Path.Combine(candidate, DemoFiles.Index)) ? candidate : null;
            }
        }

        return null;
    }

    private static int Regenerate(CliConsole console, string? data)
    {
        var folder = Path.GetFullPath(data ?? FindDataFolder() ?? DataFolderName);
        int days;
        try
        {
            days = DemoFiles.Regenerate(folder, console.Interrupt);
        }
        catch (OperationCanceledException) when (console.Interrupt.IsCancellationRequested)
        {
            console.Error.WriteLine($"interrupted: the demo data was stopped before it was written; the files in {Shown(folder)} were left as they were.");
            return ExitCodes.Interrupted;
        }

        console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"wrote the demo scenario ({days} trading days of the index, {DemoFiles.GeneratedFiles.Count} files with the universe) to {Shown(folder)}"));
        return ExitCodes.Success;
    }

    private static int Run(CliConsole console, string? data, string? output, bool force, (string? File, string? Unit) forecasts)
    {
        var clock = Stopwatch.StartNew();
        var folder = data is null ? FindDataFolder(besideTool: true) : Path.GetFullPath(data);
        if (folder is null)
        {
            throw new InputDataException(DataFolderName, null, null,
                "the demo data folder was not found in the current folder, beside VolCast.sln above the tool's folder, nor installed beside the tool; pass --data DIR (create it with volcast demo --regenerate --data DIR).");
        }

        foreach (var name in new[] { DemoFiles.Index, DemoFiles.Implied, DemoFiles.Config })
        {
            if (!File.Exists(Path.Combine(folder, name)))
            {
                throw new InputDataException(Shown(Path.Combine(folder, name)), null, null,
                    "this demo file is missing; regenerate the demo data with volcast demo --regenerate" + (data is null ? "." : " --data " + data + "."));
            }
        }

        // With no --out the demo replaces its own report: the README's main command must run again and again.
        // The copy installed beside the tool is read only: its report goes to reports/demo under the current folder.
        var outFolder = output is null
            ? Path.Combine(data is null && IsBesideTool(folder) ? Directory.GetCurrentDirectory() : Path.GetDirectoryName(folder)!, "reports", "demo")
            : Path.GetFullPath(output);
        var replace = output is null || force;
        if (Directory.Exists(outFolder) && !replace)
        {
            throw new UsageException($"{output}: the output folder already exists; choose another --out or pass --force to replace its results files.");
        }

        var config = Shown(Path.Combine(folder, DemoFiles.Config));
        var settings = BacktestConfigFile.Read(config);

        // The demo's configuration is read as backtest --config reads it: its input form, implied tenor and row checks hold too.
        var (format, impliedTenor) = InputFormatOptions.FromConfig(config);
        var job = new BacktestJob(Shown(Path.Combine(folder, DemoFiles.Index)), Shown(Path.Combine(folder, DemoFiles.Implied)), ImpliedUnit.Decimal, settings, config, Shown(outFolder), replace)
        {
            Format = format ?? CsvFormat.Default,
            ImpliedTenorDays = impliedTenor,
            Checks = BacktestOptions.Checks(config, null, skipBadRows: false),
        };

        // The user's own forecasts: --forecasts (relative to the working folder), else the configuration's forecastsFile
        // and eventsFile (relative to the data folder, where the configuration is).
        var (configForecasts, configUnit) = BacktestConfigFile.ReadForecasts(config);
        job = job with
        {
            Forecasts = forecasts.File ?? configForecasts,
            ForecastsUnit = forecasts.Unit is null ? configUnit : BacktestOptions.Unit(forecasts.Unit),
            Events = BacktestConfigFile.ReadEventsFile(config),
        };
        var progress = new ConsoleProgress(console.Out, ConsoleProgress.IsTerminal(console.Out));
        BacktestResult result;
        try
        {
            // As in backtest: the first Ctrl-C stops the run at its next check and nothing is moved into place; a second ends the process.
            result = BacktestPipeline.Run(job, console.Warn, progress, cancellationToken: console.Interrupt).Result;
        }
        catch (OperationCanceledException) when (console.Interrupt.IsCancellationRequested)
        {
            console.Error.WriteLine($"interrupted: the demo was stopped before it finished; no results were written to {Shown(outFolder)}.");
            return ExitCodes.Interrupted;
        }
        finally
        {
            progress.Finish();
        }

        var ranked = result.Metrics.Where(m => m.Kind != ForecastKind.Implied && m.Losses is not null).OrderBy(m => m.Losses!.Qlike).FirstOrDefault();
        var head = result.CandidateVersusBaseline;
        var c = CultureInfo.InvariantCulture;
        console.Out.WriteLine(string.Create(c,
            $"{result.Dates.Length} forecast dates, {result.Forecasts.Length} forecasters, horizon {result.Settings.Horizon}; first on QLIKE: {ranked?.Spec ?? "none"}; candidate {result.Candidate} vs baseline {result.Baseline}: DM QLIKE {head.Qlike?.Statistic:0.00} ({(head.Qlike?.PValue is double p ? PValueText.Clause(p) : "p n/a")})."));
        console.Out.WriteLine(string.Create(c,
            $"wrote {Path.Combine(Shown(outFolder), "report.html")} (open it in a browser) with the charts and results beside it, in {clock.Elapsed.TotalSeconds:0.0} s."));
        return ExitCodes.Success;
    }

    // Paths under the current folder are shown (and recorded in run.json and the report) relative to it.
    private static string Shown(string fullPath)
    {
        var relative = Path.GetRelativePath(Directory.GetCurrentDirectory(), fullPath);
        return relative.StartsWith("..", StringComparison.Ordinal) || Path.IsPathRooted(relative) ? fullPath : relative;
    }
}
