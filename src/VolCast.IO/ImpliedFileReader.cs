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
    public static ImpliedLoad Read(InputBytes input, ImpliedUnit unit = ImpliedUnit.Infer) => Read(input, unit, CsvFormat.Default);

    /// <summary>Loads an implied-volatility file already read, written in a declared form.</summary>
    /// <param name="input">The file's bytes and their SHA-256.</param>
    /// <param name="unit">The unit of the values, or <see cref="ImpliedUnit.Infer"/> to infer it with a warning.</param>
    /// <param name="format">The file's form; <see cref="CsvFormat.Default"/> is ISO dates, commas and '.'.</param>
    /// <returns>The series as decimals, the warnings, the unit used, whether it was inferred, and the SHA-256 of the file's bytes.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static ImpliedLoad Read(InputBytes input, ImpliedUnit unit, CsvFormat format)
    {
        ArgumentNullException.ThrowIfNull(input);
        ArgumentNullException.ThrowIfNull(format);
        return Parse(input.Text(), input.Path, unit, input.Sha256, format);
    }

    /// <summary>Loads implied-volatility data from a reader (for tests and in-memory data).</summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="displayName">The name used for the file in messages.</param>
    /// <param name="unit">The unit of the values, or <see cref="ImpliedUnit.Infer"/> to infer it with a warning.</param>
    /// <returns>The load result; <see cref="ImpliedLoad.Sha256"/> is the SHA-256 of the text's UTF-8 encoding.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static ImpliedLoad Read(TextReader reader, string displayName, ImpliedUnit unit = ImpliedUnit.Infer) =>
        Read(reader, displayName, unit, CsvFormat.Default);

    /// <summary>Loads implied-volatility data written in a declared form from a reader (for tests and in-memory data).</summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="displayName">The name used for the file in messages.</param>
    /// <param name="unit">The unit of the values, or <see cref="ImpliedUnit.Infer"/> to infer it with a warning.</param>
    /// <param name="format">The text's form; <see cref="CsvFormat.Default"/> is ISO dates, commas and '.'.</param>
    /// <returns>The load result; <see cref="ImpliedLoad.Sha256"/> is the SHA-256 of the text's UTF-8 encoding.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static ImpliedLoad Read(TextReader reader, string displayName, ImpliedUnit unit, CsvFormat format)
    {
        ArgumentNullException.ThrowIfNull(displayName);
        ArgumentNullException.ThrowIfNull(format);
        var text = InputText.ReadAll(reader);
        return Parse(text.StartsWith('\uFEFF') ? text[1..] : text, displayName, unit, InputText.Sha256Hex(text), format);
    }

    /// <summary>Loads implied-volatility data from a file's bytes.</summary>
    internal static ImpliedLoad ReadBytes(byte[] bytes, string displayName, ImpliedUnit unit)
    {
        var text = InputText.Decode(bytes, displayName);
        return Parse(text, displayName, unit, InputText.Sha256Hex(bytes), CsvFormat.Default);
    }

    private static ImpliedLoad Parse(string text, string file, ImpliedUnit unit, string sha256, CsvFormat format)
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
        while (reader.TryRead(out var row))
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
            if (!seen.TryAdd(date, row.Line))
            {
                throw new InputDataException(file, row.Line, header.Names[dateIndex], string.Create(CultureInfo.InvariantCulture,
                    $"the date {ValueText.Date(date)} appears twice, on line {seen[date]} and line {row.Line}; expected one value per date."));
            }

            var value = CellParser.Number(row.Cells[ivIndex], file, row.Line, ivName, "an implied volatility such as 0.21 (decimal) or 21 (percent)", format);
            dates.Add(date);
            lines.Add(row.Line);
            values.Add(value);
        }

        if (dates.Count == 0)
        {
            throw new InputDataException(file, header.Line + 1, null,
                "the file has a header but no data rows; expected one row per date after the header.");
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

        else if (unit == ImpliedUnit.Percent && Median(raw) is var declaredMedian && declaredMedian <= 1)
        {
            // Declared percent, but a median of 1% or less is far below any traded volatility: most likely decimals.
            warnings.Add(new InputWarning(file, null, string.Create(CultureInfo.InvariantCulture,
                $"the file was declared percent, but its median value {ValueText.Number(declaredMedian)} would mean {ValueText.Number(declaredMedian)}% a year; if the values are decimals (0.20 = 20%), use --iv-unit decimal.")));
        }

        var scale = unit == ImpliedUnit.Percent ? 0.01 : 1.0;
        var lineArray = lines.ToArray();
        var decimals = new double[raw.Length];
        for (var i = 0; i < raw.Length; i++)
        {
            decimals[i] = raw[i] * scale;
            if (!(decimals[i] > 0) || decimals[i] > MaxDecimal)
            {
                var unitText = unit == ImpliedUnit.Percent ? "percent" : "decimal";
                throw new InputDataException(file, lineArray[i], ivName, string.Create(CultureInfo.InvariantCulture,
                    $"implied volatility {ValueText.Number(raw[i])} ({unitText}{(inferred ? ", inferred" : string.Empty)}) is {ValueText.Number(decimals[i] * 100)}%; expected above 0% and at most 500%{(inferred ? " (if the unit is wrong, declare it with --iv-unit percent|decimal)" : string.Empty)}."));
            }
        }

        var dateArray = dates.ToArray();
        var order = SeriesChecks.SortIfNeeded(dateArray, lineArray, file, warnings);
        var series = new ImpliedSeries(SeriesChecks.Permute(dateArray, order), SeriesChecks.Permute(decimals, order));
        JumpChecks.Warn(series.Dates, series.Volatility, SeriesChecks.Permute(lineArray, order), file, "implied volatility", flagLargeChanges: false, warnings);
        return new ImpliedLoad(series, warnings.AsReadOnly(), unit, inferred, sha256);
    }

    private static double Median(double[] values)
    {
        var sorted = (double[])values.Clone();
        Array.Sort(sorted);
        var mid = sorted.Length / 2;
        return sorted.Length % 2 == 1 ? sorted[mid] : (sorted[mid - 1] / 2) + (sorted[mid] / 2);
    }
}
