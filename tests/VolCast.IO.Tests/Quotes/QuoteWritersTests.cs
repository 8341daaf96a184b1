using System.Collections.Immutable;
using System.Globalization;
using VolCast.Core.Options;
using VolCast.IO.Csv;
using VolCast.IO.Quotes;

namespace VolCast.IO.Tests.Quotes;

public sealed class QuoteWritersTests : IDisposable
{
    private readonly TempFolder _temp = new("quote-writers");

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void ConstantTenorWrite_Values_RoundTripExactly()
    {
        var path = _temp.Combine("iv.csv");
        var vol = 0.1 + (1.0 / 3.0);
        ConstantTenorCsv.Write(path, [new ConstantTenorPoint(new DateOnly(2024, 3, 1), vol, default, default, false)], overwrite: false);
        var lines = File.ReadAllLines(path);
        Assert.Equal("date,iv", lines[0]);
        var cells = lines[1].Split(',');
        Assert.Equal("2024-03-01", cells[0]);
        Assert.Equal(vol, double.Parse(cells[1], CultureInfo.InvariantCulture));
    }

    [Fact]
    public void ConstantTenorWrite_ExistingFileWithoutOverwrite_Throws()
    {
        var path = _temp.Combine("iv.csv");
        File.WriteAllText(path, "keep");
        Assert.Throws<IOException>(() => ConstantTenorCsv.Write(path, [], overwrite: false));
        Assert.Equal("keep", File.ReadAllText(path));
    }

    [Fact]
    public void DiagnosticsWrite_DetailWithComma_IsQuotedAndKebabCased()
    {
        var path = _temp.Combine("diag.csv");
        var d = new ChainDiagnostic(DiagnosticScope.Quote, DiagnosticReason.BelowIntrinsic, new DateOnly(2024, 3, 1), new DateOnly(2024, 4, 19), 95, OptionType.Put, 12, "price 1, forward 100");
        QuoteDiagnosticsCsv.Write(path, ImmutableArray.Create(d), overwrite: false);
        Assert.DoesNotContain('\r', File.ReadAllText(path));
        var lines = File.ReadAllLines(path);
        Assert.Equal("scope,reason,severity,date,expiry,strike,type,line,detail", lines[0]);
        Assert.Equal("quote,below-intrinsic,rejected,2024-03-01,2024-04-19,95,put,12,\"price 1, forward 100\"", lines[1]);
    }
}
