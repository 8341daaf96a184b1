using System.Text.Json;

namespace VolCast.IO.Config;

/// <content>
/// The keys of a configuration that name other files: <c>forecastsFile</c> (with <c>forecastsUnit</c>) and
/// <c>eventsFile</c>. A relative path in a configuration is relative to the configuration file's own folder, so a
/// configuration and the files it names can be moved together and run from anywhere; an absolute path is used as
/// written. (Paths on the command line stay relative to the working folder.)
/// </content>
public static partial class BacktestConfigFile
{
    /// <summary>
    /// Reads the keys of a configuration that name the user's forecasts file: <c>forecastsFile</c> (a path, relative to
    /// the configuration file's folder) and <c>forecastsUnit</c> (<c>percent</c> or <c>decimal</c>; inferred when left out).
    /// </summary>
    /// <param name="path">The configuration file.</param>
    /// <returns>The file (resolved against the configuration's folder), or null when not given, and its unit.</returns>
    /// <exception cref="InputDataException">The file cannot be read, is not a valid configuration, or forecastsUnit is not one of the two words.</exception>
    public static (string? File, ImpliedUnit Unit) ReadForecasts(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        var bytes = InputFiles.ReadCapped(path, "a JSON configuration file", InputFiles.MaxConfigBytes);
        return ParseForecasts(Reading.InputText.Decode(bytes, path), path);
    }

    /// <summary>Parses the forecasts-file keys of configuration text (see <see cref="ReadForecasts"/>).</summary>
    /// <param name="json">The JSON text.</param>
    /// <param name="file">The configuration file's path: relative paths in it are resolved against its folder, and errors name it.</param>
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
        return (FilePath(doc.ForecastsFile, file, "forecastsFile", "a CSV file of forecasts (date, NAME1, NAME2, …)"), unit);
    }

    /// <summary>Reads the configuration's <c>eventsFile</c>: the events CSV, relative to the configuration file's folder.</summary>
    /// <param name="path">The configuration file.</param>
    /// <returns>The events file (resolved against the configuration's folder), or null when not given.</returns>
    /// <exception cref="InputDataException">The file cannot be read, is not a valid configuration, or eventsFile is empty.</exception>
    public static string? ReadEventsFile(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        var bytes = InputFiles.ReadCapped(path, "a JSON configuration file", InputFiles.MaxConfigBytes);
        return ParseEventsFile(Reading.InputText.Decode(bytes, path), path);
    }

    /// <summary>Parses the <c>eventsFile</c> key of configuration text (see <see cref="ReadEventsFile"/>).</summary>
    /// <param name="json">The JSON text.</param>
    /// <param name="file">The configuration file's path: a relative events path is resolved against its folder, and errors name it.</param>
    /// <returns>The events file, or null.</returns>
    /// <exception cref="InputDataException">The text is not a valid configuration, or eventsFile is empty.</exception>
    public static string? ParseEventsFile(string json, string file)
    {
        ArgumentNullException.ThrowIfNull(json);
        ArgumentNullException.ThrowIfNull(file);
        Parse(json, file);
        var doc = JsonSerializer.Deserialize<BacktestConfigDocument>(json, Options)!;
        return FilePath(doc.EventsFile, file, "eventsFile", "an events CSV file (date[, kind][, scheduled])");
    }

    /// <summary>
    /// A path written in a configuration file, resolved against that file's folder: relative paths are joined to the
    /// folder (as the configuration's own path gives it, so a configuration named relative to the working folder yields
    /// a path relative to the working folder), absolute paths are returned as written.
    /// </summary>
    /// <param name="configFile">The configuration file's path.</param>
    /// <param name="value">The path as written in it.</param>
    /// <returns>The path to open.</returns>
    internal static string ResolvePath(string configFile, string value)
    {
        ArgumentNullException.ThrowIfNull(configFile);
        ArgumentNullException.ThrowIfNull(value);
        return Path.IsPathRooted(value) ? value : Path.Combine(Path.GetDirectoryName(configFile) ?? string.Empty, value);
    }

    private static string? FilePath(string? value, string file, string property, string what)
    {
        if (value is null)
        {
            return null;
        }

        if (string.IsNullOrWhiteSpace(value))
        {
            throw Bad(file, property, $"must be the path of {what}, not empty");
        }

        return ResolvePath(file, value);
    }
}
