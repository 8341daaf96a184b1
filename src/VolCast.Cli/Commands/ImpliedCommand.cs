using System.CommandLine;
using System.Globalization;
using VolCast.Core.Options;
using VolCast.IO;
using VolCast.IO.Config;
using VolCast.IO.Csv;
using VolCast.IO.Quotes;

namespace VolCast.Cli.Commands;

/// <summary><c>volcast implied</c>: a constant-tenor at-the-money implied-volatility series from recorded option quotes.</summary>
internal static class ImpliedCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliConsole console)
    {
        var quotes = new Option<string>("--quotes")
        {
            Description = "Option quotes CSV: date,underlying,expiry,strike,type,price with optional rate,dividend_yield (decimals); type is call/put or c/p. Read only.",
            Required = true,
        };
        var tenor = new Option<string>("--tenor")
        {
            Description = "The constant tenor in calendar days, written Nd (for example 30d).",
            Required = true,
        };
        var rate = new Option<double?>("--rate")
        {
            Description = $"Continuously compounded risk-free rate as a decimal (0.05 = 5%), {SettingLimits.Rate}, for rows without a rate; required when the file has no rate column.",
        };
        var dividendYield = new Option<double>("--dividend-yield")
        {
            Description = $"Continuous dividend yield as a decimal (0.02 = 2%), {SettingLimits.DividendYield}, for rows without one.",
            DefaultValueFactory = _ => 0.0,
        };
        var extrapolation = new Option<string>("--extrapolation")
        {
            Description = "When the tenor lies outside a date's quoted expiries: 'refuse' leaves the date out and reports it; 'flat' uses the nearest expiry's volatility and flags it.",
            DefaultValueFactory = _ => "refuse",
        };
        extrapolation.AcceptOnlyFromAmong("refuse", "flat");
        var output = new Option<string?>("--out")
        {
            Description = "Output CSV date,iv (default implied-<N>d.csv in the current folder); diagnostics go beside it as <name>.diagnostics.csv.",
        };
        var force = new Option<bool>("--force") { Description = "Replace the output and diagnostics files if they exist." };
        var command = new Command("implied", "Compute implied volatility from option quotes (Black-Scholes-Merton / Black-76) and interpolate an at-the-money series to a constant tenor (CSV date,iv).")
        {
            quotes, tenor, rate, dividendYield, extrapolation, output, force,
        };
        var formatOptions = InputFormatOptions.AddTo(command);
        command.SetAction(parse => console.Execute(() => Run(
            console,
            parse.GetValue(quotes)!,
            parse.GetValue(tenor)!,
            parse.GetValue(rate),
            parse.GetValue(dividendYield),
            parse.GetValue(extrapolation) == "flat" ? TenorExtrapolation.FlatVolatility : TenorExtrapolation.Refuse,
            parse.GetValue(output),
            parse.GetValue(force),
            formatOptions.Resolve(parse))));
        return command;
    }

    private static int Run(CliConsole console, string quotesPath, string tenorText, double? rate, double dividendYield, TenorExtrapolation extrapolation, string? outPath, bool force, CsvFormat format)
    {
        var tenorDays = ParseTenor(tenorText);
        if (rate is double r)
        {
            SettingLimits.Rate.Check(r, "--rate");
        }

        SettingLimits.DividendYield.Check(dividendYield, "--dividend-yield");
        var output = outPath ?? $"implied-{DayCount.FormatTenor(tenorDays)}.csv";
        var diagnosticsPath = DiagnosticsPath(output);
        OutputGuard.RefuseInputs([output, diagnosticsPath], [quotesPath]);
        foreach (var target in new[] { output, diagnosticsPath })
        {
            if (!force && File.Exists(target))
            {
                throw new UsageException($"{target}: the file already exists; choose another --out or pass --force to replace it.");
            }
        }

        var quotes = OptionQuoteCsvReader.Read(quotesPath, rate, dividendYield, format);
        var result = ConstantTenorSeries.Compute(quotes, new ConstantTenorOptions(tenorDays, extrapolation));
        string[] inputs = [quotesPath];
        if (console.Stopped($"the implied volatility was stopped before it was written; {output} and {diagnosticsPath} were left as they were."))
        {
            return ExitCodes.Interrupted;
        }

        if (result.Points.IsEmpty)
        {
            QuoteDiagnosticsCsv.Write(diagnosticsPath, result.Diagnostics, force, inputs);
        }
        else
        {
            // The series and its diagnostics as one set: a stop or a failure never leaves a new one beside an old other.
            using var files = new AtomicFileSet();
            files.AddText(diagnosticsPath, w => QuoteDiagnosticsCsv.Write(w, result.Diagnostics), force, inputs);
            files.AddText(output, w => ConstantTenorCsv.Write(w, result.Points), force, inputs);
            Interruption.Process.Uninterrupted(files.Commit);
        }

        var summary = string.Create(CultureInfo.InvariantCulture,
            $"{quotes.Count} quotes: {result.RejectedQuoteCount} quotes and {result.RejectedExpiryCount} expiries rejected, {result.RejectedDateCount} dates without a {DayCount.FormatTenor(tenorDays)} value; diagnostics in {diagnosticsPath}");
        if (result.Points.IsEmpty)
        {
            console.Error.WriteLine($"error: {quotesPath}: no date has a usable pair of expiries around {DayCount.FormatTenor(tenorDays)}, so nothing was written to {output}. {summary}.");
            return ExitCodes.BadInput;
        }

        console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture, $"wrote {result.Points.Length} dates to {output}"));
        console.Out.WriteLine(summary);
        if (result.RejectedDateCount > 0)
        {
            console.Warn(string.Create(CultureInfo.InvariantCulture, $"{result.RejectedDateCount} dates have no value; see {diagnosticsPath}."));
        }

        return ExitCodes.Success;
    }

    /// <summary>implied-30d.csv → implied-30d.diagnostics.csv.</summary>
    internal static string DiagnosticsPath(string output)
    {
        var extension = Path.GetExtension(output);
        var stem = extension.Length > 0 ? output[..^extension.Length] : output;
        return stem + ".diagnostics.csv";
    }

    private static int ParseTenor(string text)
    {
        // Bare digits (30) are read as days too, as they always were here.
        var trimmed = text.Trim();
        if (trimmed.Length > 0 && trimmed.All(char.IsAsciiDigit))
        {
            var days = double.Parse(trimmed, NumberStyles.None, CultureInfo.InvariantCulture);
            SettingLimits.TenorDays.Check(days, "--tenor", null, trimmed);
            return (int)days;
        }

        return SettingLimits.TenorDaysOf(text, "--tenor")
            ?? throw new UsageException($"--tenor must be a number of calendar days followed by d, such as 30d, {SettingLimits.TenorDays} (was {BacktestOptions.Shown(text)}).");
    }
}
