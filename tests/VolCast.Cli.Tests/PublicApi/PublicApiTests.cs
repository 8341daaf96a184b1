namespace VolCast.Cli.Tests.PublicApi;

public sealed class PublicApiTests
{
    [Fact]
    public void PublicApi_MatchesApprovedFile() =>
        // The approved file is the surface chosen on purpose; a new public type or member must be accepted deliberately.
        PublicApiApproval.Verify(typeof(VolCast.Cli.ExitCodes).Assembly, "VolCast.Cli.Tests");
}
