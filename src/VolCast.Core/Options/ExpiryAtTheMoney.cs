namespace VolCast.Core.Options;

/// <summary>The at-the-money implied volatility of one expiry on one date.</summary>
/// <param name="Date">The quote date.</param>
/// <param name="Expiry">The expiry date.</param>
/// <param name="Years">Time to expiry, ACT/365.</param>
/// <param name="Forward">The forward price used for every quote of the expiry.</param>
/// <param name="ForwardSource">Where the forward came from.</param>
/// <param name="Volatility">The at-the-money implied volatility (decimal), linear in σ between the two strikes around the forward.</param>
/// <param name="LowerStrike">The strike at or below the forward that was used.</param>
/// <param name="UpperStrike">The strike at or above the forward that was used.</param>
public sealed record ExpiryAtTheMoney(
    DateOnly Date,
    DateOnly Expiry,
    double Years,
    double Forward,
    ForwardSource ForwardSource,
    double Volatility,
    double LowerStrike,
    double UpperStrike)
{
    /// <summary>Gets the total implied variance σ²T.</summary>
    public double TotalVariance => Volatility * Volatility * Years;
}
