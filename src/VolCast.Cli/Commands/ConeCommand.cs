using System.CommandLine;
using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Cone;
using VolCast.Core.Data;
using VolCast.IO;
using VolCast.IO.Config;
using VolCast.IO.Csv;
using VolCast.Reports.Charts;
using VolCast.Reports.Html;
using VolCast.Reports.Model;

namespace VolCast.Cli.Commands;

/// <summary><c>volcast cone</c>: the volatility cone of a price history as cone.png and cone.csv.</summary>
internal static class ConeCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliConsole console)
    {
        var options = ConeOptions.Define();
        var command = new Command(
            "cone",
            "Draw the volatility cone: percentiles (min, 10, 25, 50, 75, 90, max) of zero-mean close-to-close realized volatility over every window of 5 to 252 trading days, adjusted for overlapping windows (Hodges-Tompkins).")
        {
            options.Prices, options.Implied, options.ImpliedHorizon, options.ImpliedTenor, options.Output, options.Force,
        };
        var formatOptions = InputFormatOptions.AddTo(command);

        command.SetAction(parse => console.Execute(() => Run(console, ConeRequest.Read(parse, options), formatOptions.Resolve(parse))));
        return command;
    }

    private static int Run(CliConsole console, ConeRequest request, CsvFormat format)
    {
        RefuseExisting(request);
        var load = PriceFileReader.Read(request.PricesPath, format);
        foreach (var warning in load.Warnings)
        {
            console.Warn(warning.ToString());
        }

        var returns = Returns.LogReturns(load.History.Close);
        var cone = ComputeCone(console, request.PricesPath, returns);
        var overlays = ImpliedOverlays(console, request, load.History.Dates[^1], format);
        var chart = ReportCharts.Cone(cone, overlays);
        if (console.Stopped($"the cone was stopped before it was written; {request.CsvPath} and {request.PngPath} were left as they were."))
        {
            return ExitCodes.Interrupted;
        }

        // The two files as one set: a stop or a failure never leaves a new cone.csv beside an old cone.png.
        using var files = new AtomicFileSet();
        files.AddText(request.CsvPath, w => ConeCsv.Write(w, cone), request.Overwrite, request.Inputs);
        files.AddBytes(request.PngPath, chart.Png, request.Overwrite);
        Interruption.Process.Uninterrupted(files.Commit);
        console.Error.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"wrote the volatility cone ({cone.Horizons.Count} horizons from {returns.Length} daily returns) to {request.CsvPath} and {request.PngPath}"));
        return ExitCodes.Success;
    }

    private static void RefuseExisting(ConeRequest request)
    {
        OutputGuard.RefuseInputs([request.PngPath, request.CsvPath], request.Inputs);
        foreach (var target in new[] { request.PngPath, request.CsvPath })
        {
            if (!request.Overwrite && File.Exists(target))
            {
                throw new IOException($"{target}: the output file already exists; choose another --out or pass --force to replace it.");
            }
        }
    }

    private static VolatilityConeResult ComputeCone(CliConsole console, string pricesPath, double[] returns)
    {
        var cone = VolatilityCone.Compute(returns, VolatilityCone.DefaultHorizons);
        if (cone.Horizons.Count == 0)
        {
            throw new InputDataException(pricesPath, null, null, string.Create(CultureInfo.InvariantCulture,
                $"the file gives {returns.Length} daily returns; the shortest cone horizon (5 days) needs at least 14. Supply a longer history."));
        }

        foreach (var skipped in cone.SkippedHorizons)
        {
            console.Warn(string.Create(CultureInfo.InvariantCulture,
                $"the {skipped}-day horizon needs at least {(3 * skipped) - 1} daily returns (the file gives {returns.Length}); it is left out of the cone."));
        }

        return cone;
    }

    /// <summary>The latest implied volatility on or before the last price date, drawn at the implied horizon; none without an implied file.</summary>
    private static List<ConeOverlay> ImpliedOverlays(CliConsole console, ConeRequest request, DateOnly lastPriceDate, CsvFormat format)
    {
        var overlays = new List<ConeOverlay>();
        if (request.ImpliedFile is not { } impliedFile)
        {
            return overlays;
        }

        var impliedLoad = ImpliedFileReader.Read(impliedFile.ToString(), ImpliedUnit.Infer, format);
        foreach (var warning in impliedLoad.Warnings)
        {
            console.Warn(warning.ToString());
        }

        var latest = LatestOnOrBefore(impliedLoad.Series, lastPriceDate);
        if (latest is (DateOnly date, double iv))
        {
            overlays.Add(new ConeOverlay(string.Create(CultureInfo.InvariantCulture, $"implied {date:yyyy-MM-dd}"), request.ImpliedHorizon, iv));
        }
        else
        {
            console.Warn($"{impliedFile}: no implied volatility on or before the last price date; the cone is drawn without it.");
        }

        return overlays;
    }

    private static (DateOnly Date, double Volatility)? LatestOnOrBefore(ImpliedSeries series, DateOnly last)
    {
        for (var i = series.Count - 1; i >= 0; i--)
        {
            if (series.Dates[i] <= last)
            {
                return (series.Dates[i], series.Volatility[i]);
            }
        }

        return null;
    }

    /// <summary>The command's options.</summary>
    private sealed record ConeOptions(Option<FileInfo> Prices, Option<FileInfo?> Implied, Option<int?> ImpliedHorizon, Option<string?> ImpliedTenor, Option<DirectoryInfo> Output, Option<bool> Force)
    {
        public static ConeOptions Define() => new(
            new Option<FileInfo>("--prices")
            {
                Description = "Daily price history CSV (date and close at least).",
                Required = true,
            },
            new Option<FileInfo?>("--implied") { Description = "Implied volatility CSV (date,iv); its latest value is drawn on the cone." },
            new Option<int?>("--implied-horizon")
            {
                Description = $"Trading days the implied volatility covers, where it is drawn on the cone, {SettingLimits.Horizon} (default 21, a 30-day tenor).",
            },
            new Option<string?>("--implied-tenor")
            {
                Description = $"The same as a calendar tenor such as 30d ({SettingLimits.TenorDays}), drawn at round(days × 252 / 365) trading days; give this or --implied-horizon, not both.",
            },
            new Option<DirectoryInfo>("--out")
            {
                Description = "Output folder for cone.png and cone.csv; must not hold them already unless --force.",
                DefaultValueFactory = _ => new DirectoryInfo("cone"),
            },
            new Option<bool>("--force") { Description = "Replace cone.png and cone.csv if they exist." });
    }

    /// <summary>One cone run as the command line asked for it: the inputs, the implied horizon and the two output paths.</summary>
    private sealed record ConeRequest(
        string PricesPath, FileInfo? ImpliedFile, int ImpliedHorizon, List<string> Inputs, string PngPath, string CsvPath, bool Overwrite)
    {
        public static ConeRequest Read(ParseResult parse, ConeOptions options)
        {
            var horizon = ImpliedHorizonDays(parse.GetValue(options.ImpliedHorizon), parse.GetValue(options.ImpliedTenor));

            var pricesPath = parse.GetValue(options.Prices)!.ToString();
            var impliedFile = parse.GetValue(options.Implied);
            var inputs = new List<string> { pricesPath };
            if (impliedFile is not null)
            {
                inputs.Add(impliedFile.ToString());
            }

            var folder = parse.GetValue(options.Output)!.ToString();
            return new ConeRequest(
                pricesPath, impliedFile, horizon, inputs, Path.Combine(folder, "cone.png"), Path.Combine(folder, "cone.csv"), parse.GetValue(options.Force));
        }

        /// <summary>The implied horizon in trading days from --implied-horizon or --implied-tenor (21 when neither is given), checked against its range.</summary>
        private static int ImpliedHorizonDays(int? days, string? tenor)
        {
            if (days is not null && tenor is not null)
            {
                throw new UsageException("give either --implied-horizon (trading days) or --implied-tenor (calendar days such as 30d), not both.");
            }

            if (tenor is null)
            {
                SettingLimits.Horizon.Check(days ?? 21, "--implied-horizon");
                return days ?? 21;
            }

            var calendarDays = SettingLimits.TenorDaysOf(tenor, "--implied-tenor")
                ?? throw new UsageException($"--implied-tenor must be a number of calendar days followed by d, such as 30d, {SettingLimits.TenorDays} (was {BacktestOptions.Shown(tenor)}).");
            return BacktestHorizon.Tenor(calendarDays).NominalDays;
        }
    }
}
