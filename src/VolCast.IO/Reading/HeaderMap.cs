using System.Globalization;
using System.Text;

namespace VolCast.IO.Reading;

/// <summary>
/// Where each known column sits in a file's header. Header names are matched case-insensitively after
/// trimming and dropping spaces, underscores, hyphens and dots, so "Adj Close", "adj_close" and "AdjClose"
/// all name the same column. Unknown columns are listed so the caller can warn that they were ignored.
/// </summary>
internal sealed class HeaderMap
{
    /// <summary>At most this many header names are listed in a message (each cut to 40 characters by <see cref="ValueText.Quote"/>).</summary>
    private const int MaxListed = 12;

    private readonly Dictionary<string, int> _index;

    private HeaderMap(int line, string[] names, Dictionary<string, int> index, IReadOnlyList<string> ignored)
    {
        Line = line;
        Names = names;
        _index = index;
        Ignored = ignored;
    }

    /// <summary>Gets the header's physical line.</summary>
    public int Line { get; }

    /// <summary>Gets the header names as written (trimmed), one per column.</summary>
    public IReadOnlyList<string> Names { get; }

    /// <summary>Gets the names of the columns that are not used, as written (blank names included).</summary>
    public IReadOnlyList<string> Ignored { get; }

    /// <summary>Describes the ignored columns for a warning, or returns null when there are none.</summary>
    /// <remarks>Unnamed columns (often left by trailing commas) are counted rather than listed.</remarks>
    public string? IgnoredDescription()
    {
        if (Ignored.Count == 0)
        {
            return null;
        }

        var allNamed = Ignored.Where(n => n.Length > 0).ToList();
        var named = allNamed.Take(MaxListed).Select(ValueText.Quote).ToList();
        if (allNamed.Count > MaxListed)
        {
            named.Add(string.Create(CultureInfo.InvariantCulture, $"and {allNamed.Count - MaxListed} more"));
        }

        var unnamed = Ignored.Count - allNamed.Count;
        if (unnamed > 0)
        {
            named.Add(string.Create(CultureInfo.InvariantCulture, $"{unnamed} unnamed column(s)"));
        }

        return "ignored column(s) not used by VolCast: " + string.Join(", ", named) + ".";
    }

    /// <summary>Gets the number of header columns.</summary>
    public int Count => Names.Count;

    /// <summary>Reads a header row.</summary>
    /// <param name="header">The first non-blank row.</param>
    /// <param name="file">The file, for messages.</param>
    /// <param name="aliases">Normalized spelling → canonical column name.</param>
    /// <param name="expected">The expected header, for messages (e.g. "date, open, high, low, close").</param>
    /// <exception cref="InputDataException">The header looks like another delimiter, like data, or repeats a column.</exception>
    public static HeaderMap Resolve(CsvRow header, string file, IReadOnlyDictionary<string, string> aliases, string expected) =>
        Resolve(header, file, aliases, expected, CsvFormat.Default);

