using VolCast.Core.Options;
using VolCast.IO.Quotes;

namespace VolCast.IO.Tests.Quotes;

public sealed class OptionQuoteCsvReaderTests
{
    private const string Header = "date,underlying,expiry,strike,type,price";

    [Fact]
    public void Read_GoodFile_ParsesEveryFieldWithLines()
    {
        var quotes = Read($"{Header},rate,dividend_yield\n2024-03-01,100.5,2024-04-19,100,call,3.25,0.05,0.01\n2024-03-01,100.5,2024-04-19,95,P,1.5,,\n", 0.04, 0.02);
        Assert.Equal(2, quotes.Count);
        var call = quotes[0];
        Assert.Equal(new DateOnly(2024, 3, 1), call.Date);
        Assert.Equal(100.5, call.Underlying);
        Assert.Equal(new DateOnly(2024, 4, 19), call.Expiry);
        Assert.Equal(100, call.Strike);
        Assert.Equal(OptionType.Call, call.Type);
        Assert.Equal(3.25, call.Price);
        Assert.Equal(0.05, call.Rate);
        Assert.Equal(0.01, call.DividendYield);
        Assert.Equal(2, call.SourceLine);
        Assert.Equal(OptionType.Put, quotes[1].Type);
        Assert.Equal(0.04, quotes[1].Rate); // empty cell takes the default
        Assert.Equal(0.02, quotes[1].DividendYield);
        Assert.Equal(3, quotes[1].SourceLine);
    }

    [Fact]
    public void Read_HeaderSpellingsAndCase_AreAccepted()
    {
        var quotes = Read("Date,Spot,Expiration,Strike,Option_Type,Price,Rate\n2024-03-01,100,2024-04-19,100,CALL,3,0.05\n", null);
        Assert.Equal(OptionType.Call, Assert.Single(quotes).Type);
        Assert.Equal(0, quotes[0].DividendYield);
    }

    [Fact]
    public void Read_MissingColumn_ThrowsNamingColumn()
    {
        var ex = Assert.Throws<InputDataException>(() => Read("date,underlying,expiry,strike,price\n2024-03-01,100,2024-04-19,100,3\n", 0.05));
        Assert.Equal(1, ex.Line);
        Assert.Equal("type", ex.Column);
        Assert.Contains("quotes.csv", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("2024/03/01,100,2024-04-19,100,call,3", "date")] // date not ISO
    [InlineData("2024-03-01,abc,2024-04-19,100,call,3", "underlying")] // not a number
    [InlineData("2024-03-01,100,2024-04-19,100,straddle,3", "type")] // unknown type
    [InlineData("2024-03-01,100,2024-04-19,0,call,3", "strike")] // zero strike
    [InlineData("2024-03-01,100,2024-04-19,100,call,NaN", "price")] // NaN price
    [InlineData("2024-03-01,100,2024-04-19,100,call,3,5", "rate")] // a percent where a decimal belongs
    public void Read_BadCell_ThrowsWithLineColumnAndValue(string row, string column)
    {
        var withRate = row.Split(',').Length == 7;
        var header = withRate ? Header + ",rate" : Header;
        var good = withRate ? "2024-03-01,100,2024-04-19,100,call,3,0.05" : "2024-03-01,100,2024-04-19,100,call,3";
        var ex = Assert.Throws<InputDataException>(() => Read($"{header}\n{good}\n{row}\n", 0.05));
        Assert.Equal(3, ex.Line);
        Assert.Equal(column, ex.Column);
        Assert.Contains("expected", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_NoRateAnywhere_Throws()
    {
        var ex = Assert.Throws<InputDataException>(() => Read($"{Header}\n2024-03-01,100,2024-04-19,100,call,3\n", null));
        Assert.Equal("rate", ex.Column);
        Assert.Contains("--rate", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_ZeroPriceAndExpiredQuote_ArePassedOnForCounting()
    {
        var quotes = Read($"{Header}\n2024-03-01,100,2024-03-01,100,call,3\n2024-03-01,100,2024-04-19,100,put,0\n", 0.05);
        Assert.Equal(2, quotes.Count);
    }

    [Fact]
    public void Read_ShortRow_Throws()
    {
        var ex = Assert.Throws<InputDataException>(() => Read($"{Header}\n2024-03-01,100,2024-04-19\n", 0.05));
        Assert.Equal(2, ex.Line);
    }

    [Fact]
    public void Read_HeaderOnlyOrEmpty_Throws()
    {
        Assert.Throws<InputDataException>(() => Read($"{Header}\n", 0.05));
        Assert.Throws<InputDataException>(() => Read(string.Empty, 0.05));
    }

    [Fact]
    public void Read_MissingFile_ThrowsInputDataException()
    {
        var ex = Assert.Throws<InputDataException>(() => OptionQuoteCsvReader.Read(Path.Combine(Path.GetTempPath(), Guid.NewGuid().ToString("N"), "none.csv"), 0.05));
        Assert.Contains("does not exist", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_FromFile_LeavesFileUnchanged()
    {
        var path = Path.Combine(Path.GetTempPath(), $"volcast-quotes-{Guid.NewGuid():N}.csv");
        var content = $"{Header}\n2024-03-01,100,2024-04-19,100,c,3\n";
        File.WriteAllText(path, content);
        try
        {
            var before = File.GetLastWriteTimeUtc(path);
            Assert.Single(OptionQuoteCsvReader.Read(path, 0.05));
            Assert.Equal(content, File.ReadAllText(path));
            Assert.Equal(before, File.GetLastWriteTimeUtc(path));
        }
        finally
        {
            File.Delete(path);
        }
    }

    private static IReadOnlyList<OptionQuote> Read(string text, double? rate, double yield = 0)
    {
        using var reader = new StringReader(text);
        return OptionQuoteCsvReader.Read(reader, "quotes.csv", rate, yield);
    }
}
