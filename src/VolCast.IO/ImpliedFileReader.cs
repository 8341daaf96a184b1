using System.Globalization;
using VolCast.Core.Data;
using VolCast.IO.Reading;

namespace VolCast.IO;

/// <summary>
/// Loads an implied-volatility file (<c>date, iv</c>) into an <see cref="ImpliedSeries"/> of decimals,
/// refusing bad data with an <see cref="InputDataException"/> that names the file, line, column and value.
/// </summary>
/// <remarks>
/// <para>Format as for price files: comma-separated UTF-8 (byte-order mark optional), LF or CRLF, a header row,
/// ISO dates yyyy-MM-dd, '.' decimal point, unless another <see cref="CsvFormat"/> is declared. The value column may be headed <c>iv</c>, <c>implied</c>,
/// <c>implied_vol</c>, <c>implied volatility</c> or <c>vol</c> (case-insensitive); other columns are ignored with a warning.</para>
/// <para>Unit: declared (<see cref="ImpliedUnit.Percent"/>: 20 means 20%; <see cref="ImpliedUnit.Decimal"/>: 0.20
/// means 20%) or inferred: when the median value is above 1.5 the file is read as percent, otherwise as decimal,
/// and a warning says which was inferred and how to declare it. After conversion to a decimal every value must
/// lie in (0, 5.0], i.e. above 0% and at most 500%.</para>
/// <para>A date may appear once; rows out of date order are sorted with a warning. The input is opened
/// read-only and never modified.</para>
/// <para>Warnings: a value far outside its neighbours (an isolated spike that reverts the next day, or a change of
/// scale such as percent turning into decimal in mid-file), named by line; the rule is in <c>JumpChecks</c>.</para>
/// </remarks>
public static class ImpliedFileReader
{
    /// <summary>A median value above this means the file is in percent, when the unit is inferred.</summary>
    public const double PercentThreshold = 1.5;

    /// <summary>The largest implied volatility accepted, as a decimal (500%).</summary>
    public const double MaxDecimal = 5.0;

    private const string Expected = "date, iv (the value column may also be headed implied, implied_vol or vol)";

    private static Dictionary<string, string> Aliases { get; } = new(StringComparer.Ordinal)
    {
        ["date"] = "date",
        ["iv"] = "iv",
        ["implied"] = "iv",
        ["impliedvol"] = "iv",
        ["impliedvolatility"] = "iv",
        ["vol"] = "iv",
    };

    /// <summary>Loads an implied-volatility file.</summary>
    /// <param name="path">The file, as the user gave it; used as given in messages.</param>
    /// <param name="unit">The unit of the values, or <see cref="ImpliedUnit.Infer"/> to infer it with a warning.</param>
    /// <returns>The series as decimals, the warnings, the unit used, whether it was inferred, and the SHA-256 of the file's bytes.</returns>
    /// <exception cref="InputDataException">The file is missing or unreadable, or its content is invalid.</exception>
    public static ImpliedLoad Read(string path, ImpliedUnit unit = ImpliedUnit.Infer) => Read(InputBytes.Read(path), unit);

    /// <summary>Loads an implied-volatility file written in a declared form (date format, delimiter, decimal separator).</summary>
    /// <param name="path">The file, as the user gave it; used as given in messages.</param>
    /// <param name="unit">The unit of the values, or <see cref="ImpliedUnit.Infer"/> to infer it with a warning.</param>
    /// <param name="format">The file's form; <see cref="CsvFormat.Default"/> is ISO dates, commas and '.'.</param>
    /// <returns>The series as decimals, the warnings, the unit used, whether it was inferred, and the SHA-256 of the file's bytes.</returns>
    /// <exception cref="InputDataException">The file is missing or unreadable, or its content is invalid.</exception>
    public static ImpliedLoad Read(string path, ImpliedUnit unit, CsvFormat format) => Read(InputBytes.Read(path), unit, format);

