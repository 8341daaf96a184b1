using VolCast.IO;

namespace VolCast.Cli;

/// <summary>
/// The writers a command talks to, and the one place where failures become exit codes and messages
/// (never a stack trace, unless the failure is unexpected and VOLCAST_DEBUG is set).
/// </summary>
/// <param name="output">Where results and progress go.</param>
/// <param name="error">Where errors and warnings go.</param>
/// <param name="interrupt">Cancelled by the first Ctrl-C (the process-wide token of <see cref="Interruption"/>), or by a test that interrupts a run in-process.</param>
internal sealed class CliConsole(TextWriter output, TextWriter error, CancellationToken interrupt = default)
{
    /// <summary>Gets where results and progress go.</summary>
    public TextWriter Out { get; } = output;

    /// <summary>Gets where errors and warnings go.</summary>
    public TextWriter Error { get; } = error;

    /// <summary>Gets the token that the first Ctrl-C cancels: every command reads this one, none registers its own handler.</summary>
    public CancellationToken Interrupt { get; } = interrupt;

    /// <summary>Writes a warning line.</summary>
    public void Warn(string message) => Error.WriteLine($"warning: {message}");

    /// <summary>
    /// Whether Ctrl-C asked the command to stop; if so, says <paramref name="untouched"/> (what was left as it was) on the
    /// error stream, and the command returns <see cref="ExitCodes.Interrupted"/>. Commands check before their first file.
    /// </summary>
    /// <param name="untouched">The end of the sentence "interrupted: ...", such as "nothing was written to cone".</param>
    public bool Stopped(string untouched)
    {
        if (!Interrupt.IsCancellationRequested)
        {
            return false;
        }

        Error.WriteLine($"interrupted: {untouched}");
        return true;
    }

    /// <summary>Runs a command body and maps its failures to exit codes.</summary>
    public int Execute(Func<int> body)
    {
        try
        {
            return body();
        }
        catch (OperationCanceledException) when (Interrupt.IsCancellationRequested)
        {
            // A command that does not say more itself: every command stops before it writes, so nothing was.
            Error.WriteLine("interrupted: the command was stopped before it wrote anything.");
            return ExitCodes.Interrupted;
        }
        catch (InputDataException ex)
        {
            Error.WriteLine($"error: {ex.Message}");
            return ExitCodes.BadInput;
        }
        catch (VolCast.IO.Config.SettingRangeException ex)
        {
            Error.WriteLine($"error: {ex.Message}");
            return ExitCodes.BadUsage;
        }
        catch (UsageException ex)
        {
            Error.WriteLine($"error: {ex.Message}");
            return ExitCodes.BadUsage;
        }
        catch (IOException ex)
        {
            Error.WriteLine($"error: {ex.Message}");
            return ExitCodes.BadInput;
        }
        catch (UnauthorizedAccessException ex)
        {
            Error.WriteLine($"error: {ex.Message}");
            return ExitCodes.BadInput;
        }
#pragma warning disable CA1031 // The last line of defence: an unexpected failure is reported, not thrown at the user.
        catch (Exception ex)
#pragma warning restore CA1031
        {
            Error.WriteLine($"error: unexpected failure: {ex.Message}");
            if (Environment.GetEnvironmentVariable("VOLCAST_DEBUG") is not null)
            {
                Error.WriteLine(ex.ToString());
            }

            return ExitCodes.UnexpectedFailure;
        }
    }
}
