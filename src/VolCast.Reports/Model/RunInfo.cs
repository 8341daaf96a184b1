namespace VolCast.Reports.Model;

/// <summary>How the report was made: tool version, when, how long, the settings and the inputs.</summary>
/// <param name="ToolVersion">The version of VolCast that made the report.</param>
/// <param name="StartedAt">When the run started (shown in UTC).</param>
/// <param name="Elapsed">How long the run took.</param>
/// <param name="Settings">The resolved settings, in the order to show them.</param>
/// <param name="Inputs">The input files with their SHA-256.</param>
internal sealed record RunInfo(string ToolVersion, DateTimeOffset StartedAt, TimeSpan Elapsed, IReadOnlyList<Setting> Settings, IReadOnlyList<InputFile> Inputs);
