namespace VolCast.Core.Garch;

/// <summary>Which conditional-variance equation a fit uses.</summary>
public enum GarchVariant
{
    /// <summary>GARCH(1,1) (Bollerslev 1986): σ²ₜ = ω + α ε²ₜ₋₁ + β σ²ₜ₋₁.</summary>
    Garch,

    /// <summary>GJR-GARCH(1,1) (Glosten, Jagannathan and Runkle 1993): σ²ₜ = ω + (α + γ·1[εₜ₋₁ &lt; 0]) ε²ₜ₋₁ + β σ²ₜ₋₁.</summary>
    GjrGarch,
}
