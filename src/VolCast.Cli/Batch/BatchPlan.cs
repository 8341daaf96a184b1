using System.Globalization;
using System.Text;
using System.Text.Encodings.Web;
using System.Text.Json;
using VolCast.IO;

namespace VolCast.Cli.Batch;

/// <summary>
/// What a batch sets out to do, kept at the top of its output folder as <c>batch-plan.json</c>: the tool version, the
/// input folders and configuration file as given, the resolved configuration (the text its fingerprint hashes), which
/// report pages are drawn, and every name with its input files. Written by every shard and by a single-process batch before
/// anything is computed, atomically and with the same bytes from every shard of one batch (nothing in it depends on the shard,
/// the time or the machine), so shards writing at once cannot conflict. A reduce given nothing but the output folder reads
/// it to know the names, the configuration and the tool version; a reduce given options checks them against it.
/// </summary>
/// <param name="Version">The tool version, as run.json and the summary page show it.</param>
/// <param name="PricesFolder">The prices folder, as given.</param>
/// <param name="ImpliedFolder">The implied folder, as given, or null.</param>
/// <param name="Config">The configuration file, as given, or null.</param>
/// <param name="ConfigSha256">The configuration file's SHA-256, or null without one.</param>
/// <param name="Reports">Which report pages are drawn.</param>
/// <param name="Horizon">The horizon as the summary page shows it, such as <c>21 trading days</c>.</param>
/// <param name="Configuration">The resolved configuration as <see cref="BatchFingerprint.Text"/> writes it.</param>
/// <param name="Assets">Every name of the batch, in name order, with its files and, for a name that cannot be used, why.</param>
internal sealed record BatchPlan(
    string Version,
    string PricesFolder,
    string? ImpliedFolder,
    string? Config,
    string? ConfigSha256,
    BatchReports Reports,
    string Horizon,
    string Configuration,
    IReadOnlyList<BatchAsset> Assets)
{
    /// <summary>The plan's file name in the batch's output folder.</summary>
    public const string FileName = "batch-plan.json";

    private static readonly JsonWriterOptions WriterOptions = new() { Indented = true, Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping };

    /// <summary>Gets the configuration's fingerprint, the one each name's batch.json records.</summary>
    public string Fingerprint => BatchFingerprint.Hash(Configuration);

    /// <summary>The plan of a request over its assets.</summary>
    /// <param name="request">The batch's request.</param>
    /// <param name="assets">Its assets, every one (not only a shard's).</param>
    /// <param name="configuration">The canonical text of the resolved configuration.</param>
    /// <param name="configSha256">The configuration file's SHA-256, or null.</param>
    public static BatchPlan Of(BatchRequest request, IReadOnlyList<BatchAsset> assets, string configuration, string? configSha256)
    {
        ArgumentNullException.ThrowIfNull(request);
        var s = request.Settings;
        var horizon = s.Horizon.TradingDays is int h ? h.ToString(CultureInfo.InvariantCulture) + " trading days" : s.Horizon.ToString();
        return new BatchPlan(BacktestPipeline.ToolVersion(), request.PricesFolder, request.ImpliedFolder, request.Config, configSha256, request.Reports, horizon, configuration, assets);
    }

    /// <summary>The settings whose values differ between two canonical texts, in words: <c>key: A in the shards' plan, B here</c>.</summary>
    /// <param name="planned">The plan's configuration text.</param>
    /// <param name="given">The configuration text of the options given.</param>
    public static IReadOnlyList<string> Differences(string planned, string given)
    {
        var ours = Lines(planned).ToDictionary(StringComparer.Ordinal);
        var theirs = Lines(given).ToDictionary(StringComparer.Ordinal);
        var keys = Lines(planned).Concat(Lines(given)).Select(p => p.Key).Distinct(StringComparer.Ordinal);
        return [.. keys
            .Where(k => !string.Equals(ours.GetValueOrDefault(k), theirs.GetValueOrDefault(k), StringComparison.Ordinal))
            .Select(k => $"{k}: {Shown(ours.GetValueOrDefault(k))} in the shards' plan, {Shown(theirs.GetValueOrDefault(k))} here")];

        static string Shown(string? value) => string.IsNullOrEmpty(value) ? "(not set)" : value;
    }

    /// <summary>
    /// Writes the plan into the output folder atomically, replacing an older one, and removes what a shard killed while
    /// writing it left behind: temporary plan files (<c>.batch-plan.json.*.tmp</c>) older than
    /// <see cref="StaleTemporaryAge"/>. A younger one may be another shard's write in progress and is left alone.
    /// </summary>
    /// <param name="outputFolder">The batch's output folder.</param>
    /// <exception cref="IOException">The plan cannot be written and no identical plan is there.</exception>
    public void Write(string outputFolder)
    {
        var text = Serialize();
        var path = Path.Combine(outputFolder, FileName);
        RemoveStaleTemporaries(outputFolder, DateTime.UtcNow);
        try
        {
            AtomicFile.WriteTextInSharedFolder(path, w => w.Write(text), overwrite: true);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            // Another shard of the same batch may be replacing it at this moment (a file system that refuses to move over a
            // file in use); the same bytes are then there, which is all that matters.
            if (!File.Exists(path) || !string.Equals(File.ReadAllText(path), text, StringComparison.Ordinal))
            {
                throw;
            }
        }
    }

    /// <summary>How old a temporary plan file must be before a later run removes it: a plan is written in milliseconds.</summary>
    internal static readonly TimeSpan StaleTemporaryAge = TimeSpan.FromMinutes(10);

    /// <summary>Removes temporary plan files last written more than <see cref="StaleTemporaryAge"/> before <paramref name="now"/>.</summary>
    internal static void RemoveStaleTemporaries(string outputFolder, DateTime now)
    {
        if (!Directory.Exists(outputFolder))
        {
            return;
        }

        foreach (var file in Directory.EnumerateFiles(outputFolder, "." + FileName + ".*.tmp"))
        {
            if (!TemporaryName.TryParse(Path.GetFileName(file), out var target, out _, out _) || target != FileName)
            {
                continue;
            }

            try
            {
                if (now - File.GetLastWriteTimeUtc(file) > StaleTemporaryAge)
                {
                    File.Delete(file);
                }
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                // Removed by another run at the same moment, or not ours to remove: it is never read either way.
            }
        }
    }

    /// <summary>Reads the plan from an output folder, or returns null when the folder holds none.</summary>
    /// <param name="outputFolder">The batch's output folder.</param>
    /// <exception cref="InputDataException">The plan is there but damaged or not a plan.</exception>
    public static BatchPlan? TryRead(string outputFolder)
    {
        var path = Path.Combine(outputFolder, FileName);
        if (!File.Exists(path))
        {
            return null;
        }

        try
        {
            using var doc = JsonDocument.Parse(File.ReadAllBytes(path));
            var root = doc.RootElement;
            var configuration = new StringBuilder();
            foreach (var p in root.GetProperty("configuration").EnumerateObject())
            {
                configuration.Append(p.Name).Append('=').Append(p.Value.GetString()).Append('\n');
            }

            var text = configuration.ToString();
            if (!string.Equals(BatchFingerprint.Hash(text), root.GetProperty("configuration_sha256").GetString(), StringComparison.Ordinal))
            {
                throw Damaged(path, "its configuration does not match its configuration_sha256, so it was edited by hand or cut short");
            }

            var prices = Text(root, "prices_folder") ?? throw Damaged(path, "prices_folder is missing");
            var implied = Text(root, "implied_folder");
            var assets = new List<BatchAsset>();
            foreach (var e in root.GetProperty("names").EnumerateArray())
            {
                var name = Text(e, "name") ?? throw Damaged(path, "a name is missing");
                var problem = Text(e, "problem");
                var pricesFile = Text(e, "prices") ?? throw Damaged(path, $"{name} has no prices file");
                var impliedFile = Text(e, "implied");
                // A name or file name that would reach outside its folders is refused, whoever wrote the plan.
                if ((problem is null && BatchAsset.NameProblem(name) is not null) || !Plain(pricesFile) || (impliedFile is not null && (implied is null || !Plain(impliedFile))))
                {
                    throw Damaged(path, $"the name or file names of {BatchAsset.Quote(name)} are not ones a batch writes");
                }

                assets.Add(new BatchAsset(name, Path.Combine(prices, pricesFile), impliedFile is null ? null : Path.Combine(implied!, impliedFile), problem));
            }

            var reports = Text(root, "reports") switch
            {
                "full" => BatchReports.Full,
                "summary" => BatchReports.Summary,
                "none" => BatchReports.None,
                var other => throw Damaged(path, $"reports is {other ?? "missing"}, expected full, summary or none"),
            };
            return new BatchPlan(
                Text(root, "version") ?? throw Damaged(path, "version is missing"),
                prices,
                implied,
                Text(root, "config"),
                Text(root, "config_sha256"),
                reports,
                Text(root, "horizon") ?? throw Damaged(path, "horizon is missing"),
                text,
                assets);
        }
        catch (Exception ex) when (ex is JsonException or KeyNotFoundException or InvalidOperationException or FormatException)
        {
            throw Damaged(path, "it is not the JSON a batch writes (" + ex.Message + ")");
        }
    }

    private string Serialize()
    {
        using var stream = new MemoryStream();
        using (var json = new Utf8JsonWriter(stream, WriterOptions))
        {
            json.WriteStartObject();
            json.WriteString("version", Version);
            json.WriteString("prices_folder", PricesFolder);
            json.WriteString("implied_folder", ImpliedFolder);
            json.WriteString("config", Config);
            json.WriteString("config_sha256", ConfigSha256);
            json.WriteString("reports", Reports switch { BatchReports.Summary => "summary", BatchReports.None => "none", _ => "full" });
            json.WriteString("horizon", Horizon);
            json.WriteString("configuration_sha256", Fingerprint);
            json.WriteStartObject("configuration");
            foreach (var (key, value) in Lines(Configuration))
            {
                json.WriteString(key, value);
            }

            json.WriteEndObject();
            json.WriteStartArray("names");
            foreach (var a in Assets)
            {
                json.WriteStartObject();
                json.WriteString("name", a.Name);
                json.WriteString("prices", Path.GetFileName(a.Prices));
                json.WriteString("implied", a.Implied is null ? null : Path.GetFileName(a.Implied));
                json.WriteString("problem", a.Problem);
                json.WriteEndObject();
            }

            json.WriteEndArray();
            json.WriteEndObject();
        }

        return Encoding.UTF8.GetString(stream.ToArray()).Replace("\r\n", "\n", StringComparison.Ordinal) + "\n";
    }

    /// <summary>The <c>key=value</c> lines of a canonical text, in their order.</summary>
    private static List<KeyValuePair<string, string>> Lines(string text) =>
        [.. text.Split('\n', StringSplitOptions.RemoveEmptyEntries).Select(line =>
        {
            var eq = line.IndexOf('=', StringComparison.Ordinal);
            return new KeyValuePair<string, string>(line[..eq], line[(eq + 1)..]);
        })];

    private static bool Plain(string file) =>
        file.Length > 0 && string.Equals(Path.GetFileName(file), file, StringComparison.Ordinal) && file is not "." and not ".."
        && file.IndexOfAny(['/', '\\']) < 0;

    private static string? Text(JsonElement e, string name) =>
        e.TryGetProperty(name, out var v) && v.ValueKind != JsonValueKind.Null ? v.GetString() : null;

    private static InputDataException Damaged(string path, string why) =>
        new(path, null, null, $"the batch plan cannot be used: {why}. Run any shard of the batch again to rewrite it (it computes only what is missing), or give the reduce the shards' options (--prices-dir and the rest).");
}
