using System.Collections.Immutable;
using VolCast.Core.Backtest;
using VolCast.Core.Data;
using VolCast.IO;
using VolCast.IO.Results;

namespace VolCast.Cli.Batch;

/// <summary>
/// The batch's unit of work: one asset, one configuration, inputs identified by content hash, results written
/// atomically into the asset's own folder. Reads nothing but its inputs and its folder and shares no state, so many
/// run side by side, and any worker anywhere could run one.
/// </summary>
/// <param name="Asset">The asset.</param>
/// <param name="ImpliedUnit">The unit of the implied file's iv column.</param>
/// <param name="Settings">The resolved settings.</param>
/// <param name="Config">The configuration file, if any (recorded in run.json).</param>
/// <param name="Folder">The asset's results folder, <c>OUT/assets/NAME</c>.</param>
/// <param name="Fingerprint">The fingerprint of the resolved configuration (<see cref="BatchFingerprint"/>).</param>
/// <param name="Force">Recompute even when the folder is complete and up to date.</param>
internal sealed record BatchAssetJob(
    BatchAsset Asset,
    ImpliedUnit ImpliedUnit,
    BacktestSettings Settings,
    string? Config,
    string Folder,
    string Fingerprint,
    bool Force)
{
    /// <summary>The per-name report page that a kept folder must hold when pages are drawn.</summary>
    public const string ReportPage = "report.html";

    /// <summary>Gets how the asset's files are written (date format, delimiter, decimal separator).</summary>
    public CsvFormat Format { get; init; } = CsvFormat.Default;

    /// <summary>Gets the implied file's declared tenor in calendar days, or null when it is the backtest's own.</summary>
    public int? ImpliedTenorDays { get; init; }

    /// <summary>Gets how the asset's bad and suspect rows are treated.</summary>
    public DataChecks Checks { get; init; } = DataChecks.Default;

    /// <summary>Gets whether the asset's folder also gets results.xlsx.</summary>
    public bool Workbook { get; init; }

    /// <summary>Gets the configuration file's SHA-256, hashed once for the whole batch, or null to hash it here.</summary>
    public string? ConfigSha256 { get; init; }

    /// <summary>Gets how many threads the name keeps busy at once (0 for one per core): see <see cref="BacktestJob.Threads"/>.</summary>
    public int Threads { get; init; }

    /// <summary>Gets which report pages are drawn; with <see cref="BatchReports.Full"/> a kept folder must hold its report page too.</summary>
    public BatchReports Reports { get; init; } = BatchReports.Full;

    /// <summary>
    /// Gets the folder where a shard keeps the record of a failed name (<c>OUT/failures/NAME</c>) so that the reduce can
    /// show the same failure as a single-process batch, or null when failures are not recorded.
    /// </summary>
    public string? FailureFolder { get; init; }

    /// <summary>Runs the asset, or keeps its results when they are complete and its inputs and configuration are unchanged.</summary>
    /// <returns>The summary row and whether the earlier results were kept. A failure is a row with its message, never an exception, except cancellation.</returns>
    /// <exception cref="OperationCanceledException">The token was cancelled; the folder is left as it was or complete.</exception>
    public (BatchAssetRow Row, bool Reused) Run(CancellationToken cancellationToken)
    {
        var hasImplied = Asset.Implied is not null;
        var inputs = ImmutableSortedDictionary<string, string>.Empty.WithComparers(StringComparer.Ordinal);
        try
        {
            // Each input is read once: the hash that decides whether earlier results still hold is of the very bytes the backtest then parses.
            var prices = InputBytes.Read(Asset.Prices);
            var implied = Asset.Implied is null ? null : InputBytes.Read(Asset.Implied);
            inputs = Hashes(prices, implied);
            if (!Force && UpToDate(inputs) is BatchAssetRow kept)
            {
                ForgetFailure();
                return (kept, true);
            }

            cancellationToken.ThrowIfCancellationRequested();
            var job = new BacktestJob(Asset.Prices, Asset.Implied, ImpliedUnit, Settings, Config, Folder, Force: Directory.Exists(Folder))
            {
                PricesRead = prices,
                ImpliedRead = implied,
                ConfigSha256 = Config is null ? null : inputs["config"],
                Format = Format,
                ImpliedTenorDays = ImpliedTenorDays,
                WriteReport = Reports == BatchReports.Full,
                Threads = Threads,
                Checks = Checks,
                Workbook = Workbook,
            };
            BatchAssetRow? row = null;
            var hashes = inputs;
            BacktestPipeline.Run(job, static _ => { }, null, writeMore: (staging, run) =>
            {
                // Committed with the results: its presence says the folder is complete for these inputs and this configuration.
                row = BatchRows.FromResult(Asset.Name, run.Result);
                BatchAssetJson.Write(staging, new BatchAssetRecord(hashes, Fingerprint, row));
                return [BatchAssetJson.FileName];
            }, cancellationToken: cancellationToken);
            ForgetFailure();
            return (row!, false);
        }
        catch (OperationCanceledException)
        {
            throw;
        }
        catch (Exception ex) when (ex is InputDataException or UsageException or IOException or UnauthorizedAccessException)
        {
            return (Failed(inputs, BatchRows.Failed(Asset.Name, hasImplied, ex.Message)), false);
        }
#pragma warning disable CA1031 // One asset's unexpected failure must not stop the others; its message goes into the summary.
        catch (Exception ex)
#pragma warning restore CA1031
        {
            return (Failed(inputs, BatchRows.Failed(Asset.Name, hasImplied, "unexpected failure: " + ex.Message)), false);
        }
    }

    /// <summary>
    /// What a finished run left for this asset, without computing anything: the row of a complete, up-to-date folder, or
    /// the recorded failure of these very inputs and this configuration, or null when the asset is missing, incomplete
    /// or stale (its inputs changed since).
    /// </summary>
    /// <exception cref="IOException">An input file cannot be read.</exception>
    public BatchAssetRow? Finished()
    {
        var prices = InputBytes.Read(Asset.Prices);
        var implied = Asset.Implied is null ? null : InputBytes.Read(Asset.Implied);
        var inputs = Hashes(prices, implied);
        if (UpToDate(inputs) is BatchAssetRow kept)
        {
            return kept;
        }

        if (FailureFolder is not null && BatchAssetJson.TryRead(FailureFolder) is { } failure
            && failure.ConfigurationFingerprint == Fingerprint && failure.Row.Name == Asset.Name && !failure.Row.Succeeded
            && SameHashes(failure.InputHashes, inputs))
        {
            return failure.Row;
        }

        return null;
    }

    /// <summary>
    /// What a finished run left for this asset when its input files cannot be read here (a reduce on a machine that does not
    /// mount the input folders): as <see cref="Finished"/>, but each record is checked against itself — its batch.json against
    /// its run.json, its implied input and configuration file against the plan's — instead of against the inputs' current bytes.
    /// </summary>
    public BatchAssetRow? FinishedAsRecorded()
    {
        if (BatchAssetJson.TryRead(Folder) is { } record && AsPlanned(record.InputHashes) && UpToDate(record.InputHashes) is BatchAssetRow kept)
        {
            return kept;
        }

        if (FailureFolder is not null && BatchAssetJson.TryRead(FailureFolder) is { } failure
            && failure.ConfigurationFingerprint == Fingerprint && failure.Row.Name == Asset.Name && !failure.Row.Succeeded
            && AsPlanned(failure.InputHashes))
        {
            return failure.Row;
        }

        return null;
    }

    private bool AsPlanned(ImmutableSortedDictionary<string, string> recorded) =>
        recorded.ContainsKey("prices")
        && recorded.ContainsKey(ImpliedSeries.Name) == (Asset.Implied is not null)
        && (Config is null
            ? !recorded.ContainsKey("config")
            : recorded.TryGetValue("config", out var sha) && string.Equals(sha, ConfigSha256, StringComparison.Ordinal));

    private ImmutableSortedDictionary<string, string> Hashes(InputBytes prices, InputBytes? implied)
    {
        var hashes = ImmutableSortedDictionary.CreateBuilder<string, string>(StringComparer.Ordinal);
        hashes["prices"] = prices.Sha256;
        if (implied is not null)
        {
            hashes[ImpliedSeries.Name] = implied.Sha256;
        }

        if (Config is not null)
        {
            hashes["config"] = ConfigSha256 ?? InputBytes.Read(Config).Sha256;
        }

        return hashes.ToImmutable();
    }

    private BatchAssetRow Failed(ImmutableSortedDictionary<string, string> inputs, BatchAssetRow row)
    {
        if (FailureFolder is not null && inputs.Count > 0)
        {
            try
            {
                BatchAssetJson.Write(FailureFolder, new BatchAssetRecord(inputs, Fingerprint, row));
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                // The failure is still in this shard's output; the reduce will then name the asset as missing.
            }
        }

        return row;
    }

    private void ForgetFailure()
    {
        if (FailureFolder is not null && Directory.Exists(FailureFolder))
        {
            try
            {
                Directory.Delete(FailureFolder, recursive: true);
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                // A stale failure record is harmless: the reduce prefers the complete folder.
            }
        }
    }

    private BatchAssetRow? UpToDate(ImmutableSortedDictionary<string, string> inputs)
    {
        if (!Directory.Exists(Folder) || BatchAssetJson.TryRead(Folder) is not { } record)
        {
            return null;
        }

        if (record.ConfigurationFingerprint != Fingerprint || !SameHashes(record.InputHashes, inputs) || record.Row.Name != Asset.Name)
        {
            return null;
        }

        // Complete means every file the run listed in its manifest is there: which files a run writes depends on its
        // inputs (no trades.csv or rule-pnl.csv without implied, rejected-rows.csv only when rows were left out), and the
        // page too when pages are asked for.
        if (BacktestResultsWriter.ReadManifest(Folder) is not { } manifest
            || !manifest.Contains(BacktestResultsWriter.RunFileName) || !manifest.Contains(BatchAssetJson.FileName)
            || (Reports == BatchReports.Full && !manifest.Contains(ReportPage)))
        {
            return null;
        }

        foreach (var name in manifest)
        {
            if (!File.Exists(Path.Combine(Folder, name)))
            {
                return null;
            }
        }

        // run.json must agree too: it is what a reader traces the results back to.
        var run = BatchAssetJson.TryReadRunInputs(Folder);
        return run is not null && SameHashes(run, inputs) ? record.Row : null;
    }

    private static bool SameHashes(ImmutableSortedDictionary<string, string> a, ImmutableSortedDictionary<string, string> b)
    {
        if (a.Count != b.Count)
        {
            return false;
        }

        foreach (var (role, sha) in a)
        {
            if (!b.TryGetValue(role, out var other) || !string.Equals(sha, other, StringComparison.Ordinal))
            {
                return false;
            }
        }

        return true;
    }
}