    /// <summary>Loads an implied-volatility file already read (<see cref="InputBytes.Read"/>), without reading or hashing it again.</summary>
    /// <param name="input">The file's bytes and their SHA-256.</param>
    /// <param name="unit">The unit of the values, or <see cref="ImpliedUnit.Infer"/> to infer it with a warning.</param>
    /// <returns>The series as decimals, the warnings, the unit used, whether it was inferred, and the SHA-256 of the file's bytes.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static ImpliedLoad Read(InputBytes input, ImpliedUnit unit = ImpliedUnit.Infer) => Read(input, unit, CsvFormat.Default, DataChecks.Default);

    /// <summary>Loads an implied-volatility file already read, written in a declared form.</summary>
    /// <param name="input">The file's bytes and their SHA-256.</param>
    /// <param name="unit">The unit of the values, or <see cref="ImpliedUnit.Infer"/> to infer it with a warning.</param>
    /// <param name="format">The file's form; <see cref="CsvFormat.Default"/> is ISO dates, commas and '.'.</param>
    /// <returns>The series as decimals, the warnings, the unit used, whether it was inferred, and the SHA-256 of the file's bytes.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static ImpliedLoad Read(InputBytes input, ImpliedUnit unit, CsvFormat format) => Read(input, unit, format, DataChecks.Default);

    /// <summary>Loads an implied-volatility file already read, with a choice of how bad rows are treated.</summary>
    /// <param name="input">The file's bytes and their SHA-256.</param>
    /// <param name="unit">The unit of the values, or <see cref="ImpliedUnit.Infer"/> to infer it with a warning.</param>
    /// <param name="checks">Whether rows failing a row check are left out (and listed) instead of refusing the file.</param>
    /// <returns>The series as decimals, the warnings, suspect values, rows left out, the unit used and the SHA-256.</returns>
    /// <exception cref="InputDataException">The content is invalid, or the declared unit contradicts the values.</exception>
    public static ImpliedLoad Read(InputBytes input, ImpliedUnit unit, DataChecks checks) => Read(input, unit, CsvFormat.Default, checks);

    /// <summary>Loads an implied-volatility file already read, written in a declared form, with a choice of how bad rows are treated.</summary>
    /// <param name="input">The file's bytes and their SHA-256.</param>
    /// <param name="unit">The unit of the values, or <see cref="ImpliedUnit.Infer"/> to infer it with a warning.</param>
    /// <param name="format">The file's form; <see cref="CsvFormat.Default"/> is ISO dates, commas and '.'.</param>
    /// <param name="checks">Whether rows failing a row check are left out (and listed) instead of refusing the file.</param>
    /// <returns>The series as decimals, the warnings, suspect values, rows left out, the unit used and the SHA-256.</returns>
    /// <exception cref="InputDataException">The content is invalid, or the declared unit contradicts the values.</exception>
    public static ImpliedLoad Read(InputBytes input, ImpliedUnit unit, CsvFormat format, DataChecks checks)
    {
        ArgumentNullException.ThrowIfNull(input);
        ArgumentNullException.ThrowIfNull(format);
        ArgumentNullException.ThrowIfNull(checks);
        return Parse(input.Text(), input.Path, unit, input.Sha256, format, checks.SkipBadRows);
    }

    /// <summary>Loads implied-volatility data from a reader (for tests and in-memory data).</summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="displayName">The name used for the file in messages.</param>
    /// <param name="unit">The unit of the values, or <see cref="ImpliedUnit.Infer"/> to infer it with a warning.</param>
    /// <returns>The load result; <see cref="ImpliedLoad.Sha256"/> is the SHA-256 of the text's UTF-8 encoding.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static ImpliedLoad Read(TextReader reader, string displayName, ImpliedUnit unit = ImpliedUnit.Infer) =>
        Read(reader, displayName, unit, CsvFormat.Default, DataChecks.Default);

