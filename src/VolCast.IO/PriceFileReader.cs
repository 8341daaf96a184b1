using System.Globalization;
using VolCast.Core.Data;
using VolCast.IO.Reading;

namespace VolCast.IO;

/// <summary>
/// Loads a daily price file into a <see cref="PriceHistory"/>, refusing bad data with an
/// <see cref="InputDataException"/> that names the file, line, column and value, and says what was expected.
/// </summary>
/// <remarks>
/// <para>Format: comma-separated, UTF-8 with or without a byte-order mark, LF or CRLF line ends, a header row,
/// then one row per trading day. Columns <c>date, open, high, low, close</c>, optional <c>adj_close</c> and
/// <c>volume</c>, in any order; or close-only <c>date, close</c> (optionally <c>adj_close</c>). Header names are
/// matched case-insensitively ignoring spaces, underscores, hyphens and dots ("Adj Close", "adj_close",
/// "AdjClose", "Adjusted Close"); other columns are ignored with one warning. Dates are ISO 8601 yyyy-MM-dd,
/// numbers use '.' as the decimal point (invariant culture), unless another <see cref="CsvFormat"/> is declared. A daily
/// timestamp (midnight or a usual close) is read as its date. Blank lines are skipped. A missing-value mark (null, NA,
/// NaN, -, empty) is a missing volume, and refuses the row in a price or adj_close column.</para>
/// <para>Each row must parse completely; prices must be finite, at least 1e-8 and below 1e15 (values outside are
/// taken as corrupt cells, and the bounds keep every log price ratio finite); high ≥ low and open and close must lie within [low, high]; volume, when given, must be
/// a finite number ≥ 0 or blank. A date may appear once. Rows out of date order are sorted (with a warning).</para>
/// <para>Adjusted close: when <c>adj_close</c> is present, each row's open, high, low and close are multiplied
/// by f = adj_close / close, so the close becomes adj_close (to rounding) and splits and dividends do not show up
/// as jumps. The bar checks are made on the prices as written; multiplying by one positive factor keeps them.</para>
/// <para>Warnings: ignored columns; rows sorted; each gap of more than 10 calendar days; each run of 5 or
/// more identical closes; each close far outside its neighbours (an isolated spike that reverts the next day, a change of
/// scale, or any log return above 1 in size; the rule is in <c>JumpChecks</c>). The input is opened read-only and never modified.</para>
/// </remarks>
public static class PriceFileReader
{
    /// <summary>Prices at or above this are refused as corrupt cells (no traded price comes near it).</summary>
    public const double MaxPrice = 1e15;

    /// <summary>The smallest price accepted. Together with <see cref="MaxPrice"/> it keeps every log price ratio of a
    /// bar finite (the estimators take logarithms of high/low and close/open); smaller values are taken as corrupt cells.</summary>
    public const double MinPrice = 1e-8;

    private const string Expected = "date, open, high, low, close (optional adj_close, volume), or date, close for a close-only file";
    private const string PriceExpected = "a price above zero, such as 101.25";

    private static Dictionary<string, string> Aliases { get; } = new(StringComparer.Ordinal)
    {
        ["date"] = "date",
        ["open"] = "open",
        ["high"] = "high",
        ["low"] = "low",
        ["close"] = "close",
        ["adjclose"] = "adj_close",
        ["adjustedclose"] = "adj_close",
        ["volume"] = "volume",
    };

    /// <summary>Loads a price file.</summary>
    /// <param name="path">The file, as the user gave it; used as given in messages.</param>
    /// <returns>The history, warnings, row count, whether adj_close was applied, and the SHA-256 of the file's bytes.</returns>
    /// <exception cref="InputDataException">The file is missing or unreadable, or its content is invalid.</exception>
    public static PriceLoad Read(string path) => Read(InputBytes.Read(path));

