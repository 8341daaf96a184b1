using VolCast.IO.Results;
using VolCast.IO.Tables;
using VolCast.Reports.Batch;
using VolCast.Reports.Html;
using VolCast.Reports.Model;

namespace VolCast.Reports.Tests.Batch;

public sealed class BatchSummaryHtmlTests
{
    private static readonly BatchAssetRow[] Rows =
    [
        Row("AAA", -3.1, 0.001, 0.031),
        Row("B<b>&'\"", 0.8, 0.40, -0.012),
        new() { Name = "CCC", Succeeded = true, HasImplied = false, Dates = 500, BestQlike = "har", BestQlikeValue = -3.2 },
        BatchRows.Failed("DDD", hasImplied: true, "DDD.csv, line 3, column 1: 'x<y' is not a date"),
    ];

    [Fact]
    public void Render_Rows_SelfContainedWithEverySectionAndEscapedText()
    {
        var html = BatchSummaryHtml.Render(Rows, [new Setting("Horizon", "21 trading days")]);

        Assert.Contains("content=\"" + HtmlReport.ContentSecurityPolicy + "\"", html, StringComparison.Ordinal);
        foreach (var id in BatchSummaryHtml.SectionIds)
        {
            Assert.Contains($"<section id=\"{id}\">", html, StringComparison.Ordinal);
        }

        Assert.Contains("Benjamini-Hochberg", html, StringComparison.Ordinal);
        Assert.Contains("false discovery rate", html, StringComparison.Ordinal);
        Assert.Contains("href=\"assets/AAA/report.html\"", html, StringComparison.Ordinal);
        Assert.Contains("href=\"assets/B%3Cb%3E%26%27%22/report.html\"", html, StringComparison.Ordinal);
        Assert.Contains("B&lt;b&gt;&amp;&#39;&quot;", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<b>&", html, StringComparison.Ordinal);
        Assert.Contains("x&lt;y", html, StringComparison.Ordinal);
        Assert.Equal(2, CountOf(html, "data:image/png;base64,"));
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("http://", html, StringComparison.Ordinal);
        Assert.DoesNotContain("https://", html, StringComparison.Ordinal);
        var folder = Path.Combine(AppContext.BaseDirectory, "look", nameof(BatchSummaryHtmlTests));
        Directory.CreateDirectory(folder);
        File.WriteAllText(Path.Combine(folder, "summary.html"), html);
    }

    [Fact]
    public void Render_TitleSaysWhatThePageIs()
    {
        var html = BatchSummaryHtml.Render(Rows, []);

        Assert.Contains("<title>Volatility forecast backtest across 4 names</title>", html, StringComparison.Ordinal);
        Assert.Contains("<h1>Volatility forecast backtest across 4 names</h1>", html, StringComparison.Ordinal);
        Assert.Contains("<td>0.400</td>", html, StringComparison.Ordinal);
        Assert.Contains("<td>0.001</td>", html, StringComparison.Ordinal);
        Assert.Contains("th:first-child,td:first-child{text-align:left;white-space:nowrap}", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_ZeroCounts_ReadAsSentences()
    {
        // Every name done and every name with implied: no "0 failed", no "0 names had no implied file", no empty table.
        var allDone = BatchSummaryHtml.Render([Row("AAA", -3.1, 0.001, 0.031), Row("BBB", 0.8, 0.40, -0.012)], []);
        Assert.Contains("All 2 names were backtested.", allDone, StringComparison.Ordinal);
        Assert.Contains("Every name backtested had an implied file.", allDone, StringComparison.Ordinal);
        Assert.DoesNotContain("0 failed", allDone, StringComparison.Ordinal);
        Assert.DoesNotContain("0 names", allDone, StringComparison.Ordinal);

        var one = BatchSummaryHtml.Render([new BatchAssetRow { Name = "CCC", Succeeded = true, HasImplied = false, Dates = 500 }], []);
        Assert.Contains("Volatility forecast backtest across 1 name<", one, StringComparison.Ordinal);
        Assert.Contains("The one name was backtested.", one, StringComparison.Ordinal);
        Assert.Contains("1 name had no implied file: its forecasters", one, StringComparison.Ordinal);
        Assert.Contains("nothing could be compared with implied", one, StringComparison.Ordinal);
        Assert.DoesNotContain("<th>Names tested</th>", one, StringComparison.Ordinal);

        var none = BatchSummaryHtml.Render([], []);
        Assert.Contains("The prices folder held no name to backtest.", none, StringComparison.Ordinal);
        Assert.Contains("No name was backtested, so none was compared with implied.", none, StringComparison.Ordinal);
    }

    [Fact]
    public void Table_FourNames_CountsWinsBeforeAndAfterBenjaminiHochberg()
    {
        // Hand-worked, common practice, no source: p = 0.01, 0.04, 0.03, 0.20 with m = 4 sorted 0.01, 0.03, 0.04, 0.20
        // give BH-adjusted 0.04, 0.0533, 0.0533, 0.20; at q = 0.05 only the first is a discovery.
        BatchAssetRow[] rows =
        [
            Row("n1", -2.9, 0.01, 0.0),
            Row("n2", -2.1, 0.04, 0.0),
            Row("n3", -2.2, 0.03, 0.0),
            Row("n4", 1.3, 0.20, 0.0),
        ];

        var table = VersusImpliedTable.Rows(rows);

        var row = Assert.Single(table);
        Assert.Equal("garch", row.Spec);
        Assert.Equal(4, row.NamesTested);
        Assert.Equal(3, row.BeatsUncorrected);
        Assert.Equal(1, row.BeatsAfterFdr);
        Assert.Equal(0, row.LosesAfterFdr);
        Assert.Equal(0.25, row.ShareBeatsAfterFdr);
    }

    private static BatchAssetRow Row(string name, double dm, double p, double premium) => new()
    {
        Name = name,
        Succeeded = true,
        HasImplied = true,
        Dates = 700,
        BestQlike = "garch",
        BestQlikeValue = -3.4,
        BestDmStatistic = dm,
        BestDmPValue = p,
        McsMembers = ["garch", "implied"],
        Lookbacks = [new BatchLookback("yang-zhang", "yang-zhang:21", 0.8, 12)],
        MeanPremium = premium,
        VersusImplied = [new BatchForecasterTest("garch", dm, p)],
    };

    private static int CountOf(string text, string part)
    {
        var count = 0;
        for (var i = text.IndexOf(part, StringComparison.Ordinal); i >= 0; i = text.IndexOf(part, i + 1, StringComparison.Ordinal))
        {
            count++;
        }

        return count;
    }
}
