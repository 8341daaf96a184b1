using System.Globalization;
using System.Text.Json;
using VolCast.Core.Backtest;
using VolCast.IO;
using VolCast.IO.Results;

namespace VolCast.Cli.Batch;

/// <summary>
/// The reduce after shards: reads every name's finished folder (its batch.json, checked against the inputs' SHA-256 and the
/// configuration's fingerprint, as a rerun would) or its recorded failure, and writes the same summary files as a
/// single-process batch. Computes nothing. Given only the output folder, it takes the names, the configuration and the
/// tool version from the shards' plan (<see cref="BatchPlan"/>); given the shards' options, it checks them against the plan.
/// </summary>
internal static class BatchReducer
{
    /// <summary>Reduces a batch folder.</summary>
    /// <param name="outputFolder">The folder the shards wrote into.</param>
    /// <param name="request">The options given to the reduce (inputs, configuration), or null to take them from the shards' plan.</param>
    /// <param name="allowMissing">Write a partial summary when names are missing, marking them as not finished.</param>
    /// <returns>What was found; the summary is written when nothing is missing or <paramref name="allowMissing"/>.</returns>
    /// <exception cref="UsageException">The input folders given cannot be used.</exception>
    /// <param name="cancellationToken">Checked once the names are read and before each summary file: the files are written
    /// in full to temporary siblings and only then moved into place together, so a stop leaves the earlier summary whole and
    /// the files always belong together.</param>
    /// <exception cref="InputDataException">The output folder is not a batch output, its plan is damaged or of another tool version, or names were computed with another configuration or tool version.</exception>
    /// <exception cref="OperationCanceledException">The token was cancelled before the summary was written; nothing was written.</exception>
    public static BatchReduceOutcome Reduce(string outputFolder, BatchRequest? request, bool allowMissing, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(outputFolder);
        var assetsFolder = Path.Combine(outputFolder, BatchRunner.AssetsFolder);
        var planFile = Path.Combine(outputFolder, BatchPlan.FileName);
        var stored = Directory.Exists(outputFolder) ? BatchPlan.TryRead(outputFolder) : null;
        if (stored is null && !Directory.Exists(assetsFolder))
        {
            throw new InputDataException(outputFolder, null, null,
                $"this folder is not a batch output: it has neither {BatchPlan.FileName} nor an {BatchRunner.AssetsFolder} folder of per-name results. Give --out the folder the shards wrote into (the same --out as theirs), after they have run.");
        }

        BatchSummaryWriter.RemoveStaleTemporaries(outputFolder);
        var version = BacktestPipeline.ToolVersion();
        BatchPlan plan;
        var warnings = new List<string>();
        var asRecorded = false;
        IReadOnlyList<string> planDiffers = [];
        if (request is null)
        {
            plan = stored ?? throw new InputDataException(outputFolder, null, null,
                $"this batch folder has per-name results but no {BatchPlan.FileName}, the record of the names and options that shards of this volcast version write; give the reduce the shards' options (--prices-dir and the rest), or run any shard again to write it.");
            if (!string.Equals(plan.Version, version, StringComparison.Ordinal))
            {
                throw new InputDataException(planFile, null, null,
                    $"the shards ran volcast {plan.Version} and this reduce is volcast {version}; the summary must come from the version that computed the names. Run the reduce with volcast {plan.Version}, or rerun the shards with this one.");
            }

            if (!Directory.Exists(plan.PricesFolder) || (plan.ImpliedFolder is not null && !Directory.Exists(plan.ImpliedFolder)))
            {
                // The reduce may run where the inputs are not mounted; each name is then checked against its own records.
                asRecorded = true;
                warnings.Add($"the input folders the shards read ({plan.PricesFolder}{(plan.ImpliedFolder is null ? string.Empty : ", " + plan.ImpliedFolder)}) are not reachable from here, "
                    + "so each name is checked against its own records (batch.json, run.json and the plan), not against the input files' current bytes.");
            }
            else
            {
                // The summary is of the names the shards set out to compute; a price file added since is named, not run.
                var planned = plan.Assets.Select(a => a.Name).ToHashSet(StringComparer.Ordinal);
                var added = BatchAsset.Find(plan.PricesFolder, plan.ImpliedFolder).Select(a => a.Name).Where(n => !planned.Contains(n)).ToList();
                if (added.Count > 0)
                {
                    warnings.Add(string.Create(CultureInfo.InvariantCulture,
                        $"{added.Count} price files were added to {plan.PricesFolder} after the shards ran and are not in this summary: {string.Join(", ", added.Take(20))}{(added.Count > 20 ? ", …" : string.Empty)}; run the shards again (they compute only what is missing), then the reduce, to include them."));
                }
            }
        }
        else
        {
            var assets = BatchRunner.FindAssets(request);
            if (!Directory.Exists(assetsFolder))
            {
                throw new InputDataException(outputFolder, null, null,
                    $"this folder is not a batch output: it has no {BatchRunner.AssetsFolder} folder of per-name results. Give --out the folder the shards wrote into (the same --out as theirs), after they have run.");
            }

            var configuration = BatchFingerprint.Text(request.Settings, request.ImpliedUnit, version, request.Format, request.ImpliedTenorDays, request.Checks, request.Workbook);
            plan = BatchPlan.Of(request, assets, configuration, request.Config is null ? null : InputBytes.Read(request.Config).Sha256);
            if (stored is not null && stored.Fingerprint != plan.Fingerprint)
            {
                planDiffers = BatchPlan.Differences(stored.Configuration, plan.Configuration);
            }
        }

        var fingerprint = plan.Fingerprint;
        var rows = new BatchAssetRow[plan.Assets.Count];
        var missing = new List<string>();
        var missingWhy = new List<string>();
        // Names computed with another configuration, grouped by what differs, so a thousand names do not repeat one reason.
        var differing = new Dictionary<string, List<string>>(StringComparer.Ordinal);
        var failed = 0;
        for (var i = 0; i < plan.Assets.Count; i++)
        {
            var asset = plan.Assets[i];
            if (asset.Problem is string problem)
            {
                // The same row the batch writes for a name it cannot use; no shard computes such a name.
                rows[i] = BatchRows.Failed(asset.Name, asset.Implied is not null, problem);
                failed++;
                continue;
            }

            var folder = Path.Combine(assetsFolder, asset.Name);
            // Looking up what a run left reads no setting: the fingerprint stands for the whole configuration.
            var job = new BatchAssetJob(asset, ImpliedUnit.Infer, new BacktestSettings(), plan.Config, folder, fingerprint, Force: false)
            {
                ConfigSha256 = plan.ConfigSha256,
                Reports = plan.Reports,
                FailureFolder = Path.Combine(outputFolder, BatchRunner.FailuresFolder, asset.Name),
            };
            BatchAssetRow? row;
            try
            {
                row = asRecorded ? job.FinishedAsRecorded() : job.Finished();
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
                var what = stored is not null && record.ConfigurationFingerprint == stored.Fingerprint && planDiffers.Count > 0
                    ? string.Join(", ", planDiffers)
                    : Difference(folder, version);
                if (!differing.TryGetValue(what, out var group))
                {
                    differing[what] = group = [];
                }

                group.Add(asset.Name);
                continue;
            }

            var why = Why(folder, asset.Name);
            missing.Add(asset.Name);
            missingWhy.Add(asset.Name + " (" + why + ")");
            rows[i] = BatchRows.Failed(asset.Name, asset.Implied is not null, "not finished: " + why + "; run its shard again (a shard reruns only what is missing), then the reduce");
        }

        if (differing.Count > 0 || planDiffers.Count > 0)
        {
            var whose = request is null
                ? $"the shards' plan ({BatchPlan.FileName}: volcast {version} and the configuration recorded there)"
                : $"this reduce's (volcast {version} with the options and --config given)";
            var count = differing.Values.Sum(g => g.Count);
            var names = count > 0
                ? $"{count} names were computed with another configuration or tool version than {whose}: {string.Join("; ", differing.Select(g => string.Join(", ", g.Value) + " (" + g.Key + ")"))}. "
                : string.Empty;
            var planPart = planDiffers.Count > 0
                ? $"The options given differ from those in {planFile}, which the shards wrote: {string.Join("; ", planDiffers)}. "
                : string.Empty;
            var fix = request is null
                ? "Rerun those names' shards with the batch's options (one configuration for every shard), then the reduce."
                : "Give the reduce the same options as the shards (or only --out, to take them from the plan), or rerun those names' shards with this configuration.";
            throw new InputDataException(assetsFolder, null, null, names + planPart + fix);
        }

        var written = missing.Count == 0 || allowMissing;
        if (written)
        {
            BatchSummaryWriter.Write(outputFolder, plan, rows, missing, cancellationToken);
        }

        return new BatchReduceOutcome(rows, missingWhy, failed, written) { Reports = plan.Reports, Warnings = warnings };
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