    /// <summary>Loads a price file written in a declared form (date format, delimiter, decimal separator).</summary>
    /// <param name="path">The file, as the user gave it; used as given in messages.</param>
    /// <param name="format">The file's form; <see cref="CsvFormat.Default"/> is ISO dates, commas and '.'.</param>
    /// <returns>The history, warnings, row count, whether adj_close was applied, and the SHA-256 of the file's bytes.</returns>
    /// <exception cref="InputDataException">The file is missing or unreadable, or its content is invalid.</exception>
    public static PriceLoad Read(string path, CsvFormat format) => Read(InputBytes.Read(path), format);

    /// <summary>Loads a price file already read (<see cref="InputBytes.Read"/>), without reading or hashing it again.</summary>
    /// <param name="input">The file's bytes and their SHA-256.</param>
    /// <returns>The history, warnings, row count, whether adj_close was applied, and the SHA-256 of the file's bytes.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static PriceLoad Read(InputBytes input) => Read(input, CsvFormat.Default, DataChecks.Default);

    /// <summary>Loads a price file already read, written in a declared form.</summary>
    /// <param name="input">The file's bytes and their SHA-256.</param>
    /// <param name="format">The file's form; <see cref="CsvFormat.Default"/> is ISO dates, commas and '.'.</param>
    /// <returns>The history, warnings, row count, whether adj_close was applied, and the SHA-256 of the file's bytes.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static PriceLoad Read(InputBytes input, CsvFormat format) => Read(input, format, DataChecks.Default);

    /// <summary>Loads a price file already read, with a choice of how bad rows are treated.</summary>
    /// <param name="input">The file's bytes and their SHA-256.</param>
    /// <param name="checks">Whether rows failing a row check are left out (and listed) instead of refusing the file.</param>
    /// <returns>The history, warnings, suspect values, rows left out, and the SHA-256 of the file's bytes.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static PriceLoad Read(InputBytes input, DataChecks checks) => Read(input, CsvFormat.Default, checks);

    /// <summary>Loads a price file already read, written in a declared form, with a choice of how bad rows are treated.</summary>
    /// <param name="input">The file's bytes and their SHA-256.</param>
    /// <param name="format">The file's form; <see cref="CsvFormat.Default"/> is ISO dates, commas and '.'.</param>
    /// <param name="checks">Whether rows failing a row check are left out (and listed) instead of refusing the file.</param>
    /// <returns>The history, warnings, suspect values, rows left out, and the SHA-256 of the file's bytes.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static PriceLoad Read(InputBytes input, CsvFormat format, DataChecks checks)
    {
        ArgumentNullException.ThrowIfNull(input);
        ArgumentNullException.ThrowIfNull(format);
        ArgumentNullException.ThrowIfNull(checks);
        return Parse(input.Text(), input.Path, input.Sha256, format, checks.SkipBadRows);
    }

    /// <summary>Loads price data from a reader (for tests and in-memory data).</summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="displayName">The name used for the file in messages.</param>
    /// <returns>The load result; <see cref="PriceLoad.Sha256"/> is the SHA-256 of the text's UTF-8 encoding.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static PriceLoad Read(TextReader reader, string displayName) => Read(reader, displayName, CsvFormat.Default, DataChecks.Default);

    /// <summary>Loads price data written in a declared form from a reader (for tests and in-memory data).</summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="displayName">The name used for the file in messages.</param>
    /// <param name="format">The text's form; <see cref="CsvFormat.Default"/> is ISO dates, commas and '.'.</param>
    /// <returns>The load result; <see cref="PriceLoad.Sha256"/> is the SHA-256 of the text's UTF-8 encoding.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static PriceLoad Read(TextReader reader, string displayName, CsvFormat format) => Read(reader, displayName, format, DataChecks.Default);

    /// <summary>Loads price data from a reader, with a choice of how bad rows are treated.</summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="displayName">The name used for the file in messages.</param>
    /// <param name="checks">Whether rows failing a row check are left out (and listed) instead of refusing the file.</param>
    /// <returns>The load result; <see cref="PriceLoad.Sha256"/> is the SHA-256 of the text's UTF-8 encoding.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static PriceLoad Read(TextReader reader, string displayName, DataChecks checks) => Read(reader, displayName, CsvFormat.Default, checks);

