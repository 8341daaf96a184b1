namespace VolCast.Core.Options;

/// <summary>The constant-tenor at-the-money implied volatility of one date.</summary>
/// <param name="Date">The quote date.</param>
/// <param name="Volatility">The implied volatility (decimal) at the tenor.</param>
/// <param name="NearExpiry">The expiry at or before the tenor that was used.</param>
/// <param name="FarExpiry">The expiry at or after the tenor that was used (equal to <paramref name="NearExpiry"/> when one expiry sufficed).</param>
/// <param name="IsExtrapolated">Whether the value was extrapolated flat beyond the quoted expiries.</param>
public readonly record struct ConstantTenorPoint(DateOnly Date, double Volatility, DateOnly NearExpiry, DateOnly FarExpiry, bool IsExtrapolated);
