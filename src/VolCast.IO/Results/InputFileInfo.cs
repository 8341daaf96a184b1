namespace VolCast.IO.Results;

/// <summary>One input file of a run, for run.json: what it was, where, and its SHA-256 so the run can be traced.</summary>
/// <param name="Role">What the file was, for example <c>prices</c>, <c>implied</c> or <c>config</c>.</param>
/// <param name="Path">The path as given.</param>
/// <param name="Sha256">The SHA-256 of the file's bytes, lowercase hex (from <see cref="PriceLoad.Sha256"/> and <see cref="ImpliedLoad.Sha256"/>).</param>
public sealed record InputFileInfo(string Role, string Path, string Sha256);
