using System.Collections.Immutable;

namespace VolCast.IO.Results;

/// <summary>
/// What a batch writes into an asset's results folder once the folder is complete (batch.json): the content hashes of
/// the inputs, a fingerprint of the resolved configuration, and the summary row. Written last, so its presence
/// marks the folder as finished.
/// </summary>
/// <param name="InputHashes">Role (<c>prices</c>, <c>implied</c>) to SHA-256 of the file's bytes, lowercase hex.</param>
/// <param name="ConfigurationFingerprint">SHA-256 of the resolved settings, implied unit and tool version.</param>
/// <param name="Row">The asset's summary row.</param>
public sealed record BatchAssetRecord(
    ImmutableSortedDictionary<string, string> InputHashes,
    string ConfigurationFingerprint,
    BatchAssetRow Row);
