using System.CommandLine;
using System.Globalization;
using VolCast.Core.Cone;
using VolCast.Core.Data;
using VolCast.IO;
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
        var prices = new Option<FileInfo>("--prices")
        {
            Description = "Daily price history CSV (date and close at least).",
            Required = true,
        };
        var implied = new Option<FileInfo?>("--implied") { Description = "Implied volatility CSV (date,iv); its latest value is drawn on the cone." };
        var impliedHorizon = new Option<int>("--implied-horizon")
        {
            Description = "Trading days the implied volatility covers, where it is drawn on the cone (21 for a 30-day tenor).",
            DefaultValueFactory = _ => 21,
        };
        var output = new Option<DirectoryInfo>("--out")
        {
            Description = "Output folder for cone.png and cone.csv; must not hold them already unless --force.",
            DefaultValueFactory = _ => new DirectoryInfo("cone"),
        };
        var force = new Option<bool>("--force") { Description = "Replace cone.png and cone.csv if they exist." };
        var command = new Command(
            "cone",
            "Draw the volatility cone: percentiles (min, 10, 25, 50, 75, 90, max) of zero-mean close-to-close realized volatility over every window of 5 to 252 trading days, adjusted for overlapping windows (Hodges-Tompkins).")
        {
            prices, implied, impliedHorizon, output, force,
        };
        var formatOptions = InputFormatOptions.AddTo(command);

        command.SetAction(parse => console.Execute(() =>
        {
            var horizon = parse.GetValue(impliedHorizon);
            if (horizon < 1)
            {
                throw new UsageException(string.Create(CultureInfo.InvariantCulture, $"--implied-horizon must be at least 1 trading day (was {horizon})."));
            }

            var format = formatOptions.Resolve(parse);
            var pricesPath = parse.GetValue(prices)!.ToString();
            var impliedFile = parse.GetValue(implied);
            var inputs = new List<string> { pricesPath };
            if (impliedFile is not null)
            {
                inputs.Add(impliedFile.ToString());
            }

            var folder = parse.GetValue(output)!.ToString();
            var overwrite = parse.GetValue(force);
            var pngPath = Path.Combine(folder, "cone.png");
            var csvPath = Path.Combine(folder, "cone.csv");
            OutputGuard.RefuseInputs([pngPath, csvPath], inputs);
            foreach (var target in new[] { pngPath, csvPath })
            {
                if (!overwrite && File.Exists(target))
                {
                    throw new IOException($"{target}: the output file already exists; choose another --out or pass --force to replace it.");
                }
            }

            var load = PriceFileReader.Read(pricesPath, format);
            foreach (var warning in load.Warnings)
            {
                console.Warn(warning.ToString());
            }

            var returns = Returns.LogReturns(load.History.Close);
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

            var overlays = new List<ConeOverlay>();
            if (impliedFile is not null)
            {
                var impliedLoad = ImpliedFileReader.Read(impliedFile.ToString(), ImpliedUnit.Infer, format);
                foreach (var warning in impliedLoad.Warnings)
                {
                    console.Warn(warning.ToString());
                }

                var latest = LatestOnOrBefore(impliedLoad.Series, load.History.Dates[^1]);
                if (latest is (DateOnly date, double iv))
                {
                    overlays.Add(new ConeOverlay(string.Create(CultureInfo.InvariantCulture, $"implied {date:yyyy-MM-dd}"), horizon, iv));
                }
                else
                {
                    console.Warn($"{impliedFile}: no implied volatility on or before the last price date; the cone is drawn without it.");
                }
            }

            var chart = ReportCharts.Cone(cone, overlays);
            AtomicFile.WriteText(csvPath, w => ConeCsv.Write(w, cone), overwrite, inputs);
            AtomicFile.WriteBytes(pngPath, chart.Png, overwrite);
            console.Error.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"wrote the volatility cone ({cone.Horizons.Count} horizons from {returns.Length} daily returns) to {csvPath} and {pngPath}"));
            return ExitCodes.Success;
        }));
        return command;
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
}
