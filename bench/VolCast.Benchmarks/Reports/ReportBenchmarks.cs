using BenchmarkDotNet.Attributes;
using VolCast.Core.Cone;
using VolCast.Reports.Html;
using VolCast.Reports.Model;
using VolCast.Reports.Tests.Support;

namespace VolCast.Benchmarks.Reports;

/// <summary>
/// The full report for invented data of demo size: all seven charts rendered to PNG, then the HTML built around them.
/// Target: under 3 s for charts + HTML, HTML under 5 MB.
/// </summary>
[MemoryDiagnoser]
public class ReportBenchmarks
{
    private SampleReport _sample = null!;
    private IReadOnlyList<ChartImage> _charts = null!;

    /// <summary>Trading days of history: 5 and 20 years.</summary>
    [Params(1260, 5040)]
    public int Days { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        _sample = SampleReport.Create(Days, seed: 42);
        _charts = _sample.Charts();
    }

    [Benchmark]
    public IReadOnlyList<ChartImage> AllCharts() => _sample.Charts();

    [Benchmark]
    public string HtmlOnly() => HtmlReport.Render(SampleReport.Model(_charts));

    [Benchmark]
    public string FullReport() => HtmlReport.Render(SampleReport.Model(_sample.Charts()));

    [Benchmark]
    public VolatilityConeResult Cone() => VolatilityCone.Compute(_sample.Returns, VolatilityCone.DefaultHorizons);
}
