using System.Text;
using System.Text.RegularExpressions;
using VolCast.Reports.Html;
using VolCast.Reports.Model;
using VolCast.Reports.Tests.Support;

namespace VolCast.Reports.Tests.Html;

public sealed partial class HtmlReportTests
{
    private static readonly IReadOnlyList<ChartImage> Charts = SampleReport.Create(days: 1500, seed: 3).Charts();

    [GeneratedRegex("<section id=\"([a-z-]+)\"")]
    private static partial Regex SectionPattern();

    [GeneratedRegex("<img [^>]*src=\"([^\"]*)\"")]
    private static partial Regex ImagePattern();

    [Fact]
    public void Render_Sections_InTheAgreedOrder()
    {
        var html = HtmlReport.Render(SampleReport.Model(Charts));

        var ids = SectionPattern().Matches(html).Select(m => m.Groups[1].Value).ToArray();
        Assert.Equal(["now", "verdict", "pnl", "answers", "metrics", "charts", "odds", "data-quality", "run", "terms", "cautions"], ids);
        Assert.Equal(HtmlReport.SectionIds, ids);
    }

    [Fact]
    public void Render_DeclaresPolicyAndLoadsNothingFromElsewhere()
    {
        var html = HtmlReport.Render(SampleReport.Model(Charts));

        Assert.Contains("<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; img-src data:;", html, StringComparison.Ordinal);
        Assert.DoesNotContain("http://", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("https://", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("<link", html, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void Render_EveryChart_IsAPngDataUri()
    {
        var html = HtmlReport.Render(SampleReport.Model(Charts));

        var sources = ImagePattern().Matches(html).Select(m => m.Groups[1].Value).ToArray();
        Assert.Equal(Charts.Count, sources.Length);
        for (var i = 0; i < sources.Length; i++)
        {
            Assert.StartsWith("data:image/png;base64,", sources[i], StringComparison.Ordinal);
            var bytes = Convert.FromBase64String(sources[i]["data:image/png;base64,".Length..]);
            Assert.True(bytes.AsSpan().SequenceEqual(Charts[i].Png.Span));
        }
    }

    [Fact]
    public void Render_ScriptInFileName_IsEscaped()
    {
        const string hostile = "<script>alert(1)</script>.csv";

        var html = HtmlReport.Render(SampleReport.Model(Charts, hostile));

        Assert.DoesNotContain(hostile, html, StringComparison.Ordinal);
        Assert.Contains("&lt;script&gt;alert(1)&lt;/script&gt;.csv", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_QuotesInLabels_CannotLeaveAnAttribute()
    {
        var model = SampleReport.Model([Charts[0] with { Description = "\" onerror=\"x" }]);

        var html = HtmlReport.Render(model);

        Assert.DoesNotContain("\" onerror=\"x", html, StringComparison.Ordinal);
        Assert.Contains("&quot; onerror=&quot;x", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_SameModel_SameText()
    {
        Assert.Equal(HtmlReport.Render(SampleReport.Model(Charts)), HtmlReport.Render(SampleReport.Model(Charts)));
    }

    [Fact]
    public void Render_FullTwentyYearSample_UnderFiveMegabytes()
    {
        var html = HtmlReport.Render(SampleReport.Model(SampleReport.Create().Charts()));

        Assert.True(Encoding.UTF8.GetByteCount(html) < 5 * 1024 * 1024, $"report is {Encoding.UTF8.GetByteCount(html)} bytes");
    }

    [Theory]
    // Each significance level maps to its stars; null shows a dash; the format applies with the invariant culture.
    [InlineData(1234.5678, "0.00", Significance.None, "1234.57")]
    [InlineData(-3.2, "0.00", Significance.OnePercent, "-3.20<sup>***</sup>")]
    [InlineData(0.049, "0.000", Significance.FivePercent, "0.049<sup>**</sup>")]
    [InlineData(0.5, "0.0%", Significance.TenPercent, "50.0%<sup>*</sup>")]
    [InlineData(null, "0.00", Significance.None, "—")]
    public void Cell_FormatsValueAndStars(double? value, string format, object significance, string expected)
    {
        // The level arrives as object: Significance is internal to Reports, and a theory method is public.
        Assert.Equal(expected, HtmlReport.Cell(new MetricCell(value, format, (Significance)significance)));
    }

    [Fact]
    public void Render_VerdictAndCautions_AreThere()
    {
        var model = SampleReport.Model(Charts);

        var html = Glossary.WithoutLinks(HtmlReport.Render(model));

        Assert.Contains(HtmlReport.E(model.Verdict.Headline), html, StringComparison.Ordinal);
        foreach (var caution in ReportText.Cautions)
        {
            Assert.Contains(HtmlReport.E(caution), html, StringComparison.Ordinal);
        }

        Assert.Contains(new string('a', 64), html, StringComparison.Ordinal);
    }
}
