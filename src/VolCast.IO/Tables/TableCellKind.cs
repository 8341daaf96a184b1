namespace VolCast.IO.Tables;

/// <summary>What a <see cref="TableCell"/> holds.</summary>
public enum TableCellKind
{
    /// <summary>A real number.</summary>
    Number,

    /// <summary>A whole number (a count).</summary>
    Count,

    /// <summary>Text.</summary>
    Text,

    /// <summary>Yes or no.</summary>
    Flag,
}
