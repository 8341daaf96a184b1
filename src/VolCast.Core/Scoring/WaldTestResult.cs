namespace VolCast.Core.Scoring;

/// <summary>A Wald test of joint linear restrictions on regression coefficients, with its χ² p-value.</summary>
/// <param name="Statistic">W = (Rβ̂ − r)′ (R V̂ R′)⁻¹ (Rβ̂ − r), with V̂ the HAC covariance.</param>
/// <param name="DegreesOfFreedom">Number of restrictions q.</param>
/// <param name="PValue">P(χ²(q) ≥ W), the asymptotic p-value.</param>
public readonly record struct WaldTestResult(double Statistic, int DegreesOfFreedom, double PValue);
