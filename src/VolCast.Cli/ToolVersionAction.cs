using System.CommandLine;
using System.CommandLine.Invocation;

namespace VolCast.Cli;

/// <summary>
/// Prints the tool's version with the commit it was built from (<c>0.1.0+&lt;commit&gt;</c>, as run.json records it) for
/// <c>volcast --version</c>. The parser's own action reads the entry assembly, which is the test host when the CLI runs
/// in-process.
/// </summary>
internal sealed class ToolVersionAction : SynchronousCommandLineAction
{
    /// <inheritdoc />
    public override int Invoke(ParseResult parseResult)
    {
        parseResult.InvocationConfiguration.Output.WriteLine(BacktestPipeline.ToolVersion());
        return ExitCodes.Success;
    }
}