    /// <summary>Loads price data written in a declared form from a reader, with a choice of how bad rows are treated.</summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="displayName">The name used for the file in messages.</param>
    /// <param name="format">The text's form; <see cref="CsvFormat.Default"/> is ISO dates, commas and '.'.</param>
    /// <param name="checks">Whether rows failing a row check are left out (and listed) instead of refusing the file.</param>
    /// <returns>The load result; <see cref="PriceLoad.Sha256"/> is the SHA-256 of the text's UTF-8 encoding.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static PriceLoad Read(TextReader reader, string displayName, CsvFormat format, DataChecks checks)
    {
        ArgumentNullException.ThrowIfNull(displayName);
        ArgumentNullException.ThrowIfNull(format);
        ArgumentNullException.ThrowIfNull(checks);
        var text = InputText.ReadAll(reader);
        return Parse(text.StartsWith('\uFEFF') ? text[1..] : text, displayName, InputText.Sha256Hex(text), format, checks.SkipBadRows);
    }

    /// <summary>Loads price data from a file's bytes.</summary>
    internal static PriceLoad ReadBytes(byte[] bytes, string displayName)
    {
        var text = InputText.Decode(bytes, displayName);
        return Parse(text, displayName, InputText.Sha256Hex(bytes), CsvFormat.Default, skipBadRows: false);
    }

    private static PriceLoad Parse(string text, string file, string sha256, CsvFormat format, bool skipBadRows)
    {
        using var reader = new CsvRowReader(text, file, format.Delimiter);
        if (!reader.TryRead(out var headerRow))
        {
            throw new InputDataException(file, 1, null,
                "the file is empty; expected a header row (" + Expected + ") followed by one row per trading day.");
        }

        var header = HeaderMap.Resolve(headerRow, file, Aliases, Expected, format);
        reader.UseHeader([.. header.Names]);
        var layout = Layout.From(header, file);
        var warnings = new List<InputWarning>();
        if (header.IgnoredDescription() is { } ignored)
        {
            warnings.Add(new InputWarning(file, header.Line, ignored));
        }

        var dates = new List<DateOnly>();
        var lines = new List<int>();
        var open = new List<double>();
        var high = new List<double>();
        var low = new List<double>();
        var close = new List<double>();
        var seen = new Dictionary<DateOnly, int>();
        var bad = new BadRows();
        var rowsRead = 0;
        while (reader.TryRead(out var row))
        {
            rowsRead++;
            DateOnly? rowDate = null;
            DateOnly date;
            Bar bar;
            try
            {
                CheckCellCount(row, header, file);
                date = CellParser.Date(row.Cells[layout.Date], file, row.Line, header.Names[layout.Date], format);
                rowDate = date;
                if (seen.TryGetValue(date, out var first))
                {
                    throw new InputDataException(file, row.Line, header.Names[layout.Date], string.Create(CultureInfo.InvariantCulture,
                        $"the date {ValueText.Date(date)} appears twice, on line {first} and line {row.Line}; expected one row per trading day."));
                }

                bar = ReadBar(row, layout, header, file, format);
            }
            catch (InputDataException error) when (error.Line == row.Line)
            {
                bad.Add(error, rowDate);
                continue;
            }

            seen.Add(date, row.Line);
            dates.Add(date);
            lines.Add(row.Line);
            close.Add(bar.Close);
            if (layout.HasRange)
            {
                open.Add(bar.Open);
                high.Add(bar.High);
                low.Add(bar.Low);
            }
        }

        var rejected = bad.Resolve(file, skipBadRows);
        if (dates.Count == 0)
        {
            throw new InputDataException(file, header.Line + 1, null, rejected.Count > 0
                ? "every data row fails the row checks (listed with --skip-bad-rows left out); expected at least one valid row per trading day."
                : "the file has a header but no data rows; expected one row per trading day after the header.");
        }

        var dateArray = dates.ToArray();
        var lineArray = lines.ToArray();
        var order = SeriesChecks.SortIfNeeded(dateArray, lineArray, file, warnings);
        dateArray = SeriesChecks.Permute(dateArray, order);
        lineArray = SeriesChecks.Permute(lineArray, order);
        var closeArray = SeriesChecks.Permute(close.ToArray(), order);
        SeriesChecks.WarnGaps(dateArray, lineArray, file, warnings);
        SeriesChecks.WarnStale(dateArray, closeArray, lineArray, file, warnings);
        var suspects = new List<SuspectFinding>();
        JumpChecks.Warn(dateArray, closeArray, lineArray, file, "close", flagLargeChanges: true, warnings, suspects);
        if (rejected.Count > 0)
        {
            warnings.Add(new InputWarning(file, null, string.Create(CultureInfo.InvariantCulture,
                $"{rejected.Count} row(s) failing the row checks were left out (--skip-bad-rows), the first on line {rejected[0].Line}; they are listed with their reasons in rejected-rows.csv.")));
        }


        var history = layout.HasRange
            ? PriceHistory.FromBars(
                dateArray,
                SeriesChecks.Permute(open.ToArray(), order),
                SeriesChecks.Permute(high.ToArray(), order),
                SeriesChecks.Permute(low.ToArray(), order),
                closeArray)
            : PriceHistory.FromCloses(dateArray, closeArray);
        return new PriceLoad(history, warnings.AsReadOnly(), rowsRead, layout.AdjClose >= 0, sha256) { Suspects = suspects.AsReadOnly(), Rejected = rejected };
    }

