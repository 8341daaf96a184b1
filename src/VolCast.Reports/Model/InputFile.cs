namespace VolCast.Reports.Model;

/// <summary>An input file, identified so the report can be traced and re-run.</summary>
/// <param name="Role">What the file is, e.g. <c>prices</c> or <c>implied</c>.</param>
/// <param name="Path">The path as the user gave it.</param>
/// <param name="Sha256">Lowercase hexadecimal SHA-256 of its bytes.</param>
internal sealed record InputFile(string Role, string Path, string Sha256);
