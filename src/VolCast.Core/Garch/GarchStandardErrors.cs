namespace VolCast.Core.Garch;

/// <summary>Standard errors of fitted GARCH parameters, in the same units as the parameters.</summary>
/// <param name="Mu">Of μ, or null when the mean is fixed at zero.</param>
/// <param name="Omega">Of ω.</param>
/// <param name="Alpha">Of α.</param>
/// <param name="Beta">Of β.</param>
/// <param name="Gamma">Of γ, or null for plain GARCH.</param>
public sealed record GarchStandardErrors(double? Mu, double Omega, double Alpha, double Beta, double? Gamma);
