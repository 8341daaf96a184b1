using System.Text.Json;
using VolCast.IO;
using VolCast.IO.Results;

namespace VolCast.Cli.Batch;

/// <summary>
/// The reduce after shards: reads every name's finished folder (its batch.json, checked against the inputs' SHA-256 and the
/// configuration's fingerprint, as a rerun would) or its recorded failure, and writes the same summary files as a
/// single-process batch. Computes nothing.
/// </summary>
internal static class BatchReducer
{
    /// <summary>Reduces the batch folder of <paramref name="request"/>.</summary>
    /// <param name="request">The same request the shards ran (inputs, configuration, output folder).</param>
    /// <param name="allowMissing">Write a partial summary when names are missing, marking them as not finished.</param>
    /// <returns>What was found; the summary is written when nothing is missing or <paramref name="allowMissing"/>.</returns>
    /// <exception cref="UsageException">The input folders cannot be used.</exception>
    /// <exception cref="InputDataException">The output folder is not a batch output, or names were computed with another configuration or tool version.</exception>
    public static BatchReduceOutcome Reduce(BatchRequest request, bool allowMissing)
    {
        ArgumentNullException.ThrowIfNull(request);
        var assets = BatchRunner.FindAssets(request);
        var assetsFolder = Path.Combine(request.OutputFolder, BatchRunner.AssetsFolder);
        if (!Directory.Exists(assetsFolder))
        {
            throw new InputDataException(request.OutputFolder, null, null,
                $"this folder is not a batch output: it has no {BatchRunner.AssetsFolder} folder of per-name results. Give --out the folder the shards wrote into (the same --out as theirs), after they have run.");
        }

        var version = BacktestPipeline.ToolVersion();
        var fingerprint = BatchFingerprint.Of(request.Settings, request.ImpliedUnit, version, request.Format, request.ImpliedTenorDays, request.Checks, request.Workbook);
        var configSha256 = request.Config is null ? null : InputBytes.Read(request.Config).Sha256;
        var rows = new BatchAssetRow[assets.Count];
        var missing = new List<string>();
        var missingWhy = new List<string>();
        var differing = new List<string>();
        var failed = 0;
        for (var i = 0; i < assets.Count; i++)
        {
            var asset = assets[i];
            if (asset.Problem is string problem)
            {
                // The same row the batch writes for a name it cannot use; no shard computes such a name.
                rows[i] = BatchRows.Failed(asset.Name, asset.Implied is not null, problem);
                failed++;
                continue;
            }

            var folder = Path.Combine(assetsFolder, asset.Name);
            var job = new BatchAssetJob(asset, request.ImpliedUnit, request.Settings, request.Config, folder, fingerprint, Force: false)
            {
                ConfigSha256 = configSha256,
                Format = request.Format,
                ImpliedTenorDays = request.ImpliedTenorDays,
                Reports = request.Reports,
                FailureFolder = Path.Combine(request.OutputFolder, BatchRunner.FailuresFolder, asset.Name),
            };
            BatchAssetRow? row;
            try
            {
                row = job.Finished();
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                row = null;
            }

            if (row is not null)
            {
                rows[i] = row;
                failed += row.Succeeded ? 0 : 1;
                continue;
            }

            if (BatchAssetJson.TryRead(folder) is { } record && record.ConfigurationFingerprint != fingerprint)
            {
                differing.Add(asset.Name + " (" + Difference(folder, version) + ")");
                continue;
            }

            var why = Why(folder, asset.Name);
            missing.Add(asset.Name);
            missingWhy.Add(asset.Name + " (" + why + ")");
            rows[i] = BatchRows.Failed(asset.Name, asset.Implied is not null, "not finished: " + why + "; run its shard again (a shard reruns only what is missing), then the reduce");
        }

        if (differing.Count > 0)
        {
            throw new InputDataException(assetsFolder, null, null,
                $"{differing.Count} names were computed with another configuration or tool version than this reduce's (volcast {version} with the options and --config given): {string.Join("; ", differing)}. "
                + "Give the reduce the same options as the shards, or rerun those names' shards with this configuration.");
        }

        var written = missing.Count == 0 || allowMissing;
        if (written)
        {
            BatchSummaryWriter.Write(request, rows, missing);
        }

        return new BatchReduceOutcome(rows, missingWhy, failed, written);
    }

    private static string Why(string folder, string name)
    {
        if (!Directory.Exists(folder))
        {
            return $"no results folder {BatchRunner.AssetsFolder}/{name}";
        }

        if (BatchAssetJson.TryRead(folder) is null)
        {
            return $"{BatchRunner.AssetsFolder}/{name} has no readable {BatchAssetJson.FileName}, so it is not a finished batch result";
        }

        return "its results are incomplete or its input files changed since they were computed (their SHA-256 differs from the one recorded)";
    }

    private static string Difference(string folder, string version)
    {
        var theirs = RunVersion(folder);
        return theirs is not null && theirs != version
            ? $"tool version {theirs}, this is {version}"
            : "a different configuration: its settings, implied unit, input form or tool version differ from the options given; see its run.json";
    }

    private static string? RunVersion(string folder)
    {
        try
        {
            using var doc = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(folder, "run.json")));
            return doc.RootElement.TryGetProperty("version", out var v) ? v.GetString() : null;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or JsonException or InvalidOperationException)
        {
            return null;
        }
    }
}
