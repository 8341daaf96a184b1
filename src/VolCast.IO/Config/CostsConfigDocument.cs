namespace VolCast.IO.Config;

/// <summary>The <c>costs</c> section of a configuration file: the trading costs of the rule's trades.</summary>
internal sealed class CostsConfigDocument
{
    public double? OptionHalfSpreadVolPoints { get; set; }

    public double? HedgeCostBps { get; set; }
}
