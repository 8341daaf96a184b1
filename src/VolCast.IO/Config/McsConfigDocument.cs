namespace VolCast.IO.Config;

/// <summary>The <c>mcs</c> section of a configuration file.</summary>
internal sealed class McsConfigDocument
{
    public int? Replications { get; set; }

    public double? Alpha { get; set; }

    public int? BlockLength { get; set; }

    public int? Seed { get; set; }
}
