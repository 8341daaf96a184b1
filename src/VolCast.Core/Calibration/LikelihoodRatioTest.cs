namespace VolCast.Core.Calibration;

/// <summary>A likelihood-ratio statistic with its chi-square degrees of freedom and upper-tail p-value.</summary>
/// <param name="Statistic">LR = −2 ln(L_restricted / L_unrestricted), zero or more.</param>
/// <param name="DegreesOfFreedom">Degrees of freedom of the chi-square reference distribution.</param>
/// <param name="PValue">P(χ²_df ≥ LR).</param>
public sealed record LikelihoodRatioTest(double Statistic, int DegreesOfFreedom, double PValue);