    private static void CheckCellCount(CsvRow row, HeaderMap header, string file)
    {
        var cells = row.Cells;
        if (cells.Length < header.Count)
        {
            throw new InputDataException(file, row.Line, header.Names[cells.Length], string.Create(CultureInfo.InvariantCulture,
                $"this row has {cells.Length} cell(s) but the header has {header.Count} columns; expected a value under every header column (is a cell or a comma missing?)."));
        }

        for (var i = header.Count; i < cells.Length; i++)
        {
            if (!string.IsNullOrWhiteSpace(cells[i]))
            {
                throw new InputDataException(file, row.Line, null, string.Create(CultureInfo.InvariantCulture,
                    $"this row has {cells.Length} cells but the header has {header.Count} columns; the extra value {ValueText.Quote(cells[i])} is in position {i + 1}. Expected one value per header column (is there a stray comma, or a decimal comma?)."));
            }
        }
    }

    private static Bar ReadBar(CsvRow row, Layout layout, HeaderMap header, string file, CsvFormat format)
    {
        var line = row.Line;
        double open = 0, high = 0, low = 0;
        if (layout.HasRange)
        {
            open = Price(row, layout.Open, header, file, format);
            high = Price(row, layout.High, header, file, format);
            low = Price(row, layout.Low, header, file, format);
        }

        var close = Price(row, layout.Close, header, file, format);
        if (layout.HasRange)
        {
            if (high < low)
            {
                throw new InputDataException(file, line, header.Names[layout.High], string.Create(CultureInfo.InvariantCulture,
                    $"high {ValueText.Number(high)} is below low {ValueText.Number(low)}; expected high >= low."));
            }

            CheckWithinRange(open, layout.Open, low, high, line, header, file);
            CheckWithinRange(close, layout.Close, low, high, line, header, file);
        }

        if (layout.Volume >= 0 && !CellParser.IsMissing(row.Cells[layout.Volume]))
        {
            var volume = CellParser.Number(row.Cells[layout.Volume], file, line, header.Names[layout.Volume], "a traded volume of zero or more, or a blank cell", format);
            if (volume < 0)
            {
                throw new InputDataException(file, line, header.Names[layout.Volume],
                    "volume " + ValueText.Number(volume) + " is negative; expected zero or more, or a blank cell.");
            }
        }

        if (layout.AdjClose < 0)
        {
            return new Bar(open, high, low, close);
        }

        if (CellParser.IsMissing(row.Cells[layout.AdjClose]))
        {
            // One row without its adjustment would put a false jump into the adjusted series.
            throw new InputDataException(file, line, header.Names[layout.AdjClose], (row.Cells[layout.AdjClose].Trim().Length == 0 ? "the adjusted close is missing" : ValueText.Quote(row.Cells[layout.AdjClose].Trim()) + " marks a missing adjusted close")
                + "; when the file has an adj_close column every row needs one (a row without it would mix adjusted and unadjusted prices). Fill it in, or remove the column to use the prices as written.");
        }

        var adj = Price(row, layout.AdjClose, header, file, format);
        var factor = adj / close;
        var bar = new Bar(open * factor, high * factor, low * factor, close * factor);
        if (!Plausible(factor) || !Plausible(bar.Close) || (layout.HasRange && !(Plausible(bar.Open) && Plausible(bar.High) && Plausible(bar.Low))))
        {
            throw new InputDataException(file, line, header.Names[layout.AdjClose], string.Create(CultureInfo.InvariantCulture,
                $"adjusting by adj_close / close = {ValueText.Number(adj)} / {ValueText.Number(close)} = {ValueText.Number(factor)} takes a price out of range (at least {MinPrice:0e0} and below {MaxPrice:0e0}); expected an adjusted close of the same order as the close."));
        }

        return bar;
    }

