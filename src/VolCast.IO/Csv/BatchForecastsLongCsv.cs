namespace VolCast.IO.Csv;

/// <summary>
/// Writes a batch's forecasts-long.csv: every finished name's forecasts-long.csv with the name in front,
/// <c>asset, date, forecaster, forecast, realized, implied</c>, names in the order given, so one read and a group-by
/// give every name's series.
/// </summary>
public static class BatchForecastsLongCsv
{
    /// <summary>The file's name, in the batch folder and in each name's folder.</summary>
    public const string FileName = ForecastsLongCsv.FileName;

    /// <summary>Writes the table, reading each name's file line by line.</summary>
    /// <param name="writer">Where to write.</param>
    /// <param name="names">Each finished name with its results folder; a folder without the file contributes no row.</param>
    public static void Write(TextWriter writer, IEnumerable<(string Name, string Folder)> names)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(names);
        writer.Write("asset," + ForecastsLongCsv.Header + "\n");
        foreach (var (name, folder) in names)
        {
            var path = Path.Combine(folder, FileName);
            if (!File.Exists(path))
            {
                continue;
            }

            var asset = CsvText.Text(name) + ",";
            using var reader = new StreamReader(path);
            reader.ReadLine();
            while (reader.ReadLine() is { } line)
            {
                writer.Write(asset);
                writer.Write(line);
                writer.Write('\n');
            }
        }
    }
}
