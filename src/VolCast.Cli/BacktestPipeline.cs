using System.Collections.Immutable;
using System.Reflection;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Data;
using VolCast.Core.Trading;
using VolCast.IO;
using VolCast.IO.Results;
using VolCast.IO.Workbook;
using VolCast.Reports;

namespace VolCast.Cli;

/// <summary>
/// One backtest run, top to bottom: check the output folder → load → forecast and score (Core) → calibrate and trade the
/// rule (Core; side by side when the job may use two threads) → stage a temporary folder → write the data files (IO) →
/// write the report (Reports) → run.json with the manifest → commit.
/// Holds no shared state, so jobs for different assets can run side by side.
/// </summary>
internal static class BacktestPipeline
{
    /// <summary>Runs one job and commits its results folder.</summary>
    /// <param name="job">What to run.</param>
    /// <param name="warn">Receives each input warning as it is found.</param>
    /// <param name="progress">Receives the forecasters' progress, or null.</param>
    /// <param name="stage">Told as each stage starts, or null.</param>
    /// <param name="writeMore">
    /// Writes further files of the same run into the staging folder it is given and returns their names, so they are
    /// committed (and listed in run.json) with the rest; or null. The batch writes its record this way.
    /// </param>
    /// <param name="cancellationToken">Stops the run at any stage before the commit; nothing is then written.</param>
    /// <returns>The run that was written.</returns>
    /// <exception cref="InputDataException">An input file cannot be used.</exception>
    /// <exception cref="UsageException">The settings ask for something the data cannot give, or the output folder cannot be used.</exception>
    /// <exception cref="IOException">Another run holds or created the output folder, or a file there is not the tool's.</exception>
    /// <exception cref="OperationCanceledException">The token was cancelled; the output folder is as it was.</exception>
    public static BacktestRun Run(
        BacktestJob job,
        Action<string> warn,
        IProgress<BacktestProgress>? progress,
        Action<BacktestStage>? stage = null,
        Func<string, BacktestRun, IReadOnlyList<string>>? writeMore = null,
        CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(job);
        ArgumentNullException.ThrowIfNull(warn);
        stage?.Invoke(BacktestStage.CheckOutput);
        using var output = ResultsFolder.Open(job.OutputFolder, job.Force, job.Inputs);
        cancellationToken.ThrowIfCancellationRequested();

        stage?.Invoke(BacktestStage.Load);
        var started = DateTimeOffset.UtcNow;
        progress?.Report(new BacktestProgress("reading inputs", 0, 1));
        var (prices, implied, warnings, notes, rejected) = Load(job, warn);
        var userForecasts = LoadUserForecasts(job, prices, warn, ref warnings);
        if (prices.AdjustedCloseApplied && job.Settings.Trading.DividendYield != 0)
        {
            // The adjusted closes already hold the dividends: a dividend yield in the pricing would count them twice.
            throw new UsageException(string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"{job.Prices}: the adj_close column rescaled the prices, so the dividends are already in the price path; set dividendYield to 0 (was {job.Settings.Trading.DividendYield}) or give unadjusted closes."));
        }

        progress?.Report(new BacktestProgress("reading inputs", 1, 1));
        cancellationToken.ThrowIfCancellationRequested();

        var events = job.Events is null ? (InputBytes?)null : InputBytes.Read(job.Events);
        IReadOnlyList<MarketEvent>? eventList = events is null ? null : EventsFileReader.Read(events, job.Format, prices.History.Dates);

        stage?.Invoke(BacktestStage.Forecast);
        var result = Forecast(job, prices, implied, userForecasts, progress, cancellationToken);

        // Would the rule have paid? The rule as delta-hedged straddles, and the threshold search tested for data snooping.
        // It reads only the finished backtest, so with a core to spare it runs beside the grouped scores and the odds checks.
        var spare = (job.Threads == 0 ? Environment.ProcessorCount : job.Threads) > 1;
        var trading = spare ? Task.Run(() => RulePnlEvaluator.Evaluate(result, prices.History, cancellationToken), cancellationToken) : null;
        var groups = GroupedScores.Compute(result, prices.History, eventList);