    /// <summary>Loads implied-volatility data written in a declared form from a reader (for tests and in-memory data).</summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="displayName">The name used for the file in messages.</param>
    /// <param name="unit">The unit of the values, or <see cref="ImpliedUnit.Infer"/> to infer it with a warning.</param>
    /// <param name="format">The text's form; <see cref="CsvFormat.Default"/> is ISO dates, commas and '.'.</param>
    /// <returns>The load result; <see cref="ImpliedLoad.Sha256"/> is the SHA-256 of the text's UTF-8 encoding.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static ImpliedLoad Read(TextReader reader, string displayName, ImpliedUnit unit, CsvFormat format) =>
        Read(reader, displayName, unit, format, DataChecks.Default);

    /// <summary>Loads implied-volatility data from a reader, with a choice of how bad rows are treated.</summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="displayName">The name used for the file in messages.</param>
    /// <param name="unit">The unit of the values, or <see cref="ImpliedUnit.Infer"/> to infer it with a warning.</param>
    /// <param name="checks">Whether rows failing a row check are left out (and listed) instead of refusing the file.</param>
    /// <returns>The load result; <see cref="ImpliedLoad.Sha256"/> is the SHA-256 of the text's UTF-8 encoding.</returns>
    /// <exception cref="InputDataException">The content is invalid, or the declared unit contradicts the values.</exception>
    public static ImpliedLoad Read(TextReader reader, string displayName, ImpliedUnit unit, DataChecks checks) =>
        Read(reader, displayName, unit, CsvFormat.Default, checks);

    /// <summary>Loads implied-volatility data written in a declared form from a reader, with a choice of how bad rows are treated.</summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="displayName">The name used for the file in messages.</param>
    /// <param name="unit">The unit of the values, or <see cref="ImpliedUnit.Infer"/> to infer it with a warning.</param>
    /// <param name="format">The text's form; <see cref="CsvFormat.Default"/> is ISO dates, commas and '.'.</param>
    /// <param name="checks">Whether rows failing a row check are left out (and listed) instead of refusing the file.</param>
    /// <returns>The load result; <see cref="ImpliedLoad.Sha256"/> is the SHA-256 of the text's UTF-8 encoding.</returns>
    /// <exception cref="InputDataException">The content is invalid, or the declared unit contradicts the values.</exception>
    public static ImpliedLoad Read(TextReader reader, string displayName, ImpliedUnit unit, CsvFormat format, DataChecks checks)
    {
        ArgumentNullException.ThrowIfNull(displayName);
        ArgumentNullException.ThrowIfNull(format);
        ArgumentNullException.ThrowIfNull(checks);
        var text = InputText.ReadAll(reader);
        return Parse(text.StartsWith('\uFEFF') ? text[1..] : text, displayName, unit, InputText.Sha256Hex(text), format, checks.SkipBadRows);
    }

    /// <summary>Loads implied-volatility data from a file's bytes.</summary>
    internal static ImpliedLoad ReadBytes(byte[] bytes, string displayName, ImpliedUnit unit)
    {
        var text = InputText.Decode(bytes, displayName);
        return Parse(text, displayName, unit, InputText.Sha256Hex(bytes), CsvFormat.Default, skipBadRows: false);
    }

