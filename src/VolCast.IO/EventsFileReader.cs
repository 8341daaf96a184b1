using System.Collections.Immutable;
using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.IO.Reading;

namespace VolCast.IO;

/// <summary>
/// Reads an events file: a CSV with a header, a <c>date</c> column and optional <c>kind</c> (free text, such as
/// earnings or central-bank) and <c>scheduled</c> (true/false or yes/no: was the date known in advance?) columns, in
/// any order and any case. A row without <c>scheduled</c> counts as added after the fact, the cautious reading.
/// </summary>
/// <remarks>
/// Read with CsvHelper like every other input file (<see cref="CsvRowReader"/>): cells may be wrapped in double quotes
/// (a kind may then hold the delimiter), blank lines are skipped, there are no comment lines, and dates are written as
/// the run's <see cref="CsvFormat"/> says (yyyy-MM-dd by default). The same date twice with the same kind and
/// <c>scheduled</c> is one event; with a different kind or <c>scheduled</c> it is refused, since the two rows cannot
/// both be right. With the price dates, an event before the first or after the last price date is refused: no
/// forecast window can hold it, so it is almost surely a mistyped year or the events of another instrument.
/// </remarks>
public static class EventsFileReader
{
    private const string Expected = "a header such as \"date,kind,scheduled\" and one event per line";

    /// <summary>Reads and checks the file (ISO dates, commas, no check against prices).</summary>
    /// <param name="input">The file's bytes as read.</param>
    /// <returns>The events in file order.</returns>
    /// <exception cref="InputDataException">The file has no date column, a cell cannot be read, a date repeats with another kind, or there is no event.</exception>
    public static ImmutableArray<MarketEvent> Read(InputBytes input) => Read(input, CsvFormat.Default, []);

    /// <summary>Reads and checks the file in the run's CSV form, and checks every date against the price dates.</summary>
    /// <param name="input">The file's bytes as read.</param>
    /// <param name="format">The input files' form (delimiter and date format; the decimal mark is not used).</param>
    /// <param name="priceDates">The price history's dates, increasing; empty skips the check.</param>
    /// <returns>The events in file order, each date once.</returns>
    /// <exception cref="InputDataException">As for <see cref="Read(InputBytes)"/>, or a date lies before the first or after the last price date; the message names the line and column.</exception>
    public static ImmutableArray<MarketEvent> Read(InputBytes input, CsvFormat format, ReadOnlySpan<DateOnly> priceDates)
    {
        ArgumentNullException.ThrowIfNull(input);
        ArgumentNullException.ThrowIfNull(format);
        var file = input.Path;
        var text = input.Text();
        using var reader = new CsvRowReader(text.StartsWith('\uFEFF') ? text[1..] : text, file, format.Delimiter);
        if (!reader.TryRead(out var headerRow))
        {
            throw new InputDataException(file, null, null, "the file is empty; expected " + Expected + ".");
        }

        var names = headerRow.Cells.Select(n => n.Trim()).ToArray();
        reader.UseHeader(names);
        var lower = names.Select(n => n.ToLowerInvariant()).ToList();
        var dateAt = lower.IndexOf("date");
        var kindAt = lower.IndexOf("kind");
        var scheduledAt = lower.IndexOf("scheduled");
        if (dateAt < 0)
        {
            throw new InputDataException(file, headerRow.Line, null, $"the header has no \"date\" column (found: {string.Join(", ", names.Select(n => ValueText.Quote(n)))}); expected date[,kind][,scheduled].");
        }

        var events = ImmutableArray.CreateBuilder<MarketEvent>();
        var seen = new Dictionary<DateOnly, (MarketEvent Event, int Line)>();
        while (reader.TryRead(out var row))
        {
            var dateText = Cell(row.Cells, dateAt);
            if (dateText.TrimStart().StartsWith('#'))
            {
                throw new InputDataException(file, row.Line, names[dateAt], ValueText.Quote(dateText) + " is not a date; input files have no comment lines, so remove the line or the #.");
            }

            var date = CellParser.Date(dateText, file, row.Line, names[dateAt], format);
            var kind = kindAt >= 0 && Cell(row.Cells, kindAt).Trim() is { Length: > 0 } k ? k : null;
            var scheduled = false;
            if (scheduledAt >= 0 && Cell(row.Cells, scheduledAt).Trim() is { Length: > 0 } s)
            {
                scheduled = s.ToLowerInvariant() switch
                {
                    "true" or "yes" => true,
                    "false" or "no" => false,
                    _ => throw new InputDataException(file, row.Line, names[scheduledAt], $"{ValueText.Quote(s)} is not true, false, yes or no; say whether the date was known in advance."),
                };
            }

            var ev = new MarketEvent(date, kind, scheduled);
            if (seen.TryGetValue(date, out var first))
            {
                if (first.Event != ev)
                {
                    var column = kindAt >= 0 && !string.Equals(first.Event.Kind, kind, StringComparison.Ordinal) ? names[kindAt] : scheduledAt >= 0 ? names[scheduledAt] : names[dateAt];
                    throw new InputDataException(file, row.Line, column, string.Create(CultureInfo.InvariantCulture,
                        $"the date {ValueText.Date(date)} is also on line {first.Line} as {Describe(first.Event)}, here as {Describe(ev)}; expected one event per date (keep one row, or give both the same kind)."));
                }

                continue;
            }

            seen.Add(date, (ev, row.Line));
            events.Add(ev);
        }

        if (events.Count == 0)
        {
            throw new InputDataException(file, null, null, "the file lists no event; add one date per line under the header, or leave out --events.");
        }

        // Against the prices only once the whole file has been read: a fault of the file itself is reported first.
        if (priceDates.Length > 0)
        {
            foreach (var (date, (_, line)) in seen.OrderBy(e => e.Value.Line))
            {
                if (date < priceDates[0] || date > priceDates[^1])
                {
                    throw new InputDataException(file, line, names[dateAt], string.Create(CultureInfo.InvariantCulture,
                        $"the event date {ValueText.Date(date)} is {(date < priceDates[0] ? "before" : "after")} the prices ({ValueText.Date(priceDates[0])} to {ValueText.Date(priceDates[^1])}), so no forecast window can hold it; check the year, or give the events of this instrument only."));
                }
            }
        }

        return events.ToImmutable();
    }

    private static string Cell(string[] cells, int at) => at < cells.Length ? cells[at] : string.Empty;

    private static string Describe(MarketEvent e) =>
        (e.Kind is null ? "no kind" : ValueText.Quote(e.Kind)) + (e.Scheduled ? ", scheduled" : ", not scheduled");
}
