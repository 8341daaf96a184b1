using System.Collections.Immutable;
using System.Globalization;
using VolCast.Core.Data;
using VolCast.Core.Forecasters;
using VolCast.IO.Reading;

namespace VolCast.IO;

/// <summary>
/// Loads a file of the user's own volatility forecasts, <c>date, NAME1, NAME2, …</c>: each value column becomes a
/// forecaster <c>user:NAME</c> whose value dated t is the forecast made at t's close of the average annualized
/// volatility over the backtest's horizon.
/// </summary>
/// <remarks>
/// <para>Same form as the implied file (header row, one row per date, a declared <see cref="CsvFormat"/>). An empty
/// cell or a missing-value mark is a gap: that forecaster has no forecast on that date. The unit (decimal or percent)
/// is declared or inferred from the median of every value, with a warning, as for the implied file; after conversion
/// every value must lie in (0, 5.0].</para>
/// <para>Refused (exit 3, with file, line and column): no value column, an empty or duplicated name (without regard to
/// case), a name that is itself a forecaster spec or a column of forecasts.csv (<c>date, realized, implied</c>,
/// <c>adaptive:…</c>, <c>user:…</c>), a duplicated date, a value that is not a number, zero, negative or above 500%.</para>
/// <para>The tool cannot check such a file for look-ahead: the user guarantees that each value was made from data
/// known at its date's close.</para>
/// </remarks>
public static class UserForecastsFileReader
{
    private const string Expected = "date, then one column per forecast, headed by its name (such as date, my_model)";

    /// <summary>Loads a forecasts file already read (<see cref="InputBytes.Read"/>).</summary>
    /// <param name="input">The file's bytes and their SHA-256.</param>
    /// <param name="unit">The unit of the values, or <see cref="ImpliedUnit.Infer"/> to infer it with a warning.</param>
    /// <param name="format">The file's form; <see cref="CsvFormat.Default"/> is ISO dates, commas and '.'.</param>
    /// <returns>The forecasters, the warnings, the unit used and the SHA-256.</returns>
    /// <exception cref="InputDataException">The content is invalid; the message names the line and column.</exception>
    public static UserForecastsLoad Read(InputBytes input, ImpliedUnit unit, CsvFormat format)
    {
        ArgumentNullException.ThrowIfNull(input);
        ArgumentNullException.ThrowIfNull(format);
        return Parse(input.Text(), input.Path, unit, input.Sha256, format);
    }

    /// <summary>Loads forecasts from text (for tests and in-memory data).</summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="displayName">The name used for the file in messages.</param>
    /// <param name="unit">The unit of the values, or <see cref="ImpliedUnit.Infer"/> to infer it with a warning.</param>
    /// <returns>The load result.</returns>
    /// <exception cref="InputDataException">The content is invalid.</exception>
    public static UserForecastsLoad Read(TextReader reader, string displayName, ImpliedUnit unit = ImpliedUnit.Infer)
    {
        ArgumentNullException.ThrowIfNull(displayName);
        var text = InputText.ReadAll(reader);
        return Parse(text.StartsWith('\uFEFF') ? text[1..] : text, displayName, unit, InputText.Sha256Hex(text), CsvFormat.Default);
    }

    /// <summary>
    /// Checks the forecasts against the price dates: at least one forecast date must be a price date; a forecaster
    /// with price dates between its first and last forecast that it has no value for is counted in a warning (those
    /// dates are scored without it).
    /// </summary>
    /// <param name="load">The loaded forecasts.</param>
    /// <param name="file">The forecasts file, for messages.</param>
    /// <param name="priceDates">The dates of the price history, increasing.</param>
    /// <returns>One warning per forecaster with gaps or dates that are not price dates.</returns>
    /// <exception cref="InputDataException">No forecast date is a price date.</exception>
    public static IReadOnlyList<InputWarning> CheckAgainstPrices(UserForecastsLoad load, string file, ReadOnlySpan<DateOnly> priceDates)
    {
        ArgumentNullException.ThrowIfNull(load);
        ArgumentNullException.ThrowIfNull(file);
        var warnings = new List<InputWarning>();
        var prices = new HashSet<DateOnly>(priceDates.ToArray());
        var anyShared = false;
        foreach (var f in load.Forecasters)
        {
            var dates = f.Dates;
            var shared = 0;
            foreach (var d in dates)
            {
                shared += prices.Contains(d) ? 1 : 0;
            }

            anyShared |= shared > 0;
            var span = 0;
            foreach (var d in priceDates)
            {
                span += dates.Length > 0 && d >= dates[0] && d <= dates[^1] ? 1 : 0;
            }

            var gaps = span - shared;
            var notPriceDates = dates.Length - shared;
            if (gaps > 0 || notPriceDates > 0)
            {
                warnings.Add(new InputWarning(file, null, string.Create(CultureInfo.InvariantCulture,
                    $"{f.Spec} has no forecast on {gaps} of the {span} price dates from {ValueText.Date(dates[0])} to {ValueText.Date(dates[^1])} (those dates are scored without it){(notPriceDates > 0 ? $"; {notPriceDates} of its dates are not price dates and are left out" : string.Empty)}.")));
            }
        }

        if (!anyShared)
        {
            var first = load.Forecasters.Min(f => f.Dates[0]);
            var last = load.Forecasters.Max(f => f.Dates[^1]);
            throw new InputDataException(file, null, null, string.Create(CultureInfo.InvariantCulture,
                $"no forecast date ({ValueText.Date(first)} to {ValueText.Date(last)}) is a date of the price file ({(priceDates.Length == 0 ? "empty" : $"{ValueText.Date(priceDates[0])} to {ValueText.Date(priceDates[^1])}")}); check that both files cover the same period and use the same date format."));
        }

        return warnings;
    }

