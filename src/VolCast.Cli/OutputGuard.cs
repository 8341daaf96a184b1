using VolCast.IO;

namespace VolCast.Cli;

/// <summary>
/// The check every command that writes files makes before any computing: no output may be one of its inputs, by file
/// identity. It also removes what killed runs left beside those outputs (hidden temporary files of processes that no longer
/// run), so they are gone once the next run of the same command starts.
/// </summary>
internal static class OutputGuard
{
    /// <summary>Refuses the command line when an output file resolves to an input file (symbolic links followed).</summary>
    /// <param name="outputs">Every file the command may write.</param>
    /// <param name="inputs">Every file the command reads.</param>
    /// <exception cref="UsageException">An output is an input; the message names both.</exception>
    public static void RefuseInputs(IReadOnlyList<string> outputs, IEnumerable<string> inputs)
    {
        ArgumentNullException.ThrowIfNull(outputs);
        try
        {
            FileIdentity.RefuseInputs(outputs, inputs);
        }
        catch (IOException ex)
        {
            throw new UsageException(ex.Message);
        }

        foreach (var output in outputs)
        {
            AtomicFile.RemoveStaleTemporaries(output);
        }
    }
}
