namespace VolCast.Core.Options;

/// <summary>What a diagnostic is about.</summary>
public enum DiagnosticScope
{
    /// <summary>One quote.</summary>
    Quote,

    /// <summary>All quotes of one expiry on one date.</summary>
    Expiry,

    /// <summary>A whole quote date.</summary>
    Date,
}
