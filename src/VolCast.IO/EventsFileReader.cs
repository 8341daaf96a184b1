using System.Collections.Immutable;
using System.Globalization;
using VolCast.Core.Backtest;

namespace VolCast.IO;

/// <summary>
/// Reads an events file: a CSV with a header, a <c>date</c> column (yyyy-MM-dd) and optional <c>kind</c> (free text,
/// such as earnings or central-bank) and <c>scheduled</c> (true/false or yes/no: was the date known in advance?)
/// columns. A row without <c>scheduled</c> counts as added after the fact, the cautious reading. Blank lines are skipped.
/// </summary>
public static class EventsFileReader
{
    /// <summary>Reads and checks the file.</summary>
    /// <param name="input">The file's bytes as read.</param>
    /// <returns>The events in file order.</returns>
    /// <exception cref="InputDataException">The file has no date column, a date or scheduled cell cannot be read, or no event.</exception>
    public static ImmutableArray<MarketEvent> Read(InputBytes input)
    {
        ArgumentNullException.ThrowIfNull(input);
        var file = input.Path;
        using var reader = new StringReader(input.Text());
        var header = reader.ReadLine() ?? throw new InputDataException(file, null, null, "the file is empty; expected a header such as \"date,kind,scheduled\" and one event per line.");
        var names = Split(header.TrimStart('\uFEFF')).Select(n => n.Trim().ToLowerInvariant()).ToList();
        var dateAt = names.IndexOf("date");
        var kindAt = names.IndexOf("kind");
        var scheduledAt = names.IndexOf("scheduled");
        if (dateAt < 0)
        {
            throw new InputDataException(file, 1, null, $"the header has no \"date\" column (found: {string.Join(", ", names)}); expected date[,kind][,scheduled].");
        }

        var events = ImmutableArray.CreateBuilder<MarketEvent>();
        var lineNumber = 1;
        while (reader.ReadLine() is { } line)
        {
            lineNumber++;
            if (line.Trim().Length == 0)
            {
                continue;
            }

            var cells = Split(line);
            var dateText = Cell(cells, dateAt);
            if (!DateOnly.TryParseExact(dateText, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var date))
            {
                throw new InputDataException(file, lineNumber, "date", $"\"{Cut(dateText)}\" is not a date; expected yyyy-MM-dd, such as 2024-03-20.");
            }

            var kind = kindAt >= 0 && Cell(cells, kindAt) is { Length: > 0 } k ? k : null;
            var scheduled = false;
            if (scheduledAt >= 0 && Cell(cells, scheduledAt) is { Length: > 0 } s)
            {
                scheduled = s.ToLowerInvariant() switch
                {
                    "true" or "yes" => true,
                    "false" or "no" => false,
                    _ => throw new InputDataException(file, lineNumber, "scheduled", $"\"{Cut(s)}\" is not true, false, yes or no; say whether the date was known in advance."),
                };
            }

            events.Add(new MarketEvent(date, kind, scheduled));
        }

        if (events.Count == 0)
        {
            throw new InputDataException(file, null, null, "the file lists no event; add one date per line under the header, or leave out --events.");
        }

        return events.ToImmutable();
    }

    // Events files are short and hand-written: one comma-separated line per event, with optional double quotes around a cell.
    private static List<string> Split(string line) => [.. line.Split(',').Select(c => c.Trim().Trim('"').Trim())];

    private static string Cell(List<string> cells, int at) => at < cells.Count ? cells[at] : string.Empty;

    private static string Cut(string text) => text.Length <= 40 ? text : text[..40] + "…";
}