    private static double Price(CsvRow row, int index, HeaderMap header, string file, CsvFormat format)
    {
        var column = header.Names[index];
        var value = CellParser.Number(row.Cells[index], file, row.Line, column, PriceExpected, format);
        if (value <= 0)
        {
            throw new InputDataException(file, row.Line, column,
                ValueText.Quote(row.Cells[index].Trim()) + " is not above zero; expected " + PriceExpected + ".");
        }

        if (value < MinPrice)
        {
            throw new InputDataException(file, row.Line, column, ValueText.Quote(row.Cells[index].Trim()) + string.Create(CultureInfo.InvariantCulture,
                $" is too small to be a price; expected a price of at least {MinPrice:0e0}, such as 101.25 (is the cell corrupt?)."));
        }

        if (value >= MaxPrice)
        {
            throw new InputDataException(file, row.Line, column, ValueText.Quote(row.Cells[index].Trim()) + string.Create(CultureInfo.InvariantCulture,
                $" is too large to be a price; expected {PriceExpected} and below {MaxPrice:0e0} (is the cell corrupt?)."));
        }

        return value;
    }

    private static bool Plausible(double value) => double.IsFinite(value) && value >= MinPrice && value < MaxPrice;

    private static void CheckWithinRange(double value, int index, double low, double high, int line, HeaderMap header, string file)
    {
        if (value < low || value > high)
        {
            var name = header.Names[index];
            throw new InputDataException(file, line, name, string.Create(CultureInfo.InvariantCulture,
                $"{name} {ValueText.Number(value)} lies outside the day's range, low {ValueText.Number(low)} to high {ValueText.Number(high)}; expected low <= min(open, close) and high >= max(open, close)."));
        }
    }

    private readonly record struct Bar(double Open, double High, double Low, double Close);

    /// <summary>Column positions in a price file; -1 for an absent optional column.</summary>
    private readonly record struct Layout(int Date, int Open, int High, int Low, int Close, int AdjClose, int Volume)
    {
        public bool HasRange => Open >= 0;

        public static Layout From(HeaderMap header, string file)
        {
            var date = header.Require("date", file, Expected);
            var close = header.Require("close", file, Expected);
            int open = header.IndexOf("open"), high = header.IndexOf("high"), low = header.IndexOf("low");
            var present = (open >= 0 ? 1 : 0) + (high >= 0 ? 1 : 0) + (low >= 0 ? 1 : 0);
            if (present is 1 or 2)
            {
                var missing = new List<string>(3);
                if (open < 0)
                {
                    missing.Add("open");
                }

                if (high < 0)
                {
                    missing.Add("high");
                }

                if (low < 0)
                {
                    missing.Add("low");
                }

                throw new InputDataException(file, header.Line, missing[0], "the header has some of open, high, low but lacks "
                    + string.Join(", ", missing.Select(m => "'" + m + "'"))
                    + "; expected all three (date, open, high, low, close) or none of them for a close-only file (date, close); found " + header.FoundList() + ".");
            }

            return new Layout(date, open, high, low, close, header.IndexOf("adj_close"), header.IndexOf("volume"));
        }
    }
}
