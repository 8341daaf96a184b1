using VolCast.IO.Results;
using VolCast.IO.Tables;

namespace VolCast.IO.Csv;

/// <summary>Writes a batch's beats-implied.csv: the cross-name table of <see cref="VersusImpliedTable"/>, the numbers of the summary page's "Where each forecaster beats implied".</summary>
public static class BeatsImpliedCsv
{
    /// <summary>The file's name in the batch folder.</summary>
    public const string FileName = "beats-implied.csv";

    /// <summary>Writes the table.</summary>
    /// <param name="writer">Where to write.</param>
    /// <param name="rows">The batch's rows.</param>
    public static void Write(TextWriter writer, IEnumerable<BatchAssetRow> rows) =>
        VersusImpliedTable.Definition.WriteCsv(writer, VersusImpliedTable.Rows(rows));
}
