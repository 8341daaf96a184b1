using System.Globalization;
using CsvHelper;
using CsvHelper.Configuration;
using ExcelDataReader;
using VolCast.IO.Tests.Results;
using VolCast.IO.Workbook;

namespace VolCast.IO.Tests.Workbook;

/// <summary>
/// results.xlsx read back with another library (ExcelDataReader) than the one that wrote it (the Open XML SDK): every
/// cell equals the CSV file's cell, numbers are numbers with the display format the table's column calls for, and the
/// first sheet carries the caution.
/// </summary>
public sealed class ResultsWorkbookTests
{
    // ExcelDataReader asks for code page 1252 when it starts, even for .xlsx; .NET carries it in the code-pages provider.
    static ResultsWorkbookTests() => System.Text.Encoding.RegisterProvider(System.Text.CodePagesEncodingProvider.Instance);

    [Fact]
    public void Write_EveryCellOfEveryTable_EqualsTheCsvFile()
    {
        using var temp = new TempFolder();
        var folder = Path.Combine(temp.Path, "run");
        var (result, prices) = BacktestResultsWriterTests.SmallRun();
        BacktestResultsWriterTests.Write(folder, result, prices);
        ResultsWorkbook.Write(folder, File.ReadAllText(Path.Combine(folder, "run.json")));

        var sheets = ReadWorkbook(Path.Combine(folder, ResultsWorkbook.FileName));
        var tables = ResultsWorkbook.Tables.Where(t => File.Exists(Path.Combine(folder, t))).ToList();
        Assert.Contains("metrics.csv", tables);
        Assert.Contains("forecasts.csv", tables);
        Assert.Equal(["about", .. tables.Select(ResultsWorkbook.SheetName), "settings"], sheets.Keys);
        var cellsCompared = 0;
        foreach (var table in tables)
        {
            var csv = ReadCsv(Path.Combine(folder, table));
            var sheet = sheets[ResultsWorkbook.SheetName(table)];
            Assert.Equal(csv.Count, sheet.Count);
            for (var r = 0; r < csv.Count; r++)
            {
                for (var c = 0; c < csv[r].Length; c++)
                {
                    var value = c < sheet[r].Length ? sheet[r][c] : null;
                    AssertSameCell(csv[r][c], value, $"{table} row {r + 1} column {c + 1}");
                    cellsCompared++;
                }
            }
        }

        Assert.True(cellsCompared > 1000, $"only {cellsCompared} cells compared");
    }

    [Fact]
    public void Write_FormatsByColumn_VolatilityInPercentPValuesToThreePlacesDatesAsDates()
    {
        using var temp = new TempFolder();
        var folder = Path.Combine(temp.Path, "run");
        var (result, prices) = BacktestResultsWriterTests.SmallRun();
        BacktestResultsWriterTests.Write(folder, result, prices);
        ResultsWorkbook.Write(folder, runJson: null);

        using var stream = File.OpenRead(Path.Combine(folder, ResultsWorkbook.FileName));
        using var reader = ExcelReaderFactory.CreateReader(stream);
        var formats = new Dictionary<string, string>(StringComparer.Ordinal);
        do
        {
            string[]? header = null;
            while (reader.Read())
            {
                if (header is null)
                {
                    header = [.. Enumerable.Range(0, reader.FieldCount).Select(i => reader.GetValue(i)?.ToString() ?? string.Empty)];
                    continue;
                }

                for (var i = 0; i < reader.FieldCount; i++)
                {
                    if (reader.GetValue(i) is double or DateTime)
                    {
                        formats.TryAdd(reader.Name + "." + header[i], reader.GetNumberFormatString(i));
                    }
                }
            }
        }
        while (reader.NextResult());

        Assert.Equal("0.00%", formats["forecasts.realized"]);
        Assert.Equal("0.00%", formats["metrics.rmse_vol"]);
        Assert.Equal("0.000", formats["metrics.dm_qlike_p"]);
        Assert.Equal("yyyy-mm-dd", formats["forecasts.date"]);
        Assert.Equal("General", formats["metrics.n"]);
    }

    [Fact]
    public void Write_FirstSheet_CarriesTheCautionAndTheSummary()
    {
        using var temp = new TempFolder();
        var folder = Path.Combine(temp.Path, "run");
        var (result, prices) = BacktestResultsWriterTests.SmallRun();
        BacktestResultsWriterTests.Write(folder, result, prices);
        ResultsWorkbook.Write(folder, runJson: null);

        var about = ReadWorkbook(Path.Combine(folder, ResultsWorkbook.FileName))["about"].Select(r => r[0] as string).ToList();
        // The usual cautions of a tool that can lead people to trade (common practice, no source).
        Assert.Contains(about, line => line is not null && line.Contains("not advice", StringComparison.Ordinal));
        foreach (var line in File.ReadAllLines(Path.Combine(folder, "summary.txt")).Where(l => l.Length > 0))
        {
            Assert.Contains(line, about);
        }
    }

    [Fact]
    public void Write_ExistingWorkbook_IsNotOverwritten()
    {
        using var temp = new TempFolder();
        File.WriteAllText(Path.Combine(temp.Path, ResultsWorkbook.FileName), "mine");

        Assert.Throws<IOException>(() => ResultsWorkbook.Write(temp.Path, runJson: null));
        Assert.Equal("mine", File.ReadAllText(Path.Combine(temp.Path, ResultsWorkbook.FileName)));
        Assert.Single(Directory.GetFiles(temp.Path));
    }

    private static void AssertSameCell(string csv, object? cell, string where)
    {
        if (csv.Length == 0)
        {
            Assert.True(cell is null, $"{where}: expected an empty cell, got {cell}");
        }
        else if (cell is DateTime date)
        {
            Assert.Equal(csv, date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
        }
        else if (cell is double number)
        {
            // Stored as the number the CSV writes (round-trip "R" text), so the doubles are equal bit for bit.
            Assert.Equal(double.Parse(csv, CultureInfo.InvariantCulture), number);
        }
        else
        {
            Assert.Equal(csv, cell as string);
        }
    }

    private static List<string[]> ReadCsv(string path)
    {
        using var reader = new StreamReader(path);
        using var csv = new CsvParser(reader, new CsvConfiguration(CultureInfo.InvariantCulture));
        var rows = new List<string[]>();
        while (csv.Read())
        {
            rows.Add(csv.Record ?? []);
        }

        return rows;
    }

    private static Dictionary<string, List<object?[]>> ReadWorkbook(string path)
    {
        using var stream = File.OpenRead(path);
        using var reader = ExcelReaderFactory.CreateReader(stream);
        var sheets = new Dictionary<string, List<object?[]>>(StringComparer.Ordinal);
        do
        {
            var rows = new List<object?[]>();
            while (reader.Read())
            {
                rows.Add([.. Enumerable.Range(0, reader.FieldCount).Select(i => reader.GetValue(i))]);
            }

            sheets.Add(reader.Name, rows);
        }
        while (reader.NextResult());
        return sheets;
    }
}
