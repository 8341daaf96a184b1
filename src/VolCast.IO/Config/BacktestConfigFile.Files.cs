using System.Text.Json;

namespace VolCast.IO.Config;

/// <content>The user's own forecasts file: <c>forecastsFile</c> and <c>forecastsUnit</c>.</content>
public static partial class BacktestConfigFile
{
    /// <summary>
    /// Reads the keys of a configuration that name the user's forecasts file: <c>forecastsFile</c> (a path, relative to
    /// the working folder as on the command line) and <c>forecastsUnit</c> (<c>percent</c> or <c>decimal</c>; inferred when left out).
    /// </summary>
    /// <param name="path">The configuration file.</param>
    /// <returns>The file, or null when not given, and its unit.</returns>
    /// <exception cref="InputDataException">The file cannot be read, is not a valid configuration, or forecastsUnit is not one of the two words.</exception>
    public static (string? File, ImpliedUnit Unit) ReadForecasts(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        var bytes = InputFiles.ReadCapped(path, "a JSON configuration file", InputFiles.MaxConfigBytes);
        return ParseForecasts(Reading.InputText.Decode(bytes, path), path);
    }

    /// <summary>Parses the forecasts-file keys of configuration text (see <see cref="ReadForecasts"/>).</summary>
    /// <param name="json">The JSON text.</param>
    /// <param name="file">The file name to put in error messages.</param>
    /// <returns>The forecasts file, or null, and its unit.</returns>
    /// <exception cref="InputDataException">The text is not a valid configuration, or a value is not accepted.</exception>
    public static (string? File, ImpliedUnit Unit) ParseForecasts(string json, string file)
    {
        ArgumentNullException.ThrowIfNull(json);
        ArgumentNullException.ThrowIfNull(file);
        Parse(json, file);
        var doc = JsonSerializer.Deserialize<BacktestConfigDocument>(json, Options)!;
        var unit = doc.ForecastsUnit switch
        {
            null => ImpliedUnit.Infer,
            "percent" => ImpliedUnit.Percent,
            "decimal" => ImpliedUnit.Decimal,
            _ => throw Bad(file, "forecastsUnit", $"must be \"percent\" or \"decimal\" (was \"{Cut(doc.ForecastsUnit)}\")"),
        };
        if (doc.ForecastsFile is string f && string.IsNullOrWhiteSpace(f))
        {
            throw Bad(file, "forecastsFile", $"must be the path of a CSV file of forecasts (date, NAME1, NAME2, …), not empty");
        }

        return (doc.ForecastsFile, unit);
    }
}
