using System.Diagnostics;
using VolCast.IO;
using VolCast.IO.Results;

namespace VolCast.Cli.Batch;

/// <summary>
/// Runs a batch: one <see cref="BatchAssetJob"/> per asset on a bounded number of workers, keeping only each asset's
/// summary row (so memory does not grow with the number of names), after writing the batch's plan (<see cref="BatchPlan"/>), then writes summary.csv, lookbacks.csv, beats-implied.csv and summary.html.
/// </summary>
internal static class BatchRunner
{
    /// <summary>The folder under the batch's output folder that holds one results folder per asset.</summary>
    public const string AssetsFolder = "assets";

    /// <summary>The folder under the batch's output folder where shards record the names that failed, one <c>NAME/batch.json</c> each.</summary>
    public const string FailuresFolder = "failures";

    /// <summary>Lists the batch's assets after checking its input folders.</summary>
    /// <exception cref="UsageException">The prices folder is missing or holds no CSV file, or the implied folder is missing.</exception>
    public static IReadOnlyList<BatchAsset> FindAssets(BatchRequest request)
    {
        ArgumentNullException.ThrowIfNull(request);
        if (!Directory.Exists(request.PricesFolder))
        {
            throw new UsageException($"{request.PricesFolder}: the prices folder does not exist; --prices-dir must name a folder of NAME.csv price files.");
        }

        if (request.ImpliedFolder is not null && !Directory.Exists(request.ImpliedFolder))
        {
            throw new UsageException($"{request.ImpliedFolder}: the implied folder does not exist; --implied-dir must name a folder of NAME.csv implied files.");
        }

        var assets = BatchAsset.Find(request.PricesFolder, request.ImpliedFolder);
        if (assets.Count == 0)
        {
            throw new UsageException($"{request.PricesFolder}: no .csv price file found; the batch runs one backtest per NAME.csv in this folder.");
        }

        return assets;
    }

    /// <summary>Runs the batch, or the request's shard of it (which writes no summary).</summary>
    /// <param name="request">What to batch.</param>
    /// <param name="progress">Receives one report per finished asset, or null.</param>
    /// <param name="cancellationToken">Stops the batch: no new asset starts, running ones stop between forecasters, finished ones stay.</param>
    /// <returns>What happened; the summary is written only when every asset finished or failed, and never by a shard.</returns>
    /// <exception cref="UsageException">The prices folder is missing or holds no CSV file.</exception>
    public static BatchOutcome Run(BatchRequest request, IProgress<BatchProgress>? progress, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(request);
        var all = FindAssets(request);
        var assetsFolder = Path.Combine(request.OutputFolder, AssetsFolder);
        List<BatchAsset> assets;
        if (request.Shard is { } shard)
        {
            // A shard owns only its names: it removes what killed runs of those names left, whichever process or machine
            // they ran on (one shard index runs once at a time), and never touches the other shards' temporaries.
            assets = [.. all.Where(a => shard.Owns(a.Name))];
            foreach (var asset in assets)
            {
                ResultsFolder.RemoveTemporariesOf(assetsFolder, asset.Name);
            }
        }
        else
        {
            // The batch owns OUT/assets: what killed runs left there is removed before any name is looked at.
            assets = [.. all];
            ResultsFolder.RemoveStaleTemporaries(assetsFolder);
        }

        var configSha256 = request.Config is null ? null : InputBytes.Read(request.Config).Sha256;
        var plan = BatchPlan.Of(request, all, BatchFingerprint.Text(request.Settings, request.ImpliedUnit, BacktestPipeline.ToolVersion(), request.Format, request.ImpliedTenorDays, request.Checks, request.Workbook), configSha256);
        var fingerprint = plan.Fingerprint;

        // Every shard writes the same plan (it holds nothing of the shard), so a reduce given only this folder knows the names and the configuration.
        Directory.CreateDirectory(request.OutputFolder);
        plan.Write(request.OutputFolder);
        var rows = new BatchAssetRow?[assets.Count];
        var gate = new Lock();
        int done = 0, reused = 0, failed = 0, computed = 0;
        var clock = Stopwatch.StartNew();
        var computeTime = TimeSpan.Zero;
        var cancelled = false;

        // Names already share the cores between them: a name's own work then runs on one thread, which saves the threads'
        // coordination (about a quarter of the forecasting CPU in bench/README.md, "Per name"). With fewer workers than
        // cores, each name uses the cores left over.
        var threads = Math.Max(1, Environment.ProcessorCount / Math.Max(1, request.Jobs));
        try
        {
            Parallel.For(
                0,
                assets.Count,
                new ParallelOptions { MaxDegreeOfParallelism = Math.Max(1, request.Jobs), CancellationToken = cancellationToken },
                (i, state) =>
                {
                    var asset = assets[i];
                    var started = clock.Elapsed;
                    var (row, wasReused) = asset.Problem is string problem
                        ? (BatchRows.Failed(asset.Name, asset.Implied is not null, problem), false)
                        : new BatchAssetJob(
                            asset, request.ImpliedUnit, request.Settings, request.Config,
                            Path.Combine(request.OutputFolder, AssetsFolder, asset.Name), fingerprint, request.Force)
                        {
                            ConfigSha256 = configSha256,
                            Format = request.Format,
                            ImpliedTenorDays = request.ImpliedTenorDays,
                            Reports = request.Reports,
                            Threads = threads,
                            FailureFolder = request.Shard is null ? null : Path.Combine(request.OutputFolder, FailuresFolder, asset.Name),
                            Checks = request.Checks,
                            Workbook = request.Workbook,
                        }.Run(cancellationToken);
                    BatchProgress report;
                    lock (gate)
                    {
                        rows[i] = row;
                        if (!row.Succeeded)
                        {
                            failed++;
                        }
                        else
                        {
                            done++;
                        }

                        if (wasReused)
                        {
                            reused++;
                        }
                        else
                        {
                            computed++;
                            computeTime += clock.Elapsed - started;
                        }

                        var remaining = assets.Count - done - failed;
                        TimeSpan? eta = computed == 0
                            ? null
                            : TimeSpan.FromTicks(computeTime.Ticks / computed * remaining / Math.Max(1, Math.Min(request.Jobs, Math.Max(1, remaining))));
                        report = new BatchProgress(done, reused, failed, assets.Count, clock.Elapsed, eta, asset.Name);
                    }

                    progress?.Report(report);
                });
        }
        catch (OperationCanceledException)
        {
            cancelled = true;
        }
        catch (AggregateException ex) when (ex.InnerExceptions.All(e => e is OperationCanceledException))
        {
            cancelled = true;
        }

        var finished = rows.Where(r => r is not null).Select(r => r!).ToList();
        if (!cancelled && request.Shard is null)
        {
            BatchSummaryWriter.Write(request.OutputFolder, plan, finished);
        }

        return new BatchOutcome(finished, computed, reused, failed, cancelled);
    }
}
