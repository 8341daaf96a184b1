using System.CommandLine;
using System.Globalization;
using VolCast.Core.Data;
using VolCast.Core.Garch;
using VolCast.IO;
using VolCast.IO.Config;
using VolCast.IO.Results;

namespace VolCast.Cli.Commands;

/// <summary><c>volcast fit</c>: fits GARCH(1,1) or GJR-GARCH(1,1) to a whole price history and writes the parameters and diagnostics as JSON.</summary>
internal static class FitCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliConsole console)
    {
        var prices = new Option<string>("--prices")
        {
            Description = "Daily price history CSV (date, open, high, low, close; or date, close). Read only.",
            Required = true,
        };
        var model = new Option<string>("--model")
        {
            Description = "The model: garch (GARCH(1,1)) or gjr-garch (GJR-GARCH(1,1), with a leverage term for negative returns).",
            Required = true,
        };
        model.AcceptOnlyFromAmong("garch", "gjr-garch");
        var zeroMean = new Option<bool>("--zero-mean") { Description = "Fix the mean daily return at zero instead of estimating it." };
        var annualization = new Option<double>("--annualization")
        {
            Description = $"Trading days per year for the long-run annualized volatility, {SettingLimits.AnnualizationFactor}.",
            DefaultValueFactory = _ => 252.0,
        };
        var start = new Option<string>("--variance-start")
        {
            Description = "How the variance recursion starts: backcast (the day before the first return gets the mean squared residual as both its variance and its squared return, the start of the Fiorentini-Calzolari-Panattoni GARCH benchmark and of R's fGarch) or sample-variance (the first day's variance is the mean squared residual, the start used before).",
            DefaultValueFactory = _ => "backcast",
        };
        start.AcceptOnlyFromAmong("backcast", "sample-variance");
        var output = new Option<string?>("--out") { Description = "Output JSON file (default fit-<model>.json in the current folder)." };
        var force = new Option<bool>("--force") { Description = "Replace the output file if it exists." };
        var command = new Command("fit", "Fit GARCH(1,1) or GJR-GARCH(1,1) by Gaussian quasi-maximum likelihood to the daily log returns of a price history; writes JSON with parameters (decimal log-return units), log-likelihood (of decimal returns, and of the same returns in percent), persistence, half-life, long-run volatility, convergence and standard errors.")
        {
            prices, model, zeroMean, annualization, start, output, force,
        };
        var formatOptions = InputFormatOptions.AddTo(command);
        command.SetAction(parse => console.Execute(() => Run(
            console,
            parse.GetValue(prices)!,
            parse.GetValue(model) == "gjr-garch" ? GarchVariant.GjrGarch : GarchVariant.Garch,
            !parse.GetValue(zeroMean),
            parse.GetValue(annualization),
            parse.GetValue(start) == "sample-variance" ? VarianceStart.SampleVariance : VarianceStart.Backcast,
            parse.GetValue(output),
            parse.GetValue(force),
            formatOptions.Resolve(parse))));
        return command;
    }

    private static int Run(CliConsole console, string pricesPath, GarchVariant variant, bool includeMean, double annualization, VarianceStart start, string? outPath, bool force, CsvFormat format)
    {
        var modelName = variant == GarchVariant.GjrGarch ? "gjr-garch" : "garch";
        var startText = StartText(start);
        SettingLimits.AnnualizationFactor.Check(annualization, "--annualization");

        var output = outPath ?? $"fit-{modelName}.json";
        OutputChecks.OutputFile(output);
        OutputGuard.RefuseInputs([output], [pricesPath]);

        if (!force && File.Exists(output))
        {
            throw new UsageException($"{output}: the file already exists; choose another --out or pass --force to replace it.");
        }

        var load = PriceFileReader.Read(pricesPath, format);
        foreach (var warning in load.Warnings)
        {
            console.Warn(warning.ToString());
        }

        var returns = Returns.LogReturns(load.History.Close);
        if (returns.Length < GarchFitter.MinimumReturns)
        {
            throw new InputDataException(pricesPath, null, null, string.Create(CultureInfo.InvariantCulture,
                $"a {modelName} fit ({startText}) needs at least {GarchFitter.MinimumReturns} daily returns ({GarchFitter.MinimumReturns + 1} prices); the file has {load.History.Count} prices. Supply a longer history."));
        }

        GarchFit fit;
        try
        {
            fit = GarchFitter.Fit(returns, new GarchFitOptions { Variant = variant, IncludeMean = includeMean, AnnualizationFactor = annualization, Start = start });
        }
        catch (ArgumentException ex) when (ex.ParamName == "returns")
        {
            // Only the fitter's checks of the data become bad input; any other argument error is a bug and stays one (exit 1).
            throw new InputDataException(pricesPath, null, "close", string.Create(CultureInfo.InvariantCulture,
                $"a {modelName} fit ({startText}) cannot use the daily log returns of these {load.History.Count} prices: {WithoutParameterName(ex.Message)} A fit needs at least {GarchFitter.MinimumReturns} finite daily returns that are not all equal; supply a longer history in which prices move."));
        }

        if (console.Stopped($"the fit was stopped before it was written; {output} was left as it was."))
        {
            return ExitCodes.Interrupted;
        }

        AtomicFile.WriteText(output, writer => GarchFitJson.Write(writer, fit), force, [pricesPath]);
        WriteSummary(console, fit, modelName, output);
        return ExitCodes.Success;
    }

    /// <summary>Names the start of the variance recursion for messages.</summary>
    private static string StartText(VarianceStart start) => start == VarianceStart.SampleVariance
        ? "variance start sample-variance: first day's variance = mean squared residual"
        : "variance start backcast: the day before the first return has variance and squared return = mean squared residual";

    /// <summary>Drops the " (Parameter 'returns')" that .NET appends to an argument error: users never see parameter names.</summary>
    private static string WithoutParameterName(string message)
    {
        var cut = message.IndexOf(" (Parameter '", StringComparison.Ordinal);
        return cut >= 0 ? message[..cut] : message;
    }

    private static void WriteSummary(CliConsole console, GarchFit fit, string modelName, string output)
    {
        var p = fit.Parameters;
        var c = CultureInfo.InvariantCulture;
        var mean = fit.IncludeMean ? string.Create(c, $"mu={p.Mu:G6}, ") : string.Empty;
        var gamma = fit.Variant == GarchVariant.GjrGarch ? string.Create(c, $", gamma={p.Gamma:G6}") : string.Empty;
        console.Out.WriteLine(string.Create(c,
            $"{modelName}{(fit.IncludeMean ? string.Empty : " (zero mean)")} on {fit.ObservationCount} daily log returns: {mean}omega={p.Omega:G6}, alpha={p.Alpha:G6}, beta={p.Beta:G6}{gamma}"));
        var halfLife = fit.HalfLifeDays is double h ? string.Create(c, $"{h:F1} days") : "none (not stationary)";
        var longRun = fit.LongRunVolatility is double v ? string.Create(c, $"{v * 100:F2}%") : "none (not stationary)";
        console.Out.WriteLine(string.Create(c,
            $"persistence {fit.Persistence:F4}, half-life {halfLife}, long-run volatility {longRun} a year, {(fit.Converged ? "converged" : "NOT converged")} after {fit.Iterations} steps"));
        console.Out.WriteLine(string.Create(c,
            $"log-likelihood {fit.LogLikelihood:F4} with returns in decimals ({GarchFitJson.PercentLogLikelihood(fit):F4} with returns in percent); {StartText(fit.Start)}"));
        console.Out.WriteLine($"wrote {output}");
        if (!fit.Converged)
        {
            console.Warn($"the fit did not converge ({fit.Message}; {StartText(fit.Start)}); treat the parameters with caution.");
        }

        if (fit.ParametersOnBound.Count > 0)
        {
            console.Warn($"the estimate ends on a constraint ({string.Join(", ", fit.ParametersOnBound)}; {StartText(fit.Start)}); standard errors there are not reliable.");
        }
    }
}
