namespace VolCast.IO.Tests;

// Runs every row of Fixtures/BadInput/catalogue.tsv through the readers (hand-written files, common practice, no source).
public sealed class BadInputCatalogueTests
{
    private static string Folder { get; } = Path.Combine(AppContext.BaseDirectory, "Fixtures", "BadInput");

    public static TheoryData<string, string, string, int?, string?, string> Rows() => Rows(exitCode: "3");

    public static TheoryData<string, string, string, int?, string?, string> RangeRows() => Rows(exitCode: "2");

    private static TheoryData<string, string, string, int?, string?, string> Rows(string exitCode)
    {
        var data = new TheoryData<string, string, string, int?, string?, string>();
        foreach (var line in File.ReadAllLines(Path.Combine(Folder, "catalogue.tsv")))
        {
            if (line.Length == 0 || line[0] == '#')
            {
                continue;
            }

            var f = line.Split('\t');
            if (f[5] != exitCode)
            {
                continue;
            }

            data.Add(f[0], f[1], f[2], f[3].Length == 0 ? null : int.Parse(f[3], System.Globalization.CultureInfo.InvariantCulture), f[4].Length == 0 ? null : f[4], f[6]);
        }

        return data;
    }

    [Fact]
    public void Catalogue_CoversEveryFileInTheFolder()
    {
        var listed = Rows().Concat(RangeRows()).Select(r => (string)r[0]).ToHashSet(StringComparer.Ordinal);
        var present = Directory.GetFiles(Folder, "*.csv").Concat(Directory.GetFiles(Folder, "*.json")).Select(Path.GetFileName).ToHashSet(StringComparer.Ordinal);
        Assert.Equal(present.Order(), listed.Order());
        Assert.True(listed.Count >= 40, $"expected at least 40 bad inputs, found {listed.Count}");
    }

    [Theory]
    [MemberData(nameof(Rows))]
    public void Read_BadInput_RefusedNamingFileLineColumnAndProblem(string file, string reader, string unit, int? line, string? column, string fragment)
    {
        var path = Path.Combine(Folder, file);
        var before = File.ReadAllBytes(path);

        if (reader == "quotes" && line is null && column is null)
        {
            // The quotes read, but none is usable: the refusal belongs to the implied command (no constant-tenor point).
            var quotes = VolCast.IO.Quotes.OptionQuoteCsvReader.Read(path, null);
            Assert.Empty(VolCast.Core.Options.ConstantTenorSeries.Compute(quotes, new VolCast.Core.Options.ConstantTenorOptions(30)).Points);
            return;
        }

        var error = Assert.Throws<InputDataException>(() =>
        {
            if (reader == "prices")
            {
                PriceFileReader.Read(path);
            }
            else if (reader == "quotes")
            {
                VolCast.IO.Quotes.OptionQuoteCsvReader.Read(path, null);
            }
            else if (reader == "config")
            {
                VolCast.IO.Config.BacktestConfigFile.Read(path);
            }
            else
            {
                ImpliedFileReader.Read(path, unit switch { "percent" => ImpliedUnit.Percent, "decimal" => ImpliedUnit.Decimal, _ => ImpliedUnit.Infer });
            }
        });

        Assert.Equal(path, error.File);
        Assert.Equal(line, error.Line);
        Assert.Equal(column, error.Column);
        Assert.Contains(fragment, error.Message, StringComparison.Ordinal);
        Assert.StartsWith(path + (line is int l ? $", line {l}" : string.Empty), error.Message, StringComparison.Ordinal);
        Assert.Equal(before, File.ReadAllBytes(path)); // the input is never changed
    }

    [Theory]
    [MemberData(nameof(RangeRows))]
    public void ReadConfig_SettingOutOfRange_RefusedNamingFileSettingAndRange(string file, string reader, string unit, int? line, string? column, string fragment)
    {
        // The ranges are the project's own (SettingLimits); the values are the ones that used to overflow or run out of memory.
        Assert.Equal("config", reader);
        Assert.Empty(unit);
        Assert.Null(line);
        Assert.Null(column);
        var path = Path.Combine(Folder, file);

        var error = Assert.Throws<VolCast.IO.Config.SettingRangeException>(() => VolCast.IO.Config.BacktestConfigFile.Read(path));

        Assert.StartsWith(path + ": ", error.Message, StringComparison.Ordinal);
        Assert.Contains(fragment, error.Message, StringComparison.Ordinal);
        Assert.DoesNotContain("overflow", error.Message, StringComparison.OrdinalIgnoreCase);
    }
}