    private static UserForecastsLoad Parse(string text, string file, ImpliedUnit unit, string sha256, CsvFormat format)
    {
        if (!Enum.IsDefined(unit))
        {
            throw new ArgumentOutOfRangeException(nameof(unit), unit, "unit must be Infer, Percent or Decimal.");
        }

        using var reader = new CsvRowReader(text, file, format.Delimiter);
        if (!reader.TryRead(out var headerRow))
        {
            throw new InputDataException(file, 1, null, "the file is empty; expected a header row (" + Expected + ") followed by one row per date.");
        }

        var names = Header(headerRow, file);
        reader.UseHeader(names);
        var columns = names.Length - 1;
        var dates = new List<DateOnly>();
        var lines = new List<int>();
        var cells = new List<double?[]>();
        var seen = new Dictionary<DateOnly, int>();
        while (reader.TryRead(out var row))
        {
            if (row.Cells.Length > names.Length && row.Cells.Skip(names.Length).Any(c => !string.IsNullOrWhiteSpace(c)))
            {
                throw new InputDataException(file, row.Line, null, string.Create(CultureInfo.InvariantCulture,
                    $"this row has {row.Cells.Length} cells but the header has {names.Length} columns; expected one value per header column."));
            }

            var date = CellParser.Date(row.Cells[0], file, row.Line, names[0], format);
            if (seen.TryGetValue(date, out var firstLine))
            {
                throw new InputDataException(file, row.Line, names[0], string.Create(CultureInfo.InvariantCulture,
                    $"the date {ValueText.Date(date)} appears twice, on line {firstLine} and line {row.Line}; expected one row per date."));
            }

            seen.Add(date, row.Line);
            var values = new double?[columns];
            for (var c = 0; c < columns; c++)
            {
                var cell = c + 1 < row.Cells.Length ? row.Cells[c + 1] : string.Empty;
                values[c] = CellParser.IsMissing(cell)
                    ? null
                    : CellParser.Number(cell, file, row.Line, names[c + 1], "a volatility forecast such as 0.21 (decimal) or 21 (percent), or an empty cell for no forecast", format);
            }

            dates.Add(date);
            lines.Add(row.Line);
            cells.Add(values);
        }

        if (dates.Count == 0)
        {
            throw new InputDataException(file, headerRow.Line + 1, null, "the file has a header but no data rows; expected one row per date after the header.");
        }

        var warnings = new List<InputWarning>();
        var (used, scale) = Unit(file, unit, cells, warnings);
        var order = Enumerable.Range(0, dates.Count).OrderBy(i => dates[i]).ToArray();
        if (order.Where((k, i) => k != i).Any())
        {
            warnings.Add(new InputWarning(file, null, "the rows are not in date order; they were sorted by date."));
        }

        var forecasters = ImmutableArray.CreateBuilder<UserForecaster>(columns);
        for (var c = 0; c < columns; c++)
        {
            var d = new List<DateOnly>();
            var v = new List<double>();
            foreach (var i in order)
            {
                if (cells[i][c] is not double raw)
                {
                    continue;
                }

                var value = raw * scale;
                if (!(value > 0) || value > ImpliedFileReader.MaxDecimal)
                {
                    var unitText = used == ImpliedUnit.Percent ? "percent" : "decimal";
                    throw new InputDataException(file, lines[i], names[c + 1], string.Create(CultureInfo.InvariantCulture,
                        $"the forecast {ValueText.Number(raw)} ({unitText}{(unit == ImpliedUnit.Infer ? ", inferred" : string.Empty)}) is {ValueText.Number(value * 100)}%; expected a volatility above 0% and at most 500% (leave the cell empty where there is no forecast)."));
                }

                d.Add(dates[i]);
                v.Add(value);
            }

            if (d.Count == 0)
            {
                throw new InputDataException(file, headerRow.Line, names[c + 1], "the column has no value on any row; expected at least one forecast, or remove the column.");
            }

            forecasters.Add(new UserForecaster(names[c + 1], d.ToArray(), v.ToArray()));
        }

        return new UserForecastsLoad(forecasters.MoveToImmutable(), warnings.AsReadOnly(), used, unit == ImpliedUnit.Infer, sha256);
    }