    private static ImpliedLoad Parse(string text, string file, ImpliedUnit unit, string sha256, CsvFormat format, bool skipBadRows)
    {
        if (!Enum.IsDefined(unit))
        {
            throw new ArgumentOutOfRangeException(nameof(unit), unit, "unit must be Infer, Percent or Decimal.");
        }

        using var reader = new CsvRowReader(text, file, format.Delimiter);
        if (!reader.TryRead(out var headerRow))
        {
            throw new InputDataException(file, 1, null,
                "the file is empty; expected a header row (" + Expected + ") followed by one row per date.");
        }

        var header = HeaderMap.Resolve(headerRow, file, Aliases, Expected, format);
        reader.UseHeader([.. header.Names]);
        var dateIndex = header.Require("date", file, Expected);
        var ivIndex = header.Require("iv", file, Expected);
        var ivName = header.Names[ivIndex];
        var warnings = new List<InputWarning>();
        if (header.IgnoredDescription() is { } ignored)
        {
            warnings.Add(new InputWarning(file, header.Line, ignored));
        }

        var dates = new List<DateOnly>();
        var lines = new List<int>();
        var values = new List<double>();
        var seen = new Dictionary<DateOnly, int>();
        var bad = new BadRows();
        while (reader.TryRead(out var row))
        {
            DateOnly? rowDate = null;
            try
            {
                var (date, value) = ReadRow(row, header, dateIndex, ivIndex, file, seen, format, ref rowDate);
                seen.Add(date, row.Line);
                dates.Add(date);
                lines.Add(row.Line);
                values.Add(value);
            }
            catch (InputDataException error) when (error.Line == row.Line)
            {
                bad.Add(error, rowDate);
            }
        }

        if (dates.Count == 0 && bad.Count == 0)
        {
            throw new InputDataException(file, header.Line + 1, null,
                "the file has a header but no data rows; expected one row per date after the header.");
        }

        return Finish(file, unit, sha256, skipBadRows, ivName, warnings, dates, lines, values, bad);
    }

    private static (DateOnly Date, double Value) ReadRow(CsvRow row, HeaderMap header, int dateIndex, int ivIndex, string file, Dictionary<DateOnly, int> seen, CsvFormat format, ref DateOnly? rowDate)
    {
        if (row.Cells.Length < header.Count)
        {
            throw new InputDataException(file, row.Line, header.Names[row.Cells.Length], string.Create(CultureInfo.InvariantCulture,
                $"this row has {row.Cells.Length} cell(s) but the header has {header.Count} columns; expected a value under every header column."));
        }

        for (var i = header.Count; i < row.Cells.Length; i++)
        {
            if (!string.IsNullOrWhiteSpace(row.Cells[i]))
            {
                throw new InputDataException(file, row.Line, null, string.Create(CultureInfo.InvariantCulture,
                    $"this row has {row.Cells.Length} cells but the header has {header.Count} columns; the extra value {ValueText.Quote(row.Cells[i])} is in position {i + 1}. Expected one value per header column."));
            }
        }

        var date = CellParser.Date(row.Cells[dateIndex], file, row.Line, header.Names[dateIndex], format);
        rowDate = date;
        if (seen.TryGetValue(date, out var first))
        {
            throw new InputDataException(file, row.Line, header.Names[dateIndex], string.Create(CultureInfo.InvariantCulture,
                $"the date {ValueText.Date(date)} appears twice, on line {first} and line {row.Line}; expected one value per date."));
        }

        var value = CellParser.Number(row.Cells[ivIndex], file, row.Line, header.Names[ivIndex], "an implied volatility such as 0.21 (decimal) or 21 (percent)", format);
        return (date, value);
    }

