using System.Globalization;
using System.Text;
using VolCast.Core.Backtest;
using VolCast.Core.Data;
using VolCast.IO.Quotes;
using VolCast.TestSupport;

namespace VolCast.IO.Tests;

// Regional CSV forms: the same seeded history written in ISO and in each declared form must read back to the same
// numbers (the ISO read is the reference); a form the reader was not told about is refused naming the option.
// The forms are those spreadsheets write in the United States, Germany and France (common practice, no source).
public sealed class RegionalFormatTests
{
    public static TheoryData<string, string, string> Forms() => new()
    {
        { "MM/dd/yyyy", ",", "." },
        { "dd.MM.yyyy", ";", "," },
        { "yyyyMMdd", "\t", "." },
        { "dd/MM/yyyy", "|", "," },
        { "yyyy-MM-dd", ";", "," },
    };

    [Theory]
    [MemberData(nameof(Forms))]
    public void PriceFile_DeclaredRegionalForm_ReadsTheSameNumbersAsTheIsoFile(string dateFormat, string delimiter, string point)
    {
        var history = Some.GbmBars(seed: 41, days: 300, overnightVolatility: 0.004);
        var iso = PriceFileReader.Read(new StringReader(Write(history, "yyyy-MM-dd", ',', '.', withVolume: true)), "iso.csv");
        var format = CsvFormat.Parse(dateFormat, delimiter, point, k => "--" + k);
        var regional = PriceFileReader.Read(new StringReader(Write(history, dateFormat, delimiter[0], point[0], withVolume: true)), "regional.csv", format);

        Assert.Equal(iso.History.Dates.ToArray(), regional.History.Dates.ToArray());
        Assert.Equal(iso.History.Open.ToArray(), regional.History.Open.ToArray());
        Assert.Equal(iso.History.High.ToArray(), regional.History.High.ToArray());
        Assert.Equal(iso.History.Low.ToArray(), regional.History.Low.ToArray());
        Assert.Equal(iso.History.Close.ToArray(), regional.History.Close.ToArray());
        Assert.Equal(history.Close.ToArray(), regional.History.Close.ToArray());
    }

    [Theory]
    [MemberData(nameof(Forms))]
    public void ImpliedFile_DeclaredRegionalForm_ReadsTheSameNumbersAsTheIsoFile(string dateFormat, string delimiter, string point)
    {
        var history = Some.GbmBars(seed: 43, days: 200);
        var values = history.Close.ToArray().Select(c => c / 500.0).ToArray();
        string Text(string df, char d, char p)
        {
            var sb = new StringBuilder("date" + d + "iv\n");
            for (var i = 0; i < values.Length; i++)
            {
                sb.Append(history.Dates[i].ToString(df, CultureInfo.InvariantCulture)).Append(d).Append(Number(values[i], p)).Append('\n');
            }

            return sb.ToString();
        }

        var iso = ImpliedFileReader.Read(new StringReader(Text("yyyy-MM-dd", ',', '.')), "iso.csv", ImpliedUnit.Decimal);
        var format = CsvFormat.Parse(dateFormat, delimiter, point, k => "--" + k);
        var regional = ImpliedFileReader.Read(new StringReader(Text(dateFormat, delimiter[0], point[0])), "regional.csv", ImpliedUnit.Decimal, format);

        Assert.Equal(iso.Series.Dates.ToArray(), regional.Series.Dates.ToArray());
        Assert.Equal(iso.Series.Volatility.ToArray(), regional.Series.Volatility.ToArray());
        Assert.Equal(values, regional.Series.Volatility.ToArray());
    }

    [Fact]
    public void OptionQuotes_SemicolonAndDecimalComma_ReadTheSameQuotesAsTheIsoFile()
    {
        const string Iso = "date,underlying,expiry,strike,type,price,rate\n2024-03-28,101.25,2024-04-26,100,call,3.375,0.0425\n2024-03-28,101.25,2024-05-24,105,p,6.5,0.0425\n";
        const string German = "date;underlying;expiry;strike;type;price;rate\n28.03.2024;101,25;26.04.2024;100;call;3,375;0,0425\n28.03.2024;101,25;24.05.2024;105;p;6,5;0,0425\n";
        var iso = OptionQuoteCsvReader.Read(new StringReader(Iso), "iso.csv", null);
        var german = OptionQuoteCsvReader.Read(new StringReader(German), "de.csv", null, 0, CsvFormat.Parse("dd.MM.yyyy", ";", ",", k => "--" + k));
        Assert.Equal(iso, german);
    }

