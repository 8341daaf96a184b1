using System.CommandLine;

namespace VolCast.Cli.Commands;

/// <summary><c>volcast estimate</c>: a rolling volatility series from one estimator at one window.</summary>
internal static class EstimateCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliConsole console)
    {
        var prices = new Option<FileInfo>("--prices") { Description = "Daily price history CSV (date, open, high, low, close; or date, close).", Required = true };
        var command = new Command("estimate", "Write a rolling annualized volatility series (CSV date,vol) from one estimator and one window.")
        {
            prices,
        };
        command.SetAction(parse => console.Execute(() =>
        {
            console.Out.WriteLine(parse.GetValue(prices)!.FullName);
            return ExitCodes.Success;
        }));
        return command;
    }
}
