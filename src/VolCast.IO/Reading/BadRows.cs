using System.Globalization;
using System.Text;

namespace VolCast.IO.Reading;

/// <summary>Collects the rows of one file that fail a row check, so one refusal lists them all (up to <see cref="DataChecks.MaxListed"/>, with the count) or, with <see cref="DataChecks.SkipBadRows"/>, they are left out and listed.</summary>
internal sealed class BadRows
{
    private readonly List<(InputDataException Error, DateOnly? Date)> _rows = [];

    /// <summary>Gets how many bad rows were collected.</summary>
    public int Count => _rows.Count;

    /// <summary>Records a row that failed a check.</summary>
    public void Add(InputDataException error, DateOnly? date) => _rows.Add((error, date));

    /// <summary>Throws when there are bad rows and they may not be skipped; otherwise returns them as rejected rows.</summary>
    /// <param name="file">The file, as the user gave it.</param>
    /// <param name="skip">Whether bad rows are left out instead of refusing the file.</param>
    /// <returns>The rows left out, in file order (empty when there were none).</returns>
    /// <exception cref="InputDataException">There are bad rows and <paramref name="skip"/> is false.</exception>
    public IReadOnlyList<RejectedRow> Resolve(string file, bool skip)
    {
        if (_rows.Count == 0)
        {
            return [];
        }

        _rows.Sort((a, b) => (a.Error.Line ?? 0).CompareTo(b.Error.Line ?? 0));
        if (!skip)
        {
            if (_rows.Count == 1)
            {
                throw _rows[0].Error;
            }

            var c = CultureInfo.InvariantCulture;
            var text = new StringBuilder(string.Create(c, $"{_rows.Count} rows fail the row checks; fix them, or leave them out with --skip-bad-rows (they are then listed in rejected-rows.csv):"));
            for (var i = 0; i < Math.Min(_rows.Count, DataChecks.MaxListed); i++)
            {
                text.Append('\n').Append("  ").Append(_rows[i].Error.Message);
            }

            if (_rows.Count > DataChecks.MaxListed)
            {
                text.Append('\n').Append(string.Create(c, $"  ... and {_rows.Count - DataChecks.MaxListed} more ({_rows.Count} in all)."));
            }

            throw new InputDataException(file, _rows[0].Error.Line, null, text.ToString());
        }

        var rejected = new RejectedRow[_rows.Count];
        for (var i = 0; i < rejected.Length; i++)
        {
            var (error, date) = _rows[i];
            rejected[i] = new RejectedRow(file, error.Line ?? 0, date, RejectedRow.BadRow, (error.Column is null ? string.Empty : "column " + ValueText.Quote(error.Column) + ": ") + error.Problem);
        }

        return rejected;
    }
}
