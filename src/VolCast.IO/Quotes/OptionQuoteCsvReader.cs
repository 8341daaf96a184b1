using System.Globalization;
using VolCast.Core.Options;
using VolCast.IO.Reading;

namespace VolCast.IO.Quotes;

/// <summary>
/// Reads recorded option quotes from a CSV file: <c>date, underlying, expiry, strike, type, price</c>, with
/// optional <c>rate</c> and <c>dividend_yield</c> columns.
/// </summary>
/// <remarks>
/// <para>Header names are matched case-insensitively, ignoring spaces, underscores and hyphens; <c>spot</c> is
/// accepted for <c>underlying</c>, <c>expiration</c> for <c>expiry</c>, <c>option_type</c> and <c>cp</c> for
/// <c>type</c>, <c>q</c> for <c>dividend_yield</c>. Dates are ISO 8601 (yyyy-MM-dd); numbers use the invariant
/// culture; <c>type</c> is call, put, c or p in any case. Rates and yields are continuously compounded
/// decimals (0.05 = 5%); an empty cell, or a missing column, takes the default given to
/// <see cref="Read(string, double?, double)"/>.</para>
/// <para>What stops the read with an <see cref="InputDataException"/> naming file, line, column and value: a
/// missing or repeated column, a row with too few fields, an unparseable date or number, an unknown type, an
/// underlying or strike at or below zero (a corrupt row, not a market quote), no rate anywhere, and a rate or
/// yield outside [−1, 1] (most likely a percent). What is passed on, to be counted and reported by
/// <see cref="ConstantTenorSeries"/>: a price at or below zero (recorded chains hold zero bids) and an expiry
/// on or before the quote date (the expiry day itself is ordinary data). The file is opened read-only.</para>
/// <para>Blank lines are skipped but counted, so every line number is the physical line of the file; a line break
/// inside quotes is refused as malformed quoting on the line where the quote opened.</para>
/// </remarks>
public static class OptionQuoteCsvReader
{
    private static readonly string[] Required = ["date", "underlying", "expiry", "strike", "type", "price"];

    private static readonly Dictionary<string, string> Aliases = new(StringComparer.Ordinal)
    {
        ["date"] = "date",
        ["quotedate"] = "date",
        ["underlying"] = "underlying",
        ["underlyingprice"] = "underlying",
        ["spot"] = "underlying",
        ["expiry"] = "expiry",
        ["expiration"] = "expiry",
        ["expirydate"] = "expiry",
        ["strike"] = "strike",
        ["type"] = "type",
        ["optiontype"] = "type",
        ["cp"] = "type",
        ["callput"] = "type",
        ["price"] = "price",
        ["rate"] = "rate",
        ["dividendyield"] = "dividend_yield",
        ["q"] = "dividend_yield",
    };

    /// <summary>Reads every quote of a file.</summary>
    /// <param name="path">The quotes file.</param>
    /// <param name="defaultRate">The rate for rows without one; null when every row must carry its own.</param>
    /// <param name="defaultDividendYield">The dividend yield for rows without one (0 when not given).</param>
    /// <returns>The quotes in file order, each with its 1-based line.</returns>
    /// <exception cref="InputDataException">The file is missing, or its content cannot be used (see remarks).</exception>
    public static IReadOnlyList<OptionQuote> Read(string path, double? defaultRate, double defaultDividendYield = 0) =>
        Read(path, defaultRate, defaultDividendYield, CsvFormat.Default);

    /// <summary>Reads every quote of a file written in a declared form (date format, delimiter, decimal separator).</summary>
    /// <param name="path">The quotes file.</param>
    /// <param name="defaultRate">The rate for rows without one; null when every row must carry its own.</param>
    /// <param name="defaultDividendYield">The dividend yield for rows without one.</param>
    /// <param name="format">The file's form; <see cref="CsvFormat.Default"/> is ISO dates, commas and '.'.</param>
    /// <returns>The quotes in file order, each with its 1-based line.</returns>
    /// <exception cref="InputDataException">The file is missing, or its content cannot be used (see remarks).</exception>
    public static IReadOnlyList<OptionQuote> Read(string path, double? defaultRate, double defaultDividendYield, CsvFormat format)
    {
        ArgumentNullException.ThrowIfNull(path);
        if (!File.Exists(path))
        {
            throw new InputDataException(path, null, null, "the file does not exist; check the path given to --quotes.");
        }

        using var text = new StreamReader(new MemoryStream(InputFiles.ReadCapped(path, "a CSV file of option quotes", InputText.MaxBytes)));
        return Read(text, path, defaultRate, defaultDividendYield, format);
    }