        // Do the odds hold? N(d2) probabilities at the default strikes and the forecast move bands, on the same dates and prices.
        stage?.Invoke(BacktestStage.Calibrate);
        progress?.Report(new BacktestProgress("checking the odds", 0, 1));
        var calibration = BacktestCalibrator.Evaluate(result, prices.History, cancellationToken: cancellationToken);
        progress?.Report(new BacktestProgress("checking the odds", 1, 1));
        cancellationToken.ThrowIfCancellationRequested();

        stage?.Invoke(BacktestStage.RulePnl);
        progress?.Report(new BacktestProgress("trading the rule", 0, 1));
        cancellationToken.ThrowIfCancellationRequested();
        var staging = output.Stage();
        IReadOnlyCollection<string> writtenEarly = [];
        if (trading is { IsCompleted: false })
        {
            // The trades are still running on the other core: this thread writes the largest data file, which does not
            // depend on them, instead of waiting.
            writtenEarly = [BacktestResultsWriter.WriteForecastsLong(staging, result)];
        }

        var (rulePnl, absence) = trading is null ? RulePnlEvaluator.Evaluate(result, prices.History, cancellationToken) : trading.GetAwaiter().GetResult();
        progress?.Report(new BacktestProgress("trading the rule", 1, 1));
        cancellationToken.ThrowIfCancellationRequested();
        var info = Info(job, prices, implied, userForecasts, warnings, started, events) with
        {
            InputNotes = notes,
            Suspect = job.Checks.Suspect.ToString().ToLowerInvariant(),
            RowsLeftOut = rejected.Count,
            InputFormat = job.Format,
        };
        var run = new BacktestRun(result, calibration, info, prices.History, prices.RowsRead)
        {
            RejectedRows = rejected,
            RulePnl = rulePnl,
            RulePnlAbsence = absence,
            Groups = groups,
        };

        stage?.Invoke(BacktestStage.WriteData);
        progress?.Report(new BacktestProgress("writing results", 0, 1));
        var files = new List<string>(BacktestResultsWriter.WriteData(staging, run, spare ? 2 : 1, writtenEarly, cancellationToken));
        progress?.Report(new BacktestProgress("writing results", 1, 1));

        stage?.Invoke(BacktestStage.WriteReport);
        if (job.WriteReport)
        {
            files.AddRange(ReportWriter.Write(staging, run, progress, spare, cancellationToken));
        }

        if (writeMore is not null)
        {
            cancellationToken.ThrowIfCancellationRequested();
            files.AddRange(writeMore(staging, run));
        }

        if (job.Workbook)
        {
            // The workbook's settings sheet comes from run.json, so run.json (which lists the workbook) is written first.
            files.Add(ResultsWorkbook.FileName);
        }

        var manifest = BacktestResultsWriter.WriteRunRecord(staging, run, files);
        if (job.Workbook)
        {
            ResultsWorkbook.Write(staging, File.ReadAllText(Path.Combine(staging, BacktestResultsWriter.RunFileName)), cancellationToken);
        }

