using System.Globalization;
using System.Text.Json;
using CsvHelper;
using CsvHelper.Configuration;
using DocumentFormat.OpenXml;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Spreadsheet;
using VolCast.IO.Results;

namespace VolCast.IO.Workbook;

/// <summary>
/// Writes results.xlsx beside a run's CSV files, for spreadsheets: a first sheet with the caution and summary.txt, one
/// sheet per results table (the CSV file's name without .csv), and the run's settings and inputs. Numbers are stored as
/// numbers (volatilities shown in %, p-values to three places, dates as dates), header rows are frozen and columns sized
/// to their content. Every cell holds exactly the CSV's value, so the workbook and the CSV files never disagree.
/// </summary>
/// <remarks>
/// Written with Microsoft's Open XML SDK (MIT): no extra dependency, full control of number formats and frozen panes,
/// and a streaming writer that keeps memory flat for the long tables. A sheet holds at most 1,048,575 data rows (the
/// format's limit); a longer table is cut there and the first sheet says so.
/// </remarks>
public static class ResultsWorkbook
{
    /// <summary>The workbook's file name in a results folder.</summary>
    public const string FileName = "results.xlsx";

    /// <summary>The tables, in sheet order, when they exist in the folder (the long form of forecasts.csv is left out: it repeats the wide sheet).</summary>
    public static IReadOnlyList<string> Tables { get; } =
        ["metrics.csv", "trades.csv", "rule-pnl.csv", "rule-pnl-next-day.csv", "calibration.csv", "coverage.csv", "cone.csv", "forecasts.csv", "rejected-rows.csv"];

    private const int MaxDataRows = 1_048_575;
    private const uint HeaderStyle = 1;
    private static readonly DateOnly SpreadsheetEpoch = new(1899, 12, 30);

    /// <summary>Writes results.xlsx into <paramref name="folder"/> from the CSV files and summary.txt already there.</summary>
    /// <param name="folder">A results folder holding the run's data files.</param>
    /// <param name="runJson">The run record's text (run.json) whose settings and inputs make the last sheet, or null for none.</param>
    /// <param name="cancellationToken">Stops between sheets.</param>
    /// <exception cref="IOException">results.xlsx exists in the folder.</exception>
    public static void Write(string folder, string? runJson, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(folder);
        var path = Path.Combine(folder, FileName);
        var temporary = path + ".tmp";
        try
        {
            using (var document = SpreadsheetDocument.Create(temporary, SpreadsheetDocumentType.Workbook))
            {
                var workbookPart = document.AddWorkbookPart();
                workbookPart.Workbook = new DocumentFormat.OpenXml.Spreadsheet.Workbook();
                var styles = workbookPart.AddNewPart<WorkbookStylesPart>();
                styles.Stylesheet = Stylesheet();
                var sheets = workbookPart.Workbook.AppendChild(new Sheets());
                var notes = new List<string>();
                var summary = Path.Combine(folder, "summary.txt");
                var aboutPart = workbookPart.AddNewPart<WorksheetPart>();
                var tableParts = new List<(string Name, WorksheetPart Part)>();
                foreach (var table in Tables)
                {
                    cancellationToken.ThrowIfCancellationRequested();
                    var csv = Path.Combine(folder, table);
                    if (!File.Exists(csv))
                    {
                        continue;
                    }

                    var part = workbookPart.AddNewPart<WorksheetPart>();
                    if (WriteTable(part, table, csv))
                    {
                        notes.Add($"The sheet {SheetName(table)} holds the first {MaxDataRows:N0} rows of {table}; the file holds them all.");
                    }

                    tableParts.Add((SheetName(table), part));
                }

                var about = new List<string> { "VolCast results", "Caution: " + SummaryText.Caution, string.Empty };
                about.AddRange(notes);
                if (File.Exists(summary))
                {
                    about.AddRange(File.ReadAllLines(summary));
                }

                WriteLines(aboutPart, about);
                uint id = 1;
                sheets.Append(new Sheet { Id = workbookPart.GetIdOfPart(aboutPart), SheetId = id++, Name = "about" });
                foreach (var (name, part) in tableParts)
                {
                    sheets.Append(new Sheet { Id = workbookPart.GetIdOfPart(part), SheetId = id++, Name = name });
                }

                if (runJson is not null)
                {
                    var settings = workbookPart.AddNewPart<WorksheetPart>();
                    WriteSettings(settings, runJson);
                    sheets.Append(new Sheet { Id = workbookPart.GetIdOfPart(settings), SheetId = id, Name = "settings" });
                }

                workbookPart.Workbook.Save();
            }

            File.Move(temporary, path, overwrite: false);
        }
        finally
        {
            File.Delete(temporary);
        }
    }

