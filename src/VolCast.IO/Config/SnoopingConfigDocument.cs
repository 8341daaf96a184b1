namespace VolCast.IO.Config;

/// <summary>The <c>snooping</c> section of a configuration file: the bootstrap of the data-snooping tests.</summary>
internal sealed class SnoopingConfigDocument
{
    public int? Replications { get; set; }

    public int? BlockLength { get; set; }

    public int? Seed { get; set; }
}