    [Fact]
    public void PriceFile_SemicolonFileWithoutOptions_RefusedNamingDelimiterAndDecimal()
    {
        var error = Assert.Throws<InputDataException>(() => PriceFileReader.Read(new StringReader("date;close\n28.03.2024;101,25\n"), "de.csv"));
        Assert.Equal(1, error.Line);
        Assert.Contains("--delimiter ';'", error.Message, StringComparison.Ordinal);
        Assert.Contains("--decimal ','", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void PriceFile_CommaFileDeclaredSemicolon_RefusedNamingTheCommaDelimiter()
    {
        var error = Assert.Throws<InputDataException>(() => PriceFileReader.Read(new StringReader("date,close\n2024-03-28,101.25\n"), "p.csv", CsvFormat.Parse(null, ";", ",", k => "--" + k)));
        Assert.Contains("--delimiter ','", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("03/28/2024", "--date-format MM/dd/yyyy")]
    [InlineData("28/03/2024", "--date-format dd/MM/yyyy")]
    [InlineData("28.03.2024", "--date-format dd.MM.yyyy")]
    [InlineData("20240328", "--date-format yyyyMMdd")]
    [InlineData("Mar 28 2024", "--date-format")]
    public void PriceFile_DateNotIso_RefusedNamingTheDateFormatOption(string date, string option)
    {
        var error = Assert.Throws<InputDataException>(() => PriceFileReader.Read(new StringReader("date,close\n" + date + ",101.25\n"), "p.csv"));
        Assert.Equal(2, error.Line);
        Assert.Equal("date", error.Column);
        Assert.Contains(option, error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void PriceFile_DecimalCommaInQuotedCell_RefusedNamingTheDecimalOption()
    {
        var error = Assert.Throws<InputDataException>(() => PriceFileReader.Read(new StringReader("date,close\n2024-03-28,\"101,25\"\n"), "p.csv"));
        Assert.Equal("close", error.Column);
        Assert.Contains("--decimal ','", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void PriceFile_DecimalPointInFileDeclaredDecimalComma_Refused()
    {
        // A '.' in a decimal-comma file is a thousands separator or a mistake; either way it must not be read as a point.
        var format = CsvFormat.Parse(null, ";", ",", k => "--" + k);
        var error = Assert.Throws<InputDataException>(() => PriceFileReader.Read(new StringReader("date;close\n2024-03-28;1.101,25\n"), "p.csv", format));
        Assert.Equal(2, error.Line);
        Assert.Contains("--decimal ','", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("2024-03-28 00:00:00")]
    [InlineData("2024-03-28T00:00:00")]
    [InlineData("2024-03-28T00:00:00.000Z")]
    [InlineData("2024-03-28T16:00:00Z")]
    [InlineData("2024-03-28 16:00")]
    [InlineData("2024-03-28T17:30:00+01:00")]
    [InlineData("2024-03-28 23:59:59")]
    public void PriceFile_TimestampAtMidnightOrAClose_ReadAsItsDate(string stamp)
    {
        var load = PriceFileReader.Read(new StringReader("date,close\n" + stamp + ",101.25\n2024-03-29,102\n"), "p.csv");
        Assert.Equal(new DateOnly(2024, 3, 28), load.History.Dates[0]);
    }

    [Fact]
    public void PriceFile_TimestampInDeclaredDateFormat_ReadAsItsDate()
    {
        var format = CsvFormat.Parse("MM/dd/yyyy", null, null, k => "--" + k);
        var load = PriceFileReader.Read(new StringReader("date,close\n03/28/2024 16:00:00,101.25\n03/29/2024,102\n"), "p.csv", format);
        Assert.Equal(new DateOnly(2024, 3, 28), load.History.Dates[0]);
    }

    [Theory]
    [InlineData("2024-03-28 10:30:00", "10:30:00")]
    [InlineData("2024-03-28T12:00:00Z", "12:00:00")]
    [InlineData("2024-03-28 09:30", "09:30:00")]
    public void PriceFile_IntradayTimestamp_RefusedWithTheTimeAndLineAndColumn(string stamp, string time)
    {
        var error = Assert.Throws<InputDataException>(() => PriceFileReader.Read(new StringReader("date,close\n2024-03-27,100\n" + stamp + ",101.25\n"), "p.csv"));
        Assert.Equal("p.csv", error.File);
        Assert.Equal(3, error.Line);
        Assert.Equal("date", error.Column);
        Assert.Contains("time of day " + time, error.Message, StringComparison.Ordinal);
        Assert.Contains("not daily closes", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("")]
    [InlineData("null")]
    [InlineData("NA")]
    [InlineData("NaN")]
    [InlineData("-")]
    [InlineData("n/a")]
    public void PriceFile_MissingValueInOptionalVolume_ReadAsMissing(string cell)
    {
        var load = PriceFileReader.Read(new StringReader("date,open,high,low,close,volume\n2024-03-28,100,102,99,101,1000\n2024-03-29,101,103,100,102," + cell + "\n"), "p.csv");
        Assert.Equal(2, load.RowsRead);
        Assert.Equal(102, load.History.Close[1]);
    }

    [Theory]
    [InlineData("null")]
    [InlineData("NA")]
    [InlineData("NaN")]
    [InlineData("-")]
    public void PriceFile_MissingValueInRequiredClose_RefusedAsABadRowNamingTheMark(string cell)
    {
        var error = Assert.Throws<InputDataException>(() => PriceFileReader.Read(new StringReader("date,open,high,low,close\n2024-03-28,100,102,99,101\n2024-03-29,101,103,100," + cell + "\n"), "p.csv"));
        Assert.Equal(3, error.Line);
        Assert.Equal("close", error.Column);
        Assert.Contains("'" + cell + "' marks a missing value, but the column is required on every row", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void PriceFile_EmptyRequiredClose_RefusedAsMissing()
    {
        var error = Assert.Throws<InputDataException>(() => PriceFileReader.Read(new StringReader("date,close\n2024-03-28,101\n2024-03-29,\n"), "p.csv"));
        Assert.Equal(3, error.Line);
        Assert.Contains("the value is missing", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("NA")]
    [InlineData("null")]
    [InlineData("")]
    public void OptionQuotes_MissingRate_TakesTheDefaultRate(string cell)
    {
        var quotes = OptionQuoteCsvReader.Read(new StringReader("date,underlying,expiry,strike,type,price,rate\n2024-03-28,100,2024-04-26,100,call,3,0.05\n2024-03-28,100,2024-04-26,100,put,3," + cell + "\n"), "q.csv", 0.03);
        Assert.Equal(0.05, quotes[0].Rate);
        Assert.Equal(0.03, quotes[1].Rate);
    }

    [Fact]
    public void CsvFormat_DecimalCommaWithCommaDelimiter_RefusedNamingTheDelimiterThatWouldWork()
    {
        var error = Assert.Throws<ArgumentException>(() => CsvFormat.Parse(null, ",", ",", k => "--" + k));
        Assert.Contains("--delimiter ';'", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("dd.MM.yy")]
    [InlineData("yyyy-MM")]
    [InlineData("nonsense")]
    public void CsvFormat_DateFormatWithoutFullYearMonthAndDay_Refused(string pattern)
    {
        var error = Assert.Throws<ArgumentException>(() => CsvFormat.Parse(pattern, null, null, k => "--" + k));
        Assert.StartsWith("--date-format", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Config_FormKeys_ReadIntoTheForm()
    {
        var (format, tenor) = VolCast.IO.Config.BacktestConfigFile.ParseInputForm("{ \"dateFormat\": \"dd.MM.yyyy\", \"delimiter\": \";\", \"decimal\": \",\", \"impliedTenor\": \"91d\" }", "c.json");
        Assert.Equal(new CsvFormat("dd.MM.yyyy", ';', ','), format);
        Assert.Equal(91, tenor);
    }

    // round(D · 252 / 365) trading days for a tenor of D calendar days (the horizon's documented mapping,
    // docs/conventions.md; 252 trading days a year is common practice, no source): 30d is 21 trading days.
    [Fact]
    public void ImpliedTenor_ThirtyDaysAgainstTwentyOneTradingDays_NoWarning() =>
        Assert.Null(ImpliedTenor.Check(30, BacktestHorizon.Days(21), "iv.csv"));

    [Fact]
    public void ImpliedTenor_NotDeclared_NoWarning() =>
        Assert.Null(ImpliedTenor.Check(null, BacktestHorizon.Days(5), "iv.csv"));

    [Fact]
    public void ImpliedTenor_ThirtyDaysAgainstTenTradingDays_WarnsSayingWhatIsCompared()
    {
        var warning = ImpliedTenor.Check(30, BacktestHorizon.Days(10), "iv.csv");
        Assert.NotNull(warning);
        Assert.Equal("iv.csv", warning.File);
        Assert.Contains("30-calendar-day tenor", warning.Message, StringComparison.Ordinal);
        Assert.Contains("about 21 trading days", warning.Message, StringComparison.Ordinal);
        Assert.Contains("10 trading days", warning.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void ImpliedTenor_ThirtyDaysAgainstNinetyOneDayTenor_Warns()
    {
        var warning = ImpliedTenor.Check(30, BacktestHorizon.Tenor(91), "iv.csv");
        Assert.NotNull(warning);
        Assert.Contains("91-calendar-day tenor", warning.Message, StringComparison.Ordinal);
        Assert.Null(ImpliedTenor.Check(91, BacktestHorizon.Tenor(91), "iv.csv"));
    }

    private static string Write(PriceHistory h, string dateFormat, char delimiter, char point, bool withVolume)
    {
        var sb = new StringBuilder();
        sb.AppendJoin(delimiter, withVolume ? ["date", "open", "high", "low", "close", "volume"] : new[] { "date", "open", "high", "low", "close" }).Append('\n');
        for (var i = 0; i < h.Count; i++)
        {
            sb.Append(h.Dates[i].ToString(dateFormat, CultureInfo.InvariantCulture))
                .Append(delimiter).Append(Number(h.Open[i], point))
                .Append(delimiter).Append(Number(h.High[i], point))
                .Append(delimiter).Append(Number(h.Low[i], point))
                .Append(delimiter).Append(Number(h.Close[i], point));
            if (withVolume)
            {
                sb.Append(delimiter).Append(i % 7 == 3 ? "NA" : Number(1000.5 + i, point));
            }

            sb.Append('\n');
        }

        return sb.ToString();
    }

    private static string Number(double value, char point) => value.ToString("R", CultureInfo.InvariantCulture).Replace('.', point);
}
