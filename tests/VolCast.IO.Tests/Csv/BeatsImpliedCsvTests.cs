using VolCast.IO.Csv;
using VolCast.IO.Results;

namespace VolCast.IO.Tests.Csv;

public sealed class BeatsImpliedCsvTests
{
    [Fact]
    public void Write_FourNames_WritesTheCountsBeforeAndAfterBenjaminiHochberg()
    {
        // Hand-worked, common practice, no source: p = 0.01, 0.04, 0.03, 0.20 with m = 4 sorted 0.01, 0.03, 0.04, 0.20
        // give BH-adjusted 0.04, 0.0533, 0.0533, 0.20; at q = 0.05 only the first is a discovery.
        BatchAssetRow[] rows =
        [
            Row("n1", -2.9, 0.01),
            Row("n2", -2.1, 0.04),
            Row("n3", -2.2, 0.03),
            Row("n4", 1.3, 0.20),
            new() { Name = "n5", Succeeded = false, HasImplied = true, Error = "bad file" },
        ];
        using var writer = new StringWriter();

        BeatsImpliedCsv.Write(writer, rows);

        Assert.Equal(
            "forecaster,names_tested,beats_uncorrected,beats_after_fdr,share_beats_after_fdr,loses_after_fdr,fdr_level\n"
            + "garch,4,3,1,0.25,0,0.05\n",
            writer.ToString());
    }

    private static BatchAssetRow Row(string name, double dm, double p) => new()
    {
        Name = name,
        Succeeded = true,
        HasImplied = true,
        VersusImplied = [new BatchForecasterTest("garch", dm, p)],
    };
}
