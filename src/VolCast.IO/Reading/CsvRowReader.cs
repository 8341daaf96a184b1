using System.Globalization;
using CsvHelper;
using CsvHelper.Configuration;

namespace VolCast.IO.Reading;

/// <summary>
/// Reads the records of comma-separated text with CsvHelper, skipping blank lines (and lines whose cells are
/// all blank), and reports each with its physical line number.
/// </summary>
/// <remarks>
/// A line break inside a quoted cell is refused as malformed quoting, so every record is exactly one physical
/// line and the parser's row counter is the line number. Malformed quoting, and anything else the parser
/// rejects, becomes an <see cref="InputDataException"/> naming the line.
/// </remarks>
internal sealed class CsvRowReader : IDisposable
{
    private readonly string _file;
    private readonly char _delimiter;
    private readonly StringReader _text;
    private readonly CsvParser _parser;
    private string[]? _header;
    private (int Line, string Field, string RawRecord)? _badData;

    /// <summary>Starts reading a comma-separated text.</summary>
    public CsvRowReader(string text, string file)
        : this(text, file, ',')
    {
    }

    /// <summary>Starts reading a text whose cells are separated by <paramref name="delimiter"/>.</summary>
    public CsvRowReader(string text, string file, char delimiter)
    {
        _file = file;
        _delimiter = delimiter;
        _text = new StringReader(text);
        var config = new CsvConfiguration(CultureInfo.InvariantCulture)
        {
            Delimiter = delimiter.ToString(),
            Mode = CsvMode.RFC4180,
            IgnoreBlankLines = true,
            LineBreakInQuotedFieldIsBadData = true,
            DetectDelimiter = false,
            BadDataFound = args => _badData ??= (args.Context.Parser?.Row ?? 0, args.Field ?? string.Empty, args.RawRecord ?? string.Empty),
        };
        _parser = new CsvParser(_text, config, leaveOpen: false);
    }

    /// <summary>Header cells used to name the column of malformed quoting, once the header has been read.</summary>
    public void UseHeader(string[] header) => _header = header;

    /// <summary>Reads the next non-blank record.</summary>
    /// <exception cref="InputDataException">The text is malformed at this record.</exception>
    public bool TryRead(out CsvRow row)
    {
        while (true)
        {
            string[]? cells;
            try
            {
                // The parser splits fields lazily: malformed quoting is only reported once the record is read.
                cells = _parser.Read() ? _parser.Record ?? [] : null;
            }
            catch (CsvHelperException e)
            {
                throw new InputDataException(_file, _parser.Row, null,
                    "the line could not be read as values separated by " + CsvFormat.Name(_delimiter) + " (" + FirstLine(e.Message) + "); expected plain cells separated by " + CsvFormat.Name(_delimiter) + ".");
            }

            if (_badData is { } bad)
            {
                var column = ColumnOf(bad.Field, bad.RawRecord);
                throw new InputDataException(_file, bad.Line, column, "malformed quoting in cell " + ValueText.Quote(bad.Field)
                    + ": a double quote inside an unquoted cell, text after a closing quote, or a quote left open at the end of the line; expected plain cells, or cells wrapped whole in double quotes.");
            }

            if (cells is null)
            {
                row = default;
                return false;
            }

            if (AllBlank(cells))
            {
                continue;
            }

            row = new CsvRow(_parser.Row, cells);
            return true;
        }
    }

    /// <inheritdoc/>
    public void Dispose()
    {
        _parser.Dispose();
        _text.Dispose();
    }

    private static bool AllBlank(string[] cells)
    {
        foreach (var cell in cells)
        {
            if (!string.IsNullOrWhiteSpace(cell))
            {
                return false;
            }
        }

        return true;
    }

    private static string FirstLine(string message)
    {
        var end = message.IndexOfAny(['\r', '\n']);
        return end < 0 ? message : message[..end];
    }

    /// <summary>Names the header column of a malformed cell by counting the delimiters before it, outside quotes.</summary>
    private string? ColumnOf(string field, string rawRecord)
    {
        if (_header is null || field.Length == 0)
        {
            return null;
        }

        var start = rawRecord.LastIndexOf(field, StringComparison.Ordinal);
        if (start < 0)
        {
            return null;
        }

        var index = 0;
        var quoted = false;
        for (var i = 0; i < start; i++)
        {
            if (rawRecord[i] == '"')
            {
                quoted = !quoted;
            }
            else if (rawRecord[i] == _delimiter && !quoted)
            {
                index++;
            }
        }

        return index < _header.Length ? _header[index].Trim() : null;
    }
}