    private static string[] Header(CsvRow headerRow, string file)
    {
        var names = headerRow.Cells.Select(c => c.Trim()).ToArray();
        while (names.Length > 1 && names[^1].Length == 0)
        {
            names = names[..^1];
        }

        if (!names[0].Equals("date", StringComparison.OrdinalIgnoreCase))
        {
            throw new InputDataException(file, headerRow.Line, names[0].Length == 0 ? null : names[0],
                "the first column must be headed date; expected " + Expected + ".");
        }

        if (names.Length < 2)
        {
            throw new InputDataException(file, headerRow.Line, null, "the file has no forecast column; expected " + Expected + ".");
        }

        var seen = new Dictionary<string, int>(StringComparer.OrdinalIgnoreCase);
        for (var i = 1; i < names.Length; i++)
        {
            var name = names[i];
            var where = string.Create(CultureInfo.InvariantCulture, $"column {i + 1}");
            if (name.Length == 0)
            {
                throw new InputDataException(file, headerRow.Line, where, "the column has no name; expected a name for each forecast column, such as my_model.");
            }

            if (seen.TryGetValue(name, out var first))
            {
                throw new InputDataException(file, headerRow.Line, name, string.Create(CultureInfo.InvariantCulture,
                    $"the name {ValueText.Quote(name)} heads columns {first + 1} and {i + 1} (names are compared without regard to case); give each forecast column its own name."));
            }

            seen.Add(name, i);
            if (IsReserved(name))
            {
                throw new InputDataException(file, headerRow.Line, name, string.Create(CultureInfo.InvariantCulture,
                    $"the name {ValueText.Quote(name)} is a built-in forecaster or a column of forecasts.csv; rename the column (for example my_{name.Replace(':', '_')}), it is then scored as user:NAME."));
            }
        }

        return names;
    }

    /// <summary>A name that is a built-in spec, a column of forecasts.csv, or carries a prefix the tool uses.</summary>
    private static bool IsReserved(string name)
    {
        if (name.Equals("date", StringComparison.OrdinalIgnoreCase)
            || name.Equals("realized", StringComparison.OrdinalIgnoreCase)
            || name.Equals(ImpliedSeries.Name, StringComparison.OrdinalIgnoreCase)
            || name.StartsWith("adaptive:", StringComparison.OrdinalIgnoreCase)
            || UserForecaster.IsUserSpec(name))
        {
            return true;
        }

        try
        {
            ForecasterSpec.Parse(name);
            return true;
        }
        catch (ArgumentException)
        {
            // Only a built-in spec parses; a name that does not is free.
        }

        // A built-in name with a parameter the parser refuses (garch:t, yang-zhang:x) still reads as that forecaster.
        var colon = name.IndexOf(':', StringComparison.Ordinal);
        var head = (colon < 0 ? name : name[..colon]).Trim().ToLowerInvariant();
        return head is "ewma" or "garch" or "gjr-garch" or "har" or "implied-debiased" or "close-to-close" or "parkinson" or "garman-klass" or "rogers-satchell" or "yang-zhang";
    }

    private static (ImpliedUnit Used, double Scale) Unit(string file, ImpliedUnit unit, List<double?[]> cells, List<InputWarning> warnings)
    {
        var all = cells.SelectMany(r => r).OfType<double>().Where(v => v > 0).ToArray();
        if (all.Length == 0)
        {
            return (unit == ImpliedUnit.Percent ? ImpliedUnit.Percent : ImpliedUnit.Decimal, unit == ImpliedUnit.Percent ? 0.01 : 1.0);
        }

        Array.Sort(all);
        var mid = all.Length / 2;
        var median = all.Length % 2 == 1 ? all[mid] : (all[mid - 1] / 2) + (all[mid] / 2);
        var threshold = ImpliedFileReader.PercentThreshold;
        if (unit == ImpliedUnit.Infer)
        {
            unit = median > threshold ? ImpliedUnit.Percent : ImpliedUnit.Decimal;
            warnings.Add(new InputWarning(file, null, string.Create(CultureInfo.InvariantCulture,
                $"the forecasts' unit was not declared; read as {(unit == ImpliedUnit.Percent ? "percent" : "decimal")} because the median value {ValueText.Number(median)} is {(unit == ImpliedUnit.Percent ? "above" : "not above")} {threshold}. Declare it with --forecasts-unit percent|decimal.")));
        }
        else if (unit == ImpliedUnit.Percent && median < threshold)
        {
            throw new InputDataException(file, null, null, string.Create(CultureInfo.InvariantCulture,
                $"the forecasts were declared percent, but their median value is {ValueText.Number(median)}, which would mean {ValueText.Number(median)}% a year; declare --forecasts-unit decimal, or check that this is the right file."));
        }
        else if (unit == ImpliedUnit.Decimal && median > threshold)
        {
            throw new InputDataException(file, null, null, string.Create(CultureInfo.InvariantCulture,
                $"the forecasts were declared decimal, but their median value is {ValueText.Number(median)}, which would mean {ValueText.Number(median * 100)}% a year; declare --forecasts-unit percent, or check that this is the right file."));
        }

        return (unit, unit == ImpliedUnit.Percent ? 0.01 : 1.0);
    }
}
