using System.CommandLine;
using System.Globalization;
using VolCast.Core.Estimators;
using VolCast.IO;
using VolCast.IO.Config;
using VolCast.IO.Csv;

namespace VolCast.Cli.Commands;

/// <summary><c>volcast estimate</c>: a rolling volatility series from one estimator at one window.</summary>
internal static class EstimateCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliConsole console)
    {
        var prices = new Option<FileInfo>("--prices")
        {
            Description = "Daily price history CSV: date,open,high,low,close (optional adj_close, volume), or date,close for close-to-close only.",
            Required = true,
        };
        var estimator = new Option<string>("--estimator")
        {
            Description = "Estimator: " + string.Join(", ", EstimatorNames.All) + ".",
            Required = true,
        };
        var window = new Option<int>("--window")
        {
            Description = $"Window length in trading days, {SettingLimits.Window}. Close-to-close and Yang-Zhang use one more close, for the first return.",
            Required = true,
        };
        var annualization = new Option<double>("--annualization")
        {
            Description = $"Trading days per year used to annualize (vol = sqrt(A * daily variance)), {SettingLimits.AnnualizationFactor}.",
            DefaultValueFactory = _ => 252,
        };
        var zeroMean = new Option<bool>("--zero-mean")
        {
            Description = "Close-to-close only: root mean square of returns (divisor N) instead of the sample standard deviation (mean removed, divisor N-1).",
        };
        var output = new Option<FileInfo?>("--out") { Description = "Output CSV (date,vol). Written to standard output when omitted." };
        var force = new Option<bool>("--force") { Description = "Replace the output file if it exists." };
        var command = new Command(
            "estimate",
            "Write a rolling annualized volatility series as CSV (date,vol; decimal, 0.20 = 20%), one row per date with a full window.")
        {
            prices, estimator, window, annualization, zeroMean, output, force,
        };
        var formatOptions = InputFormatOptions.AddTo(command);

        command.SetAction(parse => console.Execute(() =>
        {
            var name = parse.GetValue(estimator)!;
            if (!EstimatorNames.TryParse(name, out var kind))
            {
                throw new UsageException($"unknown estimator '{name}'; expected one of: {string.Join(", ", EstimatorNames.All)}.");
            }

            var n = parse.GetValue(window);
            SettingLimits.Window.Check(n, "--window");
            var a = parse.GetValue(annualization);
            SettingLimits.AnnualizationFactor.Check(a, "--annualization");

            var pricesPath = parse.GetValue(prices)!.ToString();
            var outFile = parse.GetValue(output);
            if (outFile is not null)
            {
                OutputChecks.OutputFile(outFile.ToString());
                OutputGuard.RefuseInputs([outFile.ToString()], [pricesPath]);
            }

            var load = PriceFileReader.Read(pricesPath, formatOptions.Resolve(parse));
            foreach (var warning in load.Warnings)
            {
                console.Warn(warning.Line is int line ? $"{warning.File}, line {line}: {warning.Message}" : $"{warning.File}: {warning.Message}");
            }

            var history = load.History;
            if (EstimatorNames.NeedsRange(kind) && !history.HasRange)
            {
                throw new InputDataException(pricesPath, null, null,
                    $"the {EstimatorNames.Name(kind)} estimator needs open, high and low columns, but the file has date and close only; use close-to-close or supply OHLC data.");
            }

            var needed = RollingVolatility.BarsNeeded(kind, n);
            if (history.Count < needed)
            {
                throw new InputDataException(pricesPath, null, null, string.Create(CultureInfo.InvariantCulture,
                    $"a {EstimatorNames.Name(kind)} window of {n} needs at least {needed} rows of prices, but the file has {history.Count}; use a shorter --window or a longer history."));
            }

            var series = RollingVolatility.Compute(history, kind, n, a, parse.GetValue(zeroMean));
            var dates = history.Dates.Slice(series.FirstIndex, series.Count);
            if (console.Stopped(outFile is null ? "the estimate was stopped before it wrote its series." : $"the estimate was stopped before it was written; {outFile} was left as it was."))
            {
                return ExitCodes.Interrupted;
            }

            if (outFile is null)
            {
                HistoryCsv.WriteSeries(console.Out, "vol", dates, series.AnnualizedVolatility);
            }
            else
            {
                var values = series.AnnualizedVolatility.ToArray();
                var dateArray = dates.ToArray();
                AtomicFile.WriteText(outFile.ToString(), w => HistoryCsv.WriteSeries(w, "vol", dateArray, values), parse.GetValue(force), [pricesPath]);
                console.Error.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"wrote {series.Count} rows of {EstimatorNames.Name(kind)}:{n} volatility to {outFile}"));
            }

            return ExitCodes.Success;
        }));
        return command;
    }
}