    /// <summary>Reads a header row of a file in a declared form.</summary>
    /// <param name="header">The first non-blank row.</param>
    /// <param name="file">The file, for messages.</param>
    /// <param name="aliases">Normalized spelling → canonical column name.</param>
    /// <param name="expected">The expected header, for messages (e.g. "date, open, high, low, close").</param>
    /// <param name="format">The file's declared form (its delimiter and date format).</param>
    /// <exception cref="InputDataException">The header looks like another delimiter, like data, or repeats a column.</exception>
    public static HeaderMap Resolve(CsvRow header, string file, IReadOnlyDictionary<string, string> aliases, string expected, CsvFormat format)
    {
        ArgumentNullException.ThrowIfNull(format);
        var names = new string[header.Cells.Length];
        for (var i = 0; i < names.Length; i++)
        {
            names[i] = header.Cells[i].Trim().Trim('\uFEFF').Trim();
        }

        if (names.Length == 1)
        {
            CheckDelimiter(names[0], header.Line, file, expected, format.Delimiter);
        }

        if (names.Length > 0 && DateOnly.TryParseExact(names[0], format.DateFormatOrIso, CultureInfo.InvariantCulture, DateTimeStyles.None, out _))
        {
            throw new InputDataException(file, header.Line, null, "the first line " + ValueText.Quote(string.Join(format.Delimiter, names))
                + " looks like data, not a header; expected a header row first: " + expected + ".");
        }

        var index = new Dictionary<string, int>(StringComparer.Ordinal);
        var ignored = new List<string>();
        for (var i = 0; i < names.Length; i++)
        {
            if (!aliases.TryGetValue(Normalize(names[i]), out var canonical))
            {
                ignored.Add(names[i]);
                continue;
            }

            if (index.TryGetValue(canonical, out var first))
            {
                throw new InputDataException(file, header.Line, names[i], string.Create(CultureInfo.InvariantCulture,
                    $"column '{canonical}' appears twice in the header, as {ValueText.Quote(names[first])} (column {first + 1}) and {ValueText.Quote(names[i])} (column {i + 1}); expected each column once: {expected}."));
            }

            index.Add(canonical, i);
        }

        return new HeaderMap(header.Line, names, index, ignored);
    }

    /// <summary>Returns the position of a canonical column, or -1 when the header lacks it.</summary>
    public int IndexOf(string canonical) => _index.TryGetValue(canonical, out var i) ? i : -1;

    /// <summary>Returns whether the header has a canonical column.</summary>
    public bool Has(string canonical) => _index.ContainsKey(canonical);

    /// <summary>Returns the position of a column the file must have.</summary>
    /// <exception cref="InputDataException">The header lacks the column.</exception>
    public int Require(string canonical, string file, string expected)
    {
        if (_index.TryGetValue(canonical, out var i))
        {
            return i;
        }

        throw new InputDataException(file, Line, canonical, "the header has no '" + canonical + "' column; expected " + expected
            + "; found " + FoundList() + ".");
    }

    /// <summary>Lists the header as found, for messages.</summary>
    public string FoundList()
    {
        var sb = new StringBuilder();
        for (var i = 0; i < Math.Min(Names.Count, MaxListed); i++)
        {
            if (i > 0)
            {
                sb.Append(", ");
            }

            sb.Append(ValueText.Quote(Names[i]));
        }

        if (Names.Count > MaxListed)
        {
            sb.Append(CultureInfo.InvariantCulture, $" and {Names.Count - MaxListed} more column(s)");
        }

        return sb.ToString();
    }

    /// <summary>Lower-cases a header name and drops spaces, underscores, hyphens and dots.</summary>
    public static string Normalize(string name)
    {
        var sb = new StringBuilder(name.Length);
        foreach (var c in name)
        {
            if (c is not (' ' or '_' or '-' or '.') && !char.IsWhiteSpace(c))
            {
                sb.Append(char.ToLowerInvariant(c));
            }
        }

        return sb.ToString();
    }

    /// <summary>Refuses a one-cell header that holds another delimiter, naming the --delimiter that would read it.</summary>
    internal static void CheckDelimiter(string only, int line, string file, string expected, char declared)
    {
        (char Char, string Kind, string Option)[] others = [(';', "semicolon", "';'"), ('\t', "tab", "tab"), ('|', "pipe", "'|'"), (',', "comma", "','")];
        foreach (var (c, kind, option) in others)
        {
            if (c != declared && only.Contains(c, StringComparison.Ordinal))
            {
                var declaredText = declared == ',' ? "VolCast reads comma-separated files by default" : "the file was declared with --delimiter " + CsvFormat.Name(declared);
                throw new InputDataException(file, line, null, "the header " + ValueText.Quote(only) + " looks " + kind + "-delimited, but " + declaredText
                    + ": give --delimiter " + option + (c == ';' ? " (and --decimal ',' when numbers are written with a decimal comma)" : string.Empty)
                    + ", or re-export the file; expected the header " + expected + ".");
            }
        }
    }
}
