namespace VolCast.Core.Scoring;

/// <summary>One forecaster's line in the cross-asset table: on how many names it beats implied on QLIKE, before and after the Benjamini-Hochberg correction.</summary>
/// <param name="Spec">The forecaster's spec.</param>
/// <param name="NamesTested">Names with a Diebold-Mariano test against implied for this forecaster.</param>
/// <param name="BeatsUncorrected">Names where the statistic is negative and the raw two-sided p-value is at most the level.</param>
/// <param name="BeatsAfterFdr">Names where the statistic is negative and the Benjamini-Hochberg adjusted p-value is at most the level.</param>
/// <param name="LosesAfterFdr">Names where the statistic is positive (implied better) and the adjusted p-value is at most the level.</param>
public sealed record VersusImpliedFdrRow(string Spec, int NamesTested, int BeatsUncorrected, int BeatsAfterFdr, int LosesAfterFdr)
{
    /// <summary>Gets the share of tested names where the forecaster beats implied after the correction, 0 to 1; null when none was tested.</summary>
    public double? ShareBeatsAfterFdr => NamesTested == 0 ? null : (double)BeatsAfterFdr / NamesTested;
}
