using System.Collections.Concurrent;
using System.Collections.Immutable;
using System.Runtime.ExceptionServices;
using System.Text.Json;
using VolCast.Core.Backtest;
using VolCast.IO.Csv;

namespace VolCast.IO.Results;

/// <summary>
/// Writes a backtest's data files into a folder it is given: forecasts.csv and its long form forecasts-long.csv, metrics.csv, metrics.json, summary.txt,
/// calibration.csv, coverage.csv, and trades.csv, rule-pnl.csv and rule-pnl-next-day.csv when the rule's trades were run (<see cref="WriteData(string, BacktestRun, int, CancellationToken)"/>), and last run.json with the manifest of every file of the
/// run (<see cref="WriteRunRecord"/>).
/// </summary>
/// <remarks>
/// The folder is a staging folder owned by the caller, which moves it into place once every file of the run is in it;
/// this writer neither creates, replaces nor removes an output folder.
/// </remarks>
public static class BacktestResultsWriter
{
    /// <summary>The run record's file name; it holds the manifest of the run's files.</summary>
    public const string RunFileName = "run.json";

    /// <summary>The probability-calibration table's file name (see <see cref="CalibrationCsv"/>).</summary>
    public const string CalibrationFileName = "calibration.csv";

    /// <summary>The range-coverage table's file name (see <see cref="CoverageCsv"/>).</summary>
    public const string CoverageFileName = "coverage.csv";

    /// <summary>The file of rows left out of the run (<see cref="RejectedRowsCsv"/>), written only when there are any.</summary>
    public const string RejectedRowsFileName = "rejected-rows.csv";

    /// <summary>The name of the rule's trades file (written only when the rule's trades were run).</summary>
    public const string TradesFileName = "trades.csv";

    /// <summary>The name of the rule's daily P&amp;L paths file (written only when the rule's trades were run).</summary>
    public const string RulePnlFileName = "rule-pnl.csv";

    /// <summary>The name of the rule's daily net P&amp;L paths with entry one trading day later (written only when the rule's trades were run).</summary>
    public const string RulePnlNextDayFileName = "rule-pnl-next-day.csv";

    /// <summary>Gets the names of the data files this writer can produce, run.json included (trades.csv and the two rule-pnl files only with the rule's trades).</summary>
    public static IReadOnlyList<string> FileNames { get; } =
        ["forecasts.csv", ForecastsLongCsv.FileName, "metrics.csv", "metrics.json", RunFileName, "summary.txt", CalibrationFileName, CoverageFileName, TradesFileName, RulePnlFileName, RulePnlNextDayFileName, NowJson.FileName, GroupsCsv.FileName];

    /// <summary>Writes every data file except run.json into <paramref name="folder"/>, checking for cancellation between files.</summary>
    /// <param name="folder">An existing folder (the caller's staging folder); no file of these names may exist in it.</param>
    /// <param name="run">The run.</param>
    /// <param name="cancellationToken">Stops between files.</param>
    /// <returns>The file names written (without the folder).</returns>
    /// <exception cref="IOException">A file of the same name exists in the folder.</exception>
    /// <exception cref="OperationCanceledException">The token was cancelled.</exception>
    public static IReadOnlyList<string> WriteData(string folder, BacktestRun run, CancellationToken cancellationToken = default) =>
        WriteData(folder, run, 1, cancellationToken);

    /// <summary>
    /// Writes every data file except run.json into <paramref name="folder"/>, up to <paramref name="threads"/> files at a
    /// time (each file is independent of the others; the bytes are the same however many are written at once).
    /// </summary>
    /// <param name="folder">An existing folder (the caller's staging folder); no file of these names may exist in it.</param>
    /// <param name="run">The run.</param>
    /// <param name="threads">How many files are written at the same time, at least 1.</param>
    /// <param name="cancellationToken">Stops between files.</param>
    /// <returns>The file names written (without the folder), in the same order whatever <paramref name="threads"/> is.</returns>
    /// <exception cref="IOException">A file of the same name exists in the folder.</exception>
    /// <exception cref="OperationCanceledException">The token was cancelled.</exception>
    public static IReadOnlyList<string> WriteData(string folder, BacktestRun run, int threads, CancellationToken cancellationToken = default) =>
        WriteData(folder, run, threads, [], cancellationToken);

