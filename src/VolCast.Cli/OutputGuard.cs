using VolCast.IO;

namespace VolCast.Cli;

/// <summary>The check every command makes before any computing: no output may be one of its inputs, by file identity.</summary>
internal static class OutputGuard
{
    /// <summary>Refuses the command line when an output file resolves to an input file (symbolic links followed).</summary>
    /// <param name="outputs">Every file the command may write.</param>
    /// <param name="inputs">Every file the command reads.</param>
    /// <exception cref="UsageException">An output is an input; the message names both.</exception>
    public static void RefuseInputs(IEnumerable<string> outputs, IEnumerable<string> inputs)
    {
        try
        {
            FileIdentity.RefuseInputs(outputs, inputs);
        }
        catch (IOException ex)
        {
            throw new UsageException(ex.Message);
        }
    }
}