    /// <summary>Gets the sheet name of a table: its file name without the extension.</summary>
    /// <param name="table">The CSV file's name.</param>
    public static string SheetName(string table) => Path.GetFileNameWithoutExtension(table);

    // Writes one CSV file as a sheet; returns true when the table was cut at the format's row limit.
    private static bool WriteTable(WorksheetPart part, string table, string csvPath)
    {
        using var reader = new StreamReader(csvPath);
        using var csv = new CsvParser(reader, new CsvConfiguration(CultureInfo.InvariantCulture) { BadDataFound = null });
        if (!csv.Read())
        {
            WriteRows(part, [], [], []);
            return false;
        }

        var header = csv.Record ?? [];
        var kinds = header.Select(column => ColumnKinds.Of(table, column)).ToArray();
        var rows = new List<string[]>();
        var cut = false;
        while (csv.Read())
        {
            if (rows.Count == MaxDataRows)
            {
                cut = true;
                break;
            }

            rows.Add(csv.Record ?? []);
        }

        WriteRows(part, header, kinds, rows);
        return cut;
    }

    private static void WriteLines(WorksheetPart part, IReadOnlyList<string> lines) =>
        WriteRows(part, [], [CellKind.General], [.. lines.Select(line => new[] { line })], frozenHeader: false, widthCap: 120);

    private static void WriteSettings(WorksheetPart part, string runJson)
    {
        var rows = new List<string[]>();
        using var doc = JsonDocument.Parse(runJson);
        foreach (var property in doc.RootElement.EnumerateObject())
        {
            if (property.Name != "files")
            {
                Flatten(property.Name, property.Value, rows);
            }
        }

        WriteRows(part, ["setting", "value"], [CellKind.General, CellKind.General], rows);
    }

    private static void Flatten(string key, JsonElement value, List<string[]> rows)
    {
        switch (value.ValueKind)
        {
            case JsonValueKind.Object:
                foreach (var property in value.EnumerateObject())
                {
                    Flatten(key + "." + property.Name, property.Value, rows);
                }

                break;
            case JsonValueKind.Array when value.EnumerateArray().Any(e => e.ValueKind is JsonValueKind.Object or JsonValueKind.Array):
                var i = 0;
                foreach (var item in value.EnumerateArray())
                {
                    Flatten(string.Create(CultureInfo.InvariantCulture, $"{key}[{i++}]"), item, rows);
                }

                break;
            case JsonValueKind.Array:
                rows.Add([key, string.Join(", ", value.EnumerateArray().Select(Scalar))]);
                break;
            default:
                rows.Add([key, Scalar(value)]);
                break;
        }
    }

    private static string Scalar(JsonElement value) => value.ValueKind switch
    {
        JsonValueKind.String => value.GetString() ?? string.Empty,
        JsonValueKind.Null => string.Empty,
        _ => value.GetRawText(),
    };