    /// <summary>
    /// Writes every data file except run.json and the ones already written by <see cref="WriteForecastsLong"/> into
    /// <paramref name="folder"/>, up to <paramref name="threads"/> files at a time.
    /// </summary>
    /// <param name="folder">An existing folder (the caller's staging folder); no file of these names may exist in it, except <paramref name="alreadyWritten"/>.</param>
    /// <param name="run">The run.</param>
    /// <param name="threads">How many files are written at the same time, at least 1.</param>
    /// <param name="alreadyWritten">Names of this run's files the caller has already written to the folder: they are not written again, and are returned with the rest.</param>
    /// <param name="cancellationToken">Stops between files.</param>
    /// <returns>The file names of the run's data (without the folder), in the same order whatever <paramref name="threads"/> is.</returns>
    /// <exception cref="IOException">A file of the same name exists in the folder.</exception>
    /// <exception cref="OperationCanceledException">The token was cancelled.</exception>
    public static IReadOnlyList<string> WriteData(string folder, BacktestRun run, int threads, IReadOnlyCollection<string> alreadyWritten, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(alreadyWritten);
        ArgumentOutOfRangeException.ThrowIfLessThan(threads, 1);
        ArgumentNullException.ThrowIfNull(folder);
        ArgumentNullException.ThrowIfNull(run);
        var result = run.Result;
        var calibration = run.Calibration;
        var steps = new (string Name, Action<string> Write)[]
        {
            ("forecasts.csv", path => AtomicFile.WriteText(path, w => ForecastsCsv.Write(w, result))),
            (ForecastsLongCsv.FileName, path => AtomicFile.WriteText(path, w => ForecastsLongCsv.Write(w, result))),
            ("metrics.csv", path => AtomicFile.WriteText(path, w => MetricsCsv.Write(w, result))),
            ("metrics.json", path => AtomicFile.WriteText(path, w => MetricsJson.Write(w, result, calibration, run.RulePnl, run.RulePnlAbsence))),
            ("summary.txt", path => AtomicFile.WriteText(path, w => SummaryText.Write(w, result, run.Info, calibration, run.RulePnl, run.RulePnlAbsence))),
            (CalibrationFileName, path => CalibrationCsv.WriteFile(path, [.. calibration.Forecasters.Select(f => f.Calibration)])),
            (CoverageFileName, path => CoverageCsv.WriteFile(path, calibration.Forecasters)),
            (NowJson.FileName, path => AtomicFile.WriteText(path, w => NowJson.Write(w, Core.Now.NowReading.From(result, run.Prices, run.RulePnl)))),
        }.ToList();
        if (run.RulePnl is { } rulePnl)
        {
            steps.Add((TradesFileName, path => AtomicFile.WriteText(path, w => TradesCsv.Write(w, rulePnl))));
            steps.Add((RulePnlFileName, path => AtomicFile.WriteText(path, w => RulePnlCsv.Write(w, rulePnl))));
            steps.Add((RulePnlNextDayFileName, path => AtomicFile.WriteText(path, w => RulePnlCsv.WriteNextDay(w, rulePnl))));
        }

        if (!run.Groups.Rows.IsEmpty)
        {
            steps.Add((GroupsCsv.FileName, path => AtomicFile.WriteText(path, w => GroupsCsv.Write(w, run.Groups))));
        }

        var written = steps.Select(step => step.Name).ToList();
        steps.RemoveAll(step => alreadyWritten.Contains(step.Name));
        if (threads == 1)
        {
            foreach (var (name, write) in steps)
            {
                cancellationToken.ThrowIfCancellationRequested();
                write(Path.Combine(folder, name));
            }
        }
        else
        {
            // Each worker takes the next file in the list when it is done with one.
            var options = new ParallelOptions { MaxDegreeOfParallelism = threads, CancellationToken = cancellationToken };
            try
            {
                Parallel.ForEach(Partitioner.Create(steps, EnumerablePartitionerOptions.NoBuffering), options, step => step.Write(Path.Combine(folder, step.Name)));
            }
            catch (AggregateException ex) when (ex.InnerExceptions.Count > 0)
            {
                // The caller handles an input, file or cancellation error by its type, as with one file at a time.
                ExceptionDispatchInfo.Capture(ex.InnerExceptions[0]).Throw();
            }
        }

        if (run.RejectedRows.Count > 0)
        {
            cancellationToken.ThrowIfCancellationRequested();
            AtomicFile.WriteText(Path.Combine(folder, RejectedRowsFileName), w => RejectedRowsCsv.Write(w, run.RejectedRows));
            written.Add(RejectedRowsFileName);
        }

        return written;
    }

