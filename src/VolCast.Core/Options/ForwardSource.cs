namespace VolCast.Core.Options;

/// <summary>Where the forward price of an expiry came from.</summary>
public enum ForwardSource
{
    /// <summary>Put-call parity at the strike where a call and a put were both quoted and closest in price: F = K + e^{rT}(C − P).</summary>
    PutCallParity,

    /// <summary>The carry model F = S e^{(r − q)T}, used when no strike has both a call and a put.</summary>
    RateAndDividendYield,
}