    /// <summary>Reads every quote from a text reader.</summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="file">The name to use in error messages.</param>
    /// <param name="defaultRate">The rate for rows without one; null when every row must carry its own.</param>
    /// <param name="defaultDividendYield">The dividend yield for rows without one.</param>
    /// <returns>The quotes in order, each with its 1-based line.</returns>
    /// <exception cref="InputDataException">The content cannot be used (see remarks).</exception>
    public static IReadOnlyList<OptionQuote> Read(TextReader reader, string file, double? defaultRate, double defaultDividendYield = 0) =>
        Read(reader, file, defaultRate, defaultDividendYield, CsvFormat.Default);

    /// <summary>Reads every quote from a text reader, written in a declared form.</summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="file">The name to use in error messages.</param>
    /// <param name="defaultRate">The rate for rows without one; null when every row must carry its own.</param>
    /// <param name="defaultDividendYield">The dividend yield for rows without one.</param>
    /// <param name="format">The text's form; <see cref="CsvFormat.Default"/> is ISO dates, commas and '.'.</param>
    /// <returns>The quotes in order, each with its 1-based line.</returns>
    /// <exception cref="InputDataException">The content cannot be used (see remarks).</exception>
    public static IReadOnlyList<OptionQuote> Read(TextReader reader, string file, double? defaultRate, double defaultDividendYield, CsvFormat format)
    {
        ArgumentNullException.ThrowIfNull(reader);
        ArgumentNullException.ThrowIfNull(file);
        ArgumentNullException.ThrowIfNull(format);
        // The shared row reader refuses a line break inside quotes, so a quote left open is reported on the line
        // where its record starts, not on the last line the parser consumed looking for the closing quote.
        using var rows = new CsvRowReader(reader.ReadToEnd(), file, format.Delimiter);
        if (!rows.TryRead(out var headerRow))
        {
            throw new InputDataException(file, 1, null, "the file is empty; expected a header row: date,underlying,expiry,strike,type,price[,rate,dividend_yield].");
        }

        var header = Trimmed(headerRow.Cells);
        rows.UseHeader(header);
        var columns = MapHeader(header, file, headerRow.Line, format.Delimiter);
        if (!columns.ContainsKey("rate") && defaultRate is null)
        {
            throw new InputDataException(file, headerRow.Line, "rate",
                "there is no rate column and no --rate was given; add a rate column (decimal, 0.05 = 5%) or pass --rate.");
        }

        var quotes = new List<OptionQuote>();
        while (rows.TryRead(out var csvRow))
        {
            var record = Trimmed(csvRow.Cells);
            var line = csvRow.Line;
            if (record.Length < header.Length)
            {
                throw new InputDataException(file, line, null,
                    string.Create(CultureInfo.InvariantCulture, $"expected {header.Length} fields as in the header, found {record.Length}."));
            }

            var row = new Row(record, columns, file, line, format);
            var date = row.Date("date");
            var underlying = row.Positive("underlying");
            var expiry = row.Date("expiry");
            var strike = row.Positive("strike");
            var type = row.Type();
            var price = row.Number("price");
            var rate = row.Rate("rate", defaultRate);
            var yield = row.Rate("dividend_yield", defaultDividendYield) ?? defaultDividendYield;
            quotes.Add(new OptionQuote(date, underlying, expiry, strike, type, price, rate!.Value, yield, line));
        }

        if (quotes.Count == 0)
        {
            throw new InputDataException(file, headerRow.Line + 1, null, "the file has a header but no quotes; expected one row per quote after the header.");
        }

        return quotes;
    }

