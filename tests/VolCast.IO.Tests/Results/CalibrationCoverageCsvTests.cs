using System.Globalization;
using VolCast.Core.Calibration;
using VolCast.IO.Csv;
using VolCast.IO.Results;

namespace VolCast.IO.Tests.Results;

/// <summary>Tests of <see cref="CoverageCsv"/> (the file name keeps it with the calibration writers).</summary>
public sealed class CoverageCsvTests
{
    [Fact]
    public void Write_ComputedAndShortSamples_WritesStatusTestsAndQuotedVerdict()
    {
        var longRun = CalibrationCsvTests.Outcomes(2000, 5, 3);
        var shortRun = CalibrationCsvTests.Outcomes(60, 5, 4);
        var coverages = new[]
        {
            MoveBandCoverage.Evaluate(longRun, new ForecasterVolatility("implied", Enumerable.Range(0, 2000).Select(t => t == 7 ? (double?)null : 0.2).ToArray())),
            MoveBandCoverage.Evaluate(shortRun, new ForecasterVolatility("har", Enumerable.Repeat((double?)0.2, 60).ToArray())),
        };
        var writer = new StringWriter(CultureInfo.InvariantCulture);

        CoverageCsv.Write(writer, coverages);

        var lines = writer.ToString().Split('\n');
        Assert.Equal(4, lines.Length);
        var header = lines[0].Split(',');
        Assert.Equal(CoverageCsv.Header, lines[0]);
        Assert.Equal("verdict", header[^1]);
        int Col(string name) => Array.IndexOf(header, name);

        var verdictStart = lines[1].IndexOf(",\"", StringComparison.Ordinal);
        var f = lines[1][..verdictStart].Split(',');
        var c = coverages[0];
        Assert.Equal("implied", f[0]);
        Assert.Equal("1999", f[Col("dates_scored")]);
        Assert.Equal("1", f[Col("dates_missing")]);
        Assert.Equal(c.ZScale!.Value, double.Parse(f[Col("z_scale")], CultureInfo.InvariantCulture));
        Assert.Equal("computed", f[Col("within1_status")]);
        Assert.Equal(c.Levels[0].Kupiec!.PValue, double.Parse(f[Col("within1_kupiec_p")], CultureInfo.InvariantCulture));
        Assert.Equal(c.Levels[1].ConditionalCoverage!.Statistic, double.Parse(f[Col("within2_conditional_lr")], CultureInfo.InvariantCulture));
        Assert.Equal("\"" + CoverageVerdict.Describe(c) + "\"", lines[1][(verdictStart + 1)..]);

        // 60 dates at h = 5 give 12 non-overlapping dates, below 20: marked, tests empty, the count needed written.
        var g = lines[2][..lines[2].IndexOf(",\"", StringComparison.Ordinal)].Split(',');
        Assert.Equal("not-enough-data", g[Col("within1_status")]);
        Assert.Equal("12", g[Col("within1_nonoverlapping_dates")]);
        Assert.Equal("20", g[Col("within1_dates_needed")]);
        Assert.Equal("", g[Col("within1_kupiec_lr")]);
        Assert.Equal("", g[Col("within2_conditional_p")]);
    }
}
