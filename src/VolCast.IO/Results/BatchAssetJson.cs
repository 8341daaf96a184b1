using System.Collections.Immutable;
using System.Text;
using System.Text.Json;

namespace VolCast.IO.Results;

/// <summary>Reads and writes an asset's batch.json (<see cref="BatchAssetRecord"/>) and reads the input hashes recorded in its run.json.</summary>
public static class BatchAssetJson
{
    /// <summary>The file name of the record in an asset's folder.</summary>
    public const string FileName = "batch.json";

    /// <summary>Writes the record atomically into the asset's folder, replacing an older one.</summary>
    /// <param name="folder">The asset's results folder.</param>
    /// <param name="record">The record.</param>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    public static void Write(string folder, BatchAssetRecord record)
    {
        ArgumentNullException.ThrowIfNull(folder);
        ArgumentNullException.ThrowIfNull(record);
        AtomicFile.WriteText(Path.Combine(folder, FileName), w => w.Write(Serialize(record)), overwrite: true);
    }

    /// <summary>Reads the record, or returns null when it is missing or unreadable (the asset is then run again).</summary>
    /// <param name="folder">The asset's results folder.</param>
    /// <returns>The record, or null.</returns>
    public static BatchAssetRecord? TryRead(string folder)
    {
        ArgumentNullException.ThrowIfNull(folder);
        var path = Path.Combine(folder, FileName);
        if (!File.Exists(path))
        {
            return null;
        }

        try
        {
            using var doc = JsonDocument.Parse(File.ReadAllBytes(path));
            var root = doc.RootElement;
            var hashes = ImmutableSortedDictionary.CreateBuilder<string, string>(StringComparer.Ordinal);
            foreach (var p in root.GetProperty("inputs").EnumerateObject())
            {
                hashes[p.Name] = p.Value.GetString()!;
            }

            var r = root.GetProperty("row");
            var row = new BatchAssetRow
            {
                Name = r.GetProperty("name").GetString()!,
                Succeeded = r.GetProperty("succeeded").GetBoolean(),
                HasImplied = r.GetProperty("has_implied").GetBoolean(),
                Dates = Int(r, "n"),
                BestQlike = Str(r, "best_qlike"),
                BestQlikeValue = Num(r, "best_qlike_value"),
                BestDmStatistic = Num(r, "best_dm_qlike_stat"),
                BestDmPValue = Num(r, "best_dm_qlike_p"),
                McsMembers = [.. r.GetProperty("mcs").EnumerateArray().Select(e => e.GetString()!)],
                Lookbacks = [.. r.GetProperty("lookbacks").EnumerateArray().Select(e => new BatchLookback(
                    e.GetProperty("family").GetString()!, e.GetProperty("most_chosen").GetString()!, e.GetProperty("share").GetDouble(), e.GetProperty("changes").GetInt32()))],
                MeanPremium = Num(r, "mean_iv_minus_rv_vol"),
                VersusImplied = [.. r.GetProperty("versus_implied").EnumerateArray().Select(e => new BatchForecasterTest(
                    e.GetProperty("forecaster").GetString()!, e.GetProperty("dm_qlike_stat").GetDouble(), e.GetProperty("dm_qlike_p").GetDouble()))],
                Error = Str(r, "error"),
            };
            return new BatchAssetRecord(hashes.ToImmutable(), root.GetProperty("configuration_sha256").GetString()!, row);
        }
        catch (Exception ex) when (ex is JsonException or KeyNotFoundException or InvalidOperationException or FormatException)
        {
            return null;
        }
    }

    /// <summary>Reads the role-to-SHA-256 map of the inputs recorded in an asset's run.json, or null when it is missing or unreadable.</summary>
    /// <param name="folder">The asset's results folder.</param>
    /// <returns>The hashes, or null.</returns>
    public static ImmutableSortedDictionary<string, string>? TryReadRunInputs(string folder)
    {
        ArgumentNullException.ThrowIfNull(folder);
        var path = Path.Combine(folder, "run.json");
        if (!File.Exists(path))
        {
            return null;
        }

        try
        {
            using var doc = JsonDocument.Parse(File.ReadAllBytes(path));
            var hashes = ImmutableSortedDictionary.CreateBuilder<string, string>(StringComparer.Ordinal);
            foreach (var input in doc.RootElement.GetProperty("inputs").EnumerateArray())
            {
                hashes[input.GetProperty("role").GetString()!] = input.GetProperty("sha256").GetString()!;
            }

            return hashes.ToImmutable();
        }
        catch (Exception ex) when (ex is JsonException or KeyNotFoundException or InvalidOperationException)
        {
            return null;
        }
    }

    private static string Serialize(BatchAssetRecord record)
    {
        using var stream = new MemoryStream();
        using (var json = new Utf8JsonWriter(stream, JsonText.Options))
        {
            json.WriteStartObject();
            json.WriteString("configuration_sha256", record.ConfigurationFingerprint);
            json.WriteStartObject("inputs");
            foreach (var (role, sha) in record.InputHashes)
            {
                json.WriteString(role, sha);
            }

            json.WriteEndObject();
            var r = record.Row;
            json.WriteStartObject("row");
            json.WriteString("name", r.Name);
            json.WriteBoolean("succeeded", r.Succeeded);
            json.WriteBoolean("has_implied", r.HasImplied);
            Numbers.Write(json, "n", r.Dates);
            Numbers.Write(json, "best_qlike", r.BestQlike);
            Numbers.Write(json, "best_qlike_value", r.BestQlikeValue);
            Numbers.Write(json, "best_dm_qlike_stat", r.BestDmStatistic);
            Numbers.Write(json, "best_dm_qlike_p", r.BestDmPValue);
            json.WriteStartArray("mcs");
            foreach (var m in r.McsMembers)
            {
                json.WriteStringValue(m);
            }

            json.WriteEndArray();
            json.WriteStartArray("lookbacks");
            foreach (var l in r.Lookbacks)
            {
                json.WriteStartObject();
                json.WriteString("family", l.Family);
                json.WriteString("most_chosen", l.MostChosen);
                json.WriteNumber("share", l.Share);
                json.WriteNumber("changes", l.Changes);
                json.WriteEndObject();
            }

            json.WriteEndArray();
            Numbers.Write(json, "mean_iv_minus_rv_vol", r.MeanPremium);
            json.WriteStartArray("versus_implied");
            foreach (var t in r.VersusImplied)
            {
                json.WriteStartObject();
                json.WriteString("forecaster", t.Spec);
                json.WriteNumber("dm_qlike_stat", t.Statistic);
                json.WriteNumber("dm_qlike_p", t.PValue);
                json.WriteEndObject();
            }

            json.WriteEndArray();
            Numbers.Write(json, "error", r.Error);
            json.WriteEndObject();
            json.WriteEndObject();
        }

        return Encoding.UTF8.GetString(stream.ToArray()).Replace("\r\n", "\n", StringComparison.Ordinal) + "\n";
    }

    private static string? Str(JsonElement e, string name) => e.GetProperty(name).ValueKind == JsonValueKind.Null ? null : e.GetProperty(name).GetString();

    private static double? Num(JsonElement e, string name) => e.GetProperty(name).ValueKind == JsonValueKind.Null ? null : e.GetProperty(name).GetDouble();

    private static int? Int(JsonElement e, string name) => e.GetProperty(name).ValueKind == JsonValueKind.Null ? null : e.GetProperty(name).GetInt32();
}