    /// <summary>
    /// Writes forecasts-long.csv, the largest data file, into <paramref name="folder"/> from the backtest alone: a caller
    /// with a thread waiting for the rest of the run (the rule's trades) writes it meanwhile and passes its name to
    /// <see cref="WriteData(string, BacktestRun, int, IReadOnlyCollection{string}, CancellationToken)"/>.
    /// </summary>
    /// <param name="folder">An existing folder (the caller's staging folder) without that file.</param>
    /// <param name="result">The backtest.</param>
    /// <returns>The file name written (without the folder).</returns>
    /// <exception cref="IOException">The file exists in the folder.</exception>
    public static string WriteForecastsLong(string folder, BacktestResult result)
    {
        ArgumentNullException.ThrowIfNull(folder);
        ArgumentNullException.ThrowIfNull(result);
        AtomicFile.WriteText(Path.Combine(folder, ForecastsLongCsv.FileName), w => ForecastsLongCsv.Write(w, result));
        return ForecastsLongCsv.FileName;
    }

    /// <summary>Writes run.json into <paramref name="folder"/>: settings, inputs and their hashes, and the manifest of the run's files.</summary>
    /// <param name="folder">The folder the rest of the run was written to.</param>
    /// <param name="run">The run.</param>
    /// <param name="files">The names of the other files of the run in that folder; run.json is added to the manifest.</param>
    /// <returns>The manifest as written: every file name of the run, run.json included, in ordinal order.</returns>
    /// <exception cref="IOException">run.json exists in the folder.</exception>
    public static ImmutableArray<string> WriteRunRecord(string folder, BacktestRun run, IEnumerable<string> files)
    {
        ArgumentNullException.ThrowIfNull(folder);
        ArgumentNullException.ThrowIfNull(run);
        ArgumentNullException.ThrowIfNull(files);
        var manifest = files.Append(RunFileName).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToImmutableArray();
        AtomicFile.WriteText(Path.Combine(folder, RunFileName), w => RunJson.Write(w, run.Result, run.Info, manifest));
        return manifest;
    }

    /// <summary>Reads the manifest of the run recorded in a folder's run.json.</summary>
    /// <param name="folder">A results folder.</param>
    /// <returns>
    /// The file names the run wrote; empty when run.json is missing or unreadable; null when run.json is readable but
    /// has no manifest (it was written by an earlier version of the tool).
    /// </returns>
    public static ImmutableArray<string>? ReadManifest(string folder)
    {
        ArgumentNullException.ThrowIfNull(folder);
        var path = Path.Combine(folder, RunFileName);
        if (!File.Exists(path))
        {
            return [];
        }

        try
        {
            using var doc = JsonDocument.Parse(File.ReadAllBytes(path));
            if (!doc.RootElement.TryGetProperty("files", out var files))
            {
                return doc.RootElement.TryGetProperty("tool", out var tool) && tool.ValueKind == JsonValueKind.String && tool.GetString() == "volcast" ? null : [];
            }

            return [.. files.EnumerateArray().Select(e => e.GetString()).OfType<string>().Where(IsPlainName)];
        }
        catch (Exception ex) when (ex is JsonException or InvalidOperationException or IOException or UnauthorizedAccessException)
        {
            return [];
        }
    }

    // A manifest names files inside its own folder; anything else (a path, "..") is not the tool's and is ignored.
    private static bool IsPlainName(string name) =>
        name.Length > 0 && name != "." && name != ".." && name.IndexOfAny(['/', '\\']) < 0;
}
