namespace VolCast.Reports.Model;

/// <summary>How strongly a test rejects its null hypothesis, shown as stars beside a number.</summary>
internal enum Significance
{
    /// <summary>Not tested, or not significant at 10%.</summary>
    None,

    /// <summary>Significant at 10% (p &lt; 0.10): one star.</summary>
    TenPercent,

    /// <summary>Significant at 5% (p &lt; 0.05): two stars.</summary>
    FivePercent,

    /// <summary>Significant at 1% (p &lt; 0.01): three stars.</summary>
    OnePercent,
}
