namespace VolCast.Core.Options;

/// <summary>One rejected or flagged quote, expiry or date, with the reason in words.</summary>
/// <param name="Scope">What the diagnostic is about.</param>
/// <param name="Reason">Why.</param>
/// <param name="Date">The quote date.</param>
/// <param name="Expiry">The expiry, for quote and expiry diagnostics.</param>
/// <param name="Strike">The strike, for quote diagnostics.</param>
/// <param name="Type">The option type, for quote diagnostics.</param>
/// <param name="SourceLine">The 1-based source line of the quote, or null.</param>
/// <param name="Detail">A sentence with the numbers involved (invariant culture).</param>
public sealed record ChainDiagnostic(
    DiagnosticScope Scope,
    DiagnosticReason Reason,
    DateOnly Date,
    DateOnly? Expiry,
    double? Strike,
    OptionType? Type,
    int? SourceLine,
    string Detail)
{
    /// <summary>Gets whether this only flags a value that was still produced, rather than rejecting something.</summary>
    public bool IsWarning => Reason is DiagnosticReason.Extrapolated or DiagnosticReason.DecreasingTotalVariance;
}
