namespace VolCast.Reports.Model;

/// <summary>One resolved setting of the run, e.g. <c>horizon</c> = <c>21 trading days</c>.</summary>
/// <param name="Name">The setting's name.</param>
/// <param name="Value">Its value as text, with its unit.</param>
public sealed record Setting(string Name, string Value);