        stage?.Invoke(BacktestStage.Commit);
        cancellationToken.ThrowIfCancellationRequested();
        output.Commit(manifest);
        return run;
    }

    /// <summary>Gets the tool's version as recorded in run.json.</summary>
    public static string ToolVersion() =>
        typeof(BacktestPipeline).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion ?? "unknown";

    private static (PriceLoad Prices, ImpliedLoad? Implied, ImmutableArray<string> Warnings, ImmutableArray<string> Notes, IReadOnlyList<RejectedRow> Rejected) Load(BacktestJob job, Action<string> warn)
    {
        var warnings = ImmutableArray.CreateBuilder<string>();
        void Warn(InputWarning warning)
        {
            warn(warning.ToString());
            warnings.Add(warning.ToString());
        }

        var prices = PriceFileReader.Read(job.PricesRead ?? InputBytes.Read(job.Prices), job.Format, job.Checks);
        ImpliedLoad? implied = null;
        if (job.Implied is not null)
        {
            implied = ImpliedFileReader.Read(job.ImpliedRead ?? InputBytes.Read(job.Implied), job.ImpliedUnit, job.Format, job.Checks);
        }

        // The suspect checks run before any warning is shown, so that --suspect stop refuses with the whole list at once.
        var checkedInputs = SuspectRows.Apply(prices, implied, job.Implied, job.Checks.Suspect);
        foreach (var warning in prices.Warnings.Concat(implied?.Warnings ?? []).Concat(checkedInputs.Warnings))
        {
            Warn(warning);
        }

        var notes = InputNotes.For(job, checkedInputs);
        foreach (var note in notes)
        {
            warn(note);
        }

        if (job.Implied is not null && ImpliedTenor.Check(job.ImpliedTenorDays, job.Settings.Horizon, job.Implied) is { } mismatch)
        {
            Warn(mismatch);
        }

        return (checkedInputs.Prices, checkedInputs.Implied, warnings.ToImmutable(), notes, checkedInputs.Rejected);
    }

    /// <summary>Reads the user's forecasts file, when given, and checks it against the price dates; its warnings join the run's.</summary>
    private static UserForecastsLoad? LoadUserForecasts(BacktestJob job, PriceLoad prices, Action<string> warn, ref ImmutableArray<string> warnings)
    {
        if (job.Forecasts is null)
        {
            return null;
        }

        var load = UserForecastsFileReader.Read(InputBytes.Read(job.Forecasts), job.ForecastsUnit, job.Format);
        var more = load.Warnings.Concat(UserForecastsFileReader.CheckAgainstPrices(load, job.Forecasts, prices.History.Dates)).Select(w => w.ToString()).ToList();
        foreach (var w in more)
        {
            warn(w);
        }

        warnings = warnings.AddRange(more);
        return load;
    }

    private static BacktestResult Forecast(BacktestJob job, PriceLoad prices, ImpliedLoad? implied, UserForecastsLoad? userForecasts, IProgress<BacktestProgress>? progress, CancellationToken cancellationToken)
    {
        try
        {
            var additional = userForecasts is null ? null : (IReadOnlyList<Core.Forecasters.IVolatilityForecaster>)[.. userForecasts.Forecasters];
            return Backtester.Run(prices.History, implied?.Series, job.Settings, additional, progress, job.Threads, cancellationToken);
        }
        catch (BacktestDataException ex)
        {
            throw new InputDataException(ex.Input == BacktestInput.Implied && job.Implied is not null ? job.Implied : job.Prices, null, null, ex.Message);
        }
        catch (ArgumentException ex)
        {
            throw new UsageException(ex.Message);
        }
    }

    private static BacktestRunInfo Info(BacktestJob job, PriceLoad prices, ImpliedLoad? implied, UserForecastsLoad? userForecasts, ImmutableArray<string> warnings, DateTimeOffset started, InputBytes? events)
    {
        var inputs = ImmutableArray.CreateBuilder<InputFileInfo>();
        inputs.Add(new InputFileInfo("prices", job.Prices, prices.Sha256));
        if (implied is not null)
        {
            inputs.Add(new InputFileInfo(ImpliedSeries.Name, job.Implied!, implied.Sha256));
        }

        if (userForecasts is not null)
        {
            inputs.Add(new InputFileInfo("forecasts", job.Forecasts!, userForecasts.Sha256));
        }

        if (events is not null)
        {
            inputs.Add(new InputFileInfo("events", events.Path, events.Sha256));
        }

        if (job.Config is not null)
        {
            inputs.Add(new InputFileInfo("config", job.Config, job.ConfigSha256 ?? InputBytes.Read(job.Config).Sha256));
        }

        return new BacktestRunInfo(
            ToolVersion(),
            inputs.ToImmutable(),
            started,
            DateTimeOffset.UtcNow,
            implied is null ? null : (implied.UnitUsed == ImpliedUnit.Percent ? "percent" : "decimal") + (implied.UnitInferred ? " (inferred)" : string.Empty),
            warnings);
    }
}
