using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.IO.Csv;

namespace VolCast.IO.Results;

/// <summary>
/// Writes a backtest's results into a new output folder: forecasts.csv, metrics.csv, metrics.json, run.json and
/// summary.txt, and with the odds checks also calibration.csv and coverage.csv (their numbers repeated in metrics.json).
/// </summary>
/// <remarks>
/// The files are built in a temporary sibling folder (each through <see cref="AtomicFile"/>) and the folder is moved
/// into place, so a failure leaves no half-written report. An existing folder is refused unless <c>force</c> is set;
/// with it, only the files this writer produces are replaced and anything else in the folder is left alone.
/// </remarks>
public static class BacktestResultsWriter
{
    /// <summary>Gets the names of the files this writer produces.</summary>
    public static IReadOnlyList<string> FileNames { get; } =
        ["forecasts.csv", "metrics.csv", "metrics.json", "run.json", "summary.txt", CalibrationFileName, CoverageFileName];

    /// <summary>The probability-calibration table's file name (see <see cref="CalibrationCsv"/>).</summary>
    public const string CalibrationFileName = "calibration.csv";

    /// <summary>The range-coverage table's file name (see <see cref="CoverageCsv"/>).</summary>
    public const string CoverageFileName = "coverage.csv";

    /// <summary>Writes the results folder.</summary>
    /// <param name="folder">The output folder; must not exist unless <paramref name="force"/>.</param>
    /// <param name="result">The backtest result.</param>
    /// <param name="run">Version, inputs with their SHA-256, and times, for run.json.</param>
    /// <param name="force">Replace this writer's files in an existing folder.</param>
    /// <param name="writeMore">
    /// Writes further files of the same run (the HTML report and its charts) into the temporary folder it is given and
    /// returns their names, so they are moved into place with the rest, and with <paramref name="force"/> replaced like them; or null.
    /// </param>
    /// <param name="calibration">
    /// The probability-calibration and range-coverage checks of the same run (<see cref="BacktestCalibrator.Evaluate"/>),
    /// written to calibration.csv and coverage.csv, to metrics.json (sections <c>calibration</c> and <c>coverage</c>) and
    /// summarized in summary.txt; or null to leave them out (metrics.json then holds null for both sections).
    /// </param>
    /// <returns>The full paths of the files written.</returns>
    /// <exception cref="IOException">The folder exists and <paramref name="force"/> is false, or an input file would be overwritten.</exception>
    public static IReadOnlyList<string> Write(
        string folder,
        BacktestResult result,
        BacktestRunInfo run,
        bool force = false,
        Func<string, IReadOnlyList<string>>? writeMore = null,
        BacktestCalibration? calibration = null)
    {
        ArgumentNullException.ThrowIfNull(folder);
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(run);
        var target = Path.GetFullPath(folder).TrimEnd(Path.DirectorySeparatorChar);
        var exists = Directory.Exists(target);
        if (exists && !force)
        {
            throw new IOException($"{folder}: the output folder already exists; choose another --out or pass --force to replace its results files.");
        }

        if (File.Exists(target))
        {
            throw new IOException($"{folder}: a file of that name exists; --out must name a folder.");
        }

        foreach (var input in run.Inputs)
        {
            var full = Path.GetFullPath(input.Path);
            if (FileNames.Any(name => string.Equals(full, Path.Combine(target, name), StringComparison.Ordinal)))
            {
                throw new IOException($"{folder}: writing the results would overwrite the input file {input.Path}; choose another --out.");
            }
        }

        var parent = Path.GetDirectoryName(target)!;
        Directory.CreateDirectory(parent);
        var temp = Path.Combine(parent, $".{Path.GetFileName(target)}.{Environment.ProcessId}.{Guid.NewGuid():N}.tmp");
        Directory.CreateDirectory(temp);
        var names = new List<string>(FileNames);
        if (calibration is null)
        {
            names.Remove(CalibrationFileName);
            names.Remove(CoverageFileName);
        }

        try
        {
            AtomicFile.WriteText(Path.Combine(temp, "forecasts.csv"), w => ForecastsCsv.Write(w, result));
            AtomicFile.WriteText(Path.Combine(temp, "metrics.csv"), w => MetricsCsv.Write(w, result));
            AtomicFile.WriteText(Path.Combine(temp, "metrics.json"), w => MetricsJson.Write(w, result, calibration));
            AtomicFile.WriteText(Path.Combine(temp, "run.json"), w => RunJson.Write(w, result, run));
            AtomicFile.WriteText(Path.Combine(temp, "summary.txt"), w => SummaryText.Write(w, result, run, calibration));
            if (calibration is not null)
            {
                CalibrationCsv.WriteFile(Path.Combine(temp, CalibrationFileName), [.. calibration.Forecasters.Select(f => f.Calibration)]);
                CoverageCsv.WriteFile(Path.Combine(temp, CoverageFileName), calibration.Forecasters);
            }

            names.AddRange(writeMore?.Invoke(temp) ?? []);
            if (!Directory.Exists(target))
            {
                Directory.Move(temp, target);
            }
            else
            {
                foreach (var name in names)
                {
                    File.Move(Path.Combine(temp, name), Path.Combine(target, name), overwrite: true);
                }
            }
        }
        finally
        {
            if (Directory.Exists(temp))
            {
                Directory.Delete(temp, recursive: true);
            }
        }

        return [.. names.Select(name => Path.Combine(target, name))];
    }
}
