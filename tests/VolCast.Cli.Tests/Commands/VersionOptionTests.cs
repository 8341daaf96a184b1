using System.Text.RegularExpressions;
using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Commands;

/// <summary><c>volcast --version</c> prints the version and the commit the tool was built from, as run.json records them.</summary>
public sealed class VersionOptionTests
{
    [Fact]
    public void Version_PrintsTheProjectVersionAndTheCommit_AsRunJsonRecordsThem()
    {
        var result = CliRunner.Run("--version");

        Assert.Equal(0, result.ExitCode);
        var printed = result.Stdout.Trim();
        // The project file's <Version> is 0.1.0; the SDK appends "+<40-hex commit>" when the build runs in a git clone
        // (SourceRevisionId), which CI always is.
        Assert.Matches(new Regex("^0\\.1\\.0\\+[0-9a-f]{40}$"), printed);
        Assert.Equal(BacktestPipeline.ToolVersion(), printed);
    }
}