    private static void WriteRows(WorksheetPart part, string[] header, CellKind[] kinds, List<string[]> rows, bool frozenHeader = true, int widthCap = 45)
    {
        var columns = Math.Max(header.Length, rows.Count == 0 ? 0 : rows.Max(r => r.Length));
        using var writer = OpenXmlWriter.Create(part);
        writer.WriteStartElement(new Worksheet());
        if (frozenHeader && header.Length > 0)
        {
            writer.WriteElement(new SheetViews(new SheetView(
                new Pane { VerticalSplit = 1, TopLeftCell = "A2", ActivePane = PaneValues.BottomLeft, State = PaneStateValues.Frozen },
                new Selection { Pane = PaneValues.BottomLeft, ActiveCell = "A2", SequenceOfReferences = new ListValue<StringValue>(["A2"]) })
            { WorkbookViewId = 0 }));
        }

        if (columns > 0)
        {
            var widths = new Columns();
            for (var c = 0; c < columns; c++)
            {
                var chars = c < header.Length ? header[c].Length : 0;
                for (var r = 0; r < Math.Min(rows.Count, 200); r++)
                {
                    if (c < rows[r].Length)
                    {
                        chars = Math.Max(chars, Shown(rows[r][c], KindAt(kinds, c)));
                    }
                }

                widths.Append(new Column { Min = (uint)(c + 1), Max = (uint)(c + 1), Width = Math.Clamp(chars, 8, widthCap) + 2, CustomWidth = true });
            }

            writer.WriteElement(widths);
        }

        writer.WriteStartElement(new SheetData());
        uint rowIndex = 1;
        if (header.Length > 0)
        {
            writer.WriteStartElement(new Row { RowIndex = rowIndex++ });
            foreach (var name in header)
            {
                writer.WriteElement(TextCell(name, HeaderStyle));
            }

            writer.WriteEndElement();
        }

        foreach (var row in rows)
        {
            writer.WriteStartElement(new Row { RowIndex = rowIndex++ });
            for (var c = 0; c < row.Length; c++)
            {
                if (Cell(row[c], KindAt(kinds, c)) is { } cell)
                {
                    cell.CellReference = Reference(c, rowIndex - 1);
                    writer.WriteElement(cell);
                }
            }

            writer.WriteEndElement();
        }

        writer.WriteEndElement();
        writer.WriteEndElement();
    }

    private static CellKind KindAt(CellKind[] kinds, int column) => column < kinds.Length ? kinds[column] : CellKind.General;

    // The text width a cell shows with its format: a percentage adds a sign, a date is ten characters.
    private static int Shown(string text, CellKind kind) => kind switch
    {
        CellKind.Volatility => 8,
        CellKind.PValue => 6,
        CellKind.Date => 10,
        _ => text.Length,
    };

    private static Cell? Cell(string text, CellKind kind)
    {
        if (text.Length == 0)
        {
            return null;
        }

        if (kind == CellKind.Date && DateOnly.TryParseExact(text, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var date))
        {
            return NumberCell(date.DayNumber - SpreadsheetEpoch.DayNumber, 4);
        }

        if (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var number) && double.IsFinite(number))
        {
            return NumberCell(number, kind switch { CellKind.Volatility => 2, CellKind.PValue => 3, _ => 0u });
        }

        return TextCell(text, 0);
    }

    private static Cell NumberCell(double value, uint style) =>
        new() { CellValue = new CellValue(value), DataType = CellValues.Number, StyleIndex = style == 0 ? null : style };

    private static Cell TextCell(string text, uint style) =>
        new(new InlineString(new Text(text) { Space = SpaceProcessingModeValues.Preserve })) { DataType = CellValues.InlineString, StyleIndex = style == 0 ? null : style };

    private static string Reference(int column, uint row)
    {
        var letters = string.Empty;
        for (var c = column + 1; c > 0; c = (c - 1) / 26)
        {
            letters = (char)('A' + ((c - 1) % 26)) + letters;
        }

        return letters + row.ToString(CultureInfo.InvariantCulture);
    }

    // Styles: 0 general, 1 bold header, 2 volatility 0.00%, 3 p-value 0.000, 4 date yyyy-mm-dd.
    private static Stylesheet Stylesheet() => new(
        new NumberingFormats(
            new NumberingFormat { NumberFormatId = 164, FormatCode = "0.00%" },
            new NumberingFormat { NumberFormatId = 165, FormatCode = "0.000" },
            new NumberingFormat { NumberFormatId = 166, FormatCode = "yyyy-mm-dd" })
        { Count = 3 },
        new Fonts(new Font(), new Font(new Bold())) { Count = 2 },
        new Fills(new Fill(new PatternFill { PatternType = PatternValues.None }), new Fill(new PatternFill { PatternType = PatternValues.Gray125 })) { Count = 2 },
        new Borders(new Border()) { Count = 1 },
        new CellFormats(
            new CellFormat(),
            new CellFormat { FontId = 1, ApplyFont = true },
            new CellFormat { NumberFormatId = 164, ApplyNumberFormat = true },
            new CellFormat { NumberFormatId = 165, ApplyNumberFormat = true },
            new CellFormat { NumberFormatId = 166, ApplyNumberFormat = true })
        { Count = 5 });
}
