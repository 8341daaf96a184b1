using System.CommandLine;
using VolCast.Cli.Commands;

namespace VolCast.Cli;

/// <summary>The <c>volcast</c> entry point: builds the command tree and maps failures to exit codes.</summary>
internal static class Program
{
    /// <summary>
    /// Runs the tool with the process's console. The Ctrl-C handler is installed first, before the command line is parsed,
    /// so a Ctrl-C at any moment of any command requests the same stop (<see cref="Interruption"/>).
    /// </summary>
    public static int Main(string[] args)
    {
        var interrupt = Interruption.Process.Install();
        return Run(args, Console.Out, Console.Error, interrupt);
    }

    /// <summary>Runs the tool with the given writers; tests call this to run the CLI in-process.</summary>
    /// <param name="args">The command-line arguments.</param>
    /// <param name="stdout">Where results and progress go.</param>
    /// <param name="stderr">Where errors and warnings go.</param>
    /// <param name="interrupt">Stops a command as Ctrl-C does (the process-wide token in <see cref="Main"/>; none by default).</param>
    /// <returns>The exit code: 0 success, 1 unexpected failure, 2 bad usage, 3 bad input data, 130 stopped by Ctrl-C.</returns>
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr, CancellationToken interrupt = default)
    {
        var console = new CliConsole(stdout, stderr, interrupt);
        var root = new RootCommand(
            "VolCast: backtest volatility forecasts against the realized volatility that followed and the implied volatility quoted at the time.");
        // The main job first, then the tools it is built from, then the demo.
        root.Subcommands.Add(BacktestCommand.Create(console));
        root.Subcommands.Add(BatchCommand.Create(console));
        root.Subcommands.Add(ConeCommand.Create(console));
        root.Subcommands.Add(EstimateCommand.Create(console));
        root.Subcommands.Add(FitCommand.Create(console));
        root.Subcommands.Add(ImpliedCommand.Create(console));
        root.Subcommands.Add(DemoCommand.Create(console));
        foreach (var option in root.Options.OfType<VersionOption>())
        {
            option.Action = new ToolVersionAction();
        }

        var parse = root.Parse(args);
        if (parse.Errors.Count > 0)
        {
            foreach (var error in parse.Errors)
            {
                stderr.WriteLine($"error: {PlainParseError(error.Message)}");
            }

            stderr.WriteLine("Run 'volcast --help' or 'volcast COMMAND --help' for usage.");
            return ExitCodes.BadUsage;
        }

        return parse.Invoke(new InvocationConfiguration { Output = stdout, Error = stderr, EnableDefaultExceptionHandler = false });
    }

    /// <summary>
    /// Rewrites the parser's "Cannot parse argument 'X' for option '--o' as expected type 'System.Int32'" in plain words
    /// (users never see .NET type names), and cuts an echoed value to 40 characters.
    /// </summary>
    internal static string PlainParseError(string message)
    {
        var match = System.Text.RegularExpressions.Regex.Match(
            message, "^Cannot parse argument '(?<value>.*)' for (?:option|command) '(?<option>[^']*)' as expected type '(?<type>[^']*)'", System.Text.RegularExpressions.RegexOptions.Singleline);
        if (!match.Success)
        {
            return message.Length > 300 ? message[..300] + "…" : message;
        }

        var type = match.Groups["type"].Value;
        var expected = type.Contains("Int32", StringComparison.Ordinal) || type.Contains("Int64", StringComparison.Ordinal) ? "a whole number, such as 21"
            : type.Contains("Double", StringComparison.Ordinal) ? "a number written with '.' as the decimal point, such as 0.25"
            : type.Contains("Boolean", StringComparison.Ordinal) ? "true or false"
            : "a value of the documented form";
        return $"{match.Groups["option"].Value}: {BacktestOptions.Shown(match.Groups["value"].Value)} is not {expected}; see --help for its range.";
    }
}
