using System.Globalization;
using System.Text;
using VolCast.Core.Options;

namespace VolCast.IO.Csv;

/// <summary>Writes every rejected or flagged quote, expiry and date as CSV, one row each.</summary>
/// <remarks>Columns: <c>scope</c> (quote, expiry, date), <c>reason</c> (kebab-case, e.g. below-intrinsic),
/// <c>severity</c> (rejected or warning), <c>date</c>, <c>expiry</c>, <c>strike</c>, <c>type</c>, <c>line</c>
/// (the 1-based line of the quotes file) and <c>detail</c> (a sentence with the numbers). Empty cells mean
/// "does not apply". Written through <see cref="AtomicFile"/>.</remarks>
public static class QuoteDiagnosticsCsv
{
    private static readonly string[] Header = ["scope", "reason", "severity", "date", "expiry", "strike", "type", "line", "detail"];

    /// <summary>Writes the diagnostics (a header only when there are none).</summary>
    /// <param name="path">The output file.</param>
    /// <param name="diagnostics">The diagnostics.</param>
    /// <param name="overwrite">Whether an existing file may be replaced.</param>
    /// <param name="protectedInputs">Input files that must never be written over.</param>
    /// <exception cref="IOException">The file exists and <paramref name="overwrite"/> is false, or it is an input.</exception>
    public static void Write(string path, IReadOnlyList<ChainDiagnostic> diagnostics, bool overwrite, IEnumerable<string>? protectedInputs = null)
    {
        ArgumentNullException.ThrowIfNull(diagnostics);
        AtomicFile.WriteText(path, writer => Write(writer, diagnostics), overwrite, protectedInputs);
    }

    /// <summary>Writes the diagnostics (a header only when there are none) to <paramref name="writer"/>.</summary>
    /// <param name="writer">Where the CSV goes.</param>
    /// <param name="diagnostics">The diagnostics.</param>
    public static void Write(TextWriter writer, IReadOnlyList<ChainDiagnostic> diagnostics)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(diagnostics);
        CsvText.WriteHeader(writer, Header);
        foreach (var d in diagnostics)
        {
            CsvText.WriteRecord(writer,
            [
                CsvText.Text(Kebab(d.Scope.ToString())),
                CsvText.Text(Kebab(d.Reason.ToString())),
                d.IsWarning ? "warning" : "rejected",
                CsvText.Date(d.Date),
                d.Expiry is { } expiry ? CsvText.Date(expiry) : string.Empty,
                CsvText.Number(d.Strike),
                d.Type is { } t ? CsvText.Text(Kebab(t.ToString())) : string.Empty,
                CsvText.Integer(d.SourceLine),
                CsvText.Text(d.Detail),
            ]);
        }
    }

    /// <summary>BelowIntrinsic → below-intrinsic.</summary>
    internal static string Kebab(string name)
    {
        var sb = new StringBuilder(name.Length + 4);
        for (var i = 0; i < name.Length; i++)
        {
            if (char.IsUpper(name[i]) && i > 0)
            {
                sb.Append('-');
            }

            sb.Append(char.ToLowerInvariant(name[i]));
        }

        return sb.ToString();
    }
}