    private static string[] Trimmed(string[] cells)
    {
        var trimmed = new string[cells.Length];
        for (var i = 0; i < cells.Length; i++)
        {
            trimmed[i] = cells[i].Trim();
        }

        return trimmed;
    }

    private static Dictionary<string, int> MapHeader(string[] header, string file, long line, char delimiter)
    {
        if (header.Length == 1)
        {
            HeaderMap.CheckDelimiter(header[0], (int)line, file, "date, underlying, expiry, strike, type, price", delimiter);
        }

        var columns = new Dictionary<string, int>(StringComparer.Ordinal);
        for (var i = 0; i < header.Length; i++)
        {
            var key = Normalize(header[i]);
            if (!Aliases.TryGetValue(key, out var name))
            {
                continue;
            }

            if (!columns.TryAdd(name, i))
            {
                throw new InputDataException(file, (int)line, header[i], $"the column '{name}' appears twice; keep one.");
            }
        }

        foreach (var name in Required)
        {
            if (!columns.ContainsKey(name))
            {
                throw new InputDataException(file, (int)line, name,
                    $"the required column '{name}' is missing; the header has [{string.Join(", ", header)}] and needs date, underlying, expiry, strike, type, price (rate and dividend_yield optional).");
            }
        }

        return columns;
    }

    private static string Normalize(string name)
    {
        Span<char> buffer = stackalloc char[name.Length];
        var n = 0;
        foreach (var c in name)
        {
            if (c is not (' ' or '_' or '-'))
            {
                buffer[n++] = char.ToLowerInvariant(c);
            }
        }

        return new string(buffer[..n]);
    }

    private readonly struct Row(string[] record, Dictionary<string, int> columns, string file, int line, CsvFormat format)
    {
        public string Cell(string column) => record[columns[column]];

        public DateOnly Date(string column)
        {
            var value = Cell(column);
            return CellParser.TryDate(value, format, file, line, column, out var date)
                && date >= CellParser.MinDate && date <= CellParser.MaxDate
                ? date
                : throw Error(column, value, format.DateFormat is null
                    ? "a date in ISO 8601 form yyyy-MM-dd from 1800-01-01 to 9989-12-31, for example 2024-03-15 (dates written another way are read with --date-format)"
                    : "a date written " + format.DateFormat + " (--date-format) from 1800-01-01 to 9989-12-31");
        }

        public double Number(string column)
        {
            var value = Cell(column);
            return CellParser.TryNumber(value, format, out var number) && double.IsFinite(number)
                ? number
                : throw Error(column, value, "a finite decimal number with '" + format.DecimalSeparator + "' as the decimal point"
                    + (CellParser.IsMissing(value) ? " (" + ValueText.Quote(value) + " marks a missing value, but the column is required on every quote)" : string.Empty));
        }

        public double Positive(string column)
        {
            var number = Number(column);
            return number > 0 ? number : throw Error(column, Cell(column), "a number above zero");
        }

        public double? Rate(string column, double? fallback)
        {
            if (!columns.ContainsKey(column) || CellParser.IsMissing(Cell(column)))
            {
                return fallback ?? throw new InputDataException(file, line, column,
                    "the cell is empty and no --rate was given; fill in the rate (decimal, 0.05 = 5%) or pass --rate.");
            }

            var number = Number(column);
            return number is >= -1 and <= 1
                ? number
                : throw Error(column, Cell(column), "a continuously compounded decimal rate between -1 and 1 (0.05 = 5%; a percent was probably given)");
        }

        public OptionType Type()
        {
            var value = Cell("type");
            return value.ToUpperInvariant() switch
            {
                "CALL" or "C" => OptionType.Call,
                "PUT" or "P" => OptionType.Put,
                _ => throw Error("type", value, "call, put, c or p (any case)"),
            };
        }

        private InputDataException Error(string column, string value, string expected) =>
            new(file, line, column, $"could not use '{value}'; expected {expected}.");
    }
}