    private static ImpliedLoad Finish(string file, ImpliedUnit unit, string sha256, bool skipBadRows, string ivName, List<InputWarning> warnings, List<DateOnly> dates, List<int> lines, List<double> values, BadRows bad)
    {
        if (values.Count == 0)
        {
            bad.Resolve(file, skipBadRows);
            throw new InputDataException(file, null, null, "every data row fails the row checks; expected at least one valid implied volatility.");
        }

        var inferred = unit == ImpliedUnit.Infer;
        var raw = values.ToArray();
        if (inferred)
        {
            var median = Median(raw);
            unit = median > PercentThreshold ? ImpliedUnit.Percent : ImpliedUnit.Decimal;
            warnings.Add(new InputWarning(file, null, string.Create(CultureInfo.InvariantCulture,
                $"the implied-volatility unit was not declared; read as {(unit == ImpliedUnit.Percent ? "percent" : "decimal")} because the median value {ValueText.Number(median)} is {(unit == ImpliedUnit.Percent ? "above" : "not above")} {PercentThreshold}. Declare it with --iv-unit percent|decimal.")));
        }

        else if (raw.Length > 0)
        {
            CheckDeclaredUnit(file, unit, Median(raw));
        }

        var scale = unit == ImpliedUnit.Percent ? 0.01 : 1.0;
        var keep = new List<int>(raw.Length);
        for (var i = 0; i < raw.Length; i++)
        {
            var value = raw[i] * scale;
            if (!(value > 0) || value > MaxDecimal)
            {
                var unitText = unit == ImpliedUnit.Percent ? "percent" : "decimal";
                bad.Add(new InputDataException(file, lines[i], ivName, string.Create(CultureInfo.InvariantCulture,
                    $"implied volatility {ValueText.Number(raw[i])} ({unitText}{(inferred ? ", inferred" : string.Empty)}) is {ValueText.Number(value * 100)}%; expected above 0% and at most 500%{(inferred ? " (if the unit is wrong, declare it with --iv-unit percent|decimal)" : string.Empty)}.")), dates[i]);
            }
            else
            {
                keep.Add(i);
            }
        }

        var rejected = bad.Resolve(file, skipBadRows);
        if (keep.Count == 0)
        {
            throw new InputDataException(file, null, null, "every data row fails the row checks; expected at least one valid implied volatility.");
        }

        var lineArray = new int[keep.Count];
        var decimals = new double[keep.Count];
        var dateArray = new DateOnly[keep.Count];
        for (var k = 0; k < keep.Count; k++)
        {
            lineArray[k] = lines[keep[k]];
            decimals[k] = raw[keep[k]] * scale;
            dateArray[k] = dates[keep[k]];
        }

        if (rejected.Count > 0)
        {
            warnings.Add(new InputWarning(file, null, string.Create(CultureInfo.InvariantCulture,
                $"{rejected.Count} row(s) failing the row checks were left out (--skip-bad-rows), the first on line {rejected[0].Line}; they are listed with their reasons in rejected-rows.csv.")));
        }

        var order = SeriesChecks.SortIfNeeded(dateArray, lineArray, file, warnings);
        var series = new ImpliedSeries(SeriesChecks.Permute(dateArray, order), SeriesChecks.Permute(decimals, order));
        var sortedLines = SeriesChecks.Permute(lineArray, order);
        var suspects = new List<SuspectFinding>();
        ImpliedChecks.Stale(series.Dates, series.Volatility, sortedLines, file, warnings, suspects);
        JumpChecks.Warn(series.Dates, series.Volatility, sortedLines, file, "implied volatility", flagLargeChanges: false, warnings, suspects);
        return new ImpliedLoad(series, warnings.AsReadOnly(), unit, inferred, sha256) { Suspects = suspects.AsReadOnly(), Rejected = rejected, Lines = sortedLines };
    }

    /// <summary>Refuses a declared unit that the values contradict: percent with a median below <see cref="PercentThreshold"/>, decimal with one above it.</summary>
    private static void CheckDeclaredUnit(string file, ImpliedUnit unit, double median)
    {
        var c = CultureInfo.InvariantCulture;
        if (unit == ImpliedUnit.Percent && median < PercentThreshold)
        {
            throw new InputDataException(file, null, null, string.Create(c,
                $"the file was declared percent (--iv-unit percent), but its median value is {ValueText.Number(median)}, which would mean {ValueText.Number(median)}% a year; values below {PercentThreshold} are decimals (0.20 = 20%). Declare --iv-unit decimal, or check that this is the right file."));
        }

        if (unit == ImpliedUnit.Decimal && median > PercentThreshold)
        {
            throw new InputDataException(file, null, null, string.Create(c,
                $"the file was declared decimal (--iv-unit decimal), but its median value is {ValueText.Number(median)}, which would mean {ValueText.Number(median * 100)}% a year; values above {PercentThreshold} are percent (20 = 20%). Declare --iv-unit percent, or check that this is the right file."));
        }
    }

    private static double Median(double[] values)
    {
        var sorted = (double[])values.Clone();
        Array.Sort(sorted);
        var mid = sorted.Length / 2;
        return sorted.Length % 2 == 1 ? sorted[mid] : (sorted[mid - 1] / 2) + (sorted[mid] / 2);
    }
}
