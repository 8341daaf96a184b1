using System.Collections.Immutable;
using System.Reflection;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Data;
using VolCast.IO;
using VolCast.IO.Results;
using VolCast.Reports;

namespace VolCast.Cli;

/// <summary>
/// Loads one job's inputs, runs the backtest and writes its results folder (results files, report.html and its charts). Holds no shared state, so jobs for
/// different assets can run side by side (and, one day, on different machines).
/// </summary>
internal static class BacktestPipeline
{
    /// <summary>Runs one job.</summary>
    /// <param name="job">What to run.</param>
    /// <param name="warn">Receives each input warning as it is found.</param>
    /// <param name="progress">Receives progress, or null.</param>
    /// <param name="cancellationToken">Stops the run between forecasters.</param>
    /// <returns>The result and the run information written beside it.</returns>
    /// <exception cref="InputDataException">An input file cannot be used.</exception>
    /// <exception cref="UsageException">The settings ask for something the data cannot give.</exception>
    public static (BacktestResult Result, BacktestRunInfo Run) Run(
        BacktestJob job, Action<string> warn, IProgress<BacktestProgress>? progress, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(job);
        ArgumentNullException.ThrowIfNull(warn);
        var started = DateTimeOffset.UtcNow;
        var priceLoad = PriceFileReader.Read(job.Prices);
        var inputWarnings = new List<string>();
        foreach (var warning in priceLoad.Warnings)
        {
            warn(warning.ToString());
            inputWarnings.Add(warning.ToString());
        }

        ImpliedLoad? impliedLoad = null;
        if (job.Implied is not null)
        {
            impliedLoad = ImpliedFileReader.Read(job.Implied, job.ImpliedUnit);
            foreach (var warning in impliedLoad.Warnings)
            {
                warn(warning.ToString());
                inputWarnings.Add(warning.ToString());
            }
        }

        BacktestResult result;
        try
        {
            result = Backtester.Run(priceLoad.History, impliedLoad?.Series, job.Settings, progress: progress, cancellationToken: cancellationToken);
        }
        catch (BacktestDataException ex)
        {
            throw new InputDataException(job.Implied is not null && ex.Message.StartsWith("No date is shared", StringComparison.Ordinal) ? job.Implied : job.Prices, null, null, ex.Message);
        }
        catch (ArgumentException ex)
        {
            throw new UsageException(ex.Message);
        }

        // Do the odds hold? N(d2) probabilities at the default strikes and the expected-move ranges, on the same dates and prices.
        var calibration = BacktestCalibrator.Evaluate(result, priceLoad.History);

        var inputs = ImmutableArray.CreateBuilder<InputFileInfo>();
        inputs.Add(new InputFileInfo("prices", job.Prices, priceLoad.Sha256));
        if (impliedLoad is not null)
        {
            inputs.Add(new InputFileInfo(ImpliedSeries.Name, job.Implied!, impliedLoad.Sha256));
        }

        if (job.Config is not null)
        {
            inputs.Add(new InputFileInfo("config", job.Config, Sha256(job.Config)));
        }

        var run = new BacktestRunInfo(
            ToolVersion(),
            inputs.ToImmutable(),
            started,
            DateTimeOffset.UtcNow,
            impliedLoad is null ? null : (impliedLoad.UnitUsed == ImpliedUnit.Percent ? "percent" : "decimal") + (impliedLoad.UnitInferred ? " (inferred)" : string.Empty),
            [.. inputWarnings]);
        // The report is built inside the results writer's temporary folder, so it moves into place with the rest or not at all.
        BacktestResultsWriter.Write(
            job.OutputFolder,
            result,
            run,
            job.Force,
            temp => ReportWriter.Write(temp, result, run, priceLoad.History, priceLoad.RowsRead, calibration),
            calibration);
        return (result, run);
    }

    /// <summary>Gets the tool's version as recorded in run.json.</summary>
    public static string ToolVersion() =>
        typeof(BacktestPipeline).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion ?? "unknown";

    private static string Sha256(string path)
    {
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read);
        return Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(stream));
    }
}
