using System.Globalization;
using System.Text;
using CsvHelper;
using CsvHelper.Configuration;
using VolCast.Core.Options;

namespace VolCast.IO.Quotes;

/// <summary>Writes every rejected or flagged quote, expiry and date as CSV, one row each.</summary>
/// <remarks>Columns: <c>scope</c> (quote, expiry, date), <c>reason</c> (kebab-case, e.g. below-intrinsic),
/// <c>severity</c> (rejected or warning), <c>date</c>, <c>expiry</c>, <c>strike</c>, <c>type</c>, <c>line</c>
/// (the 1-based line of the quotes file) and <c>detail</c> (a sentence with the numbers). Empty cells mean
/// "does not apply". Written through <see cref="AtomicFile"/>.</remarks>
public static class QuoteDiagnosticsCsvWriter
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
        AtomicFile.WriteText(path, writer =>
        {
            using var csv = new CsvWriter(writer, new CsvConfiguration(CultureInfo.InvariantCulture) { NewLine = "\n" }, leaveOpen: true);
            foreach (var name in Header)
            {
                csv.WriteField(name);
            }

            csv.NextRecord();
            foreach (var d in diagnostics)
            {
                csv.WriteField(Kebab(d.Scope.ToString()));
                csv.WriteField(Kebab(d.Reason.ToString()));
                csv.WriteField(d.IsWarning ? "warning" : "rejected");
                csv.WriteField(d.Date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
                csv.WriteField(d.Expiry?.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture) ?? string.Empty);
                csv.WriteField(d.Strike?.ToString("R", CultureInfo.InvariantCulture) ?? string.Empty);
                csv.WriteField(d.Type is { } t ? Kebab(t.ToString()) : string.Empty);
                csv.WriteField(d.SourceLine?.ToString(CultureInfo.InvariantCulture) ?? string.Empty);
                csv.WriteField(d.Detail);
                csv.NextRecord();
            }
        }, overwrite, protectedInputs);
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
