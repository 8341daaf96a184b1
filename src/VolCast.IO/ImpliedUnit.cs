using System.Diagnostics.CodeAnalysis;

namespace VolCast.IO;

/// <summary>The unit the values of an implied-volatility file are written in.</summary>
public enum ImpliedUnit
{
    /// <summary>Not declared: inferred from the values (a median above 1.5 means percent), with a warning.</summary>
    Infer = 0,

    /// <summary>Percent: 20 means 20% (0.20 as a decimal).</summary>
    Percent = 1,

    /// <summary>Decimal: 0.20 means 20%.</summary>
    [SuppressMessage("Naming", "CA1720:Identifier contains type name", Justification = "The unit is called decimal in the command line (--iv-unit decimal) and the pinned API.")]
    Decimal = 2,
}
